import { z } from "zod";
import { parsePastedRows } from "@/components/library/paste-rows";
import { quantity } from "@/lib/library/part-schema";
import { projectSchema } from "@/lib/projects/schema";

// The schema that checks the project form's values (project-form-values.ts) and turns them into the request body.
// It holds zod: the form loads it when it first validates, so zod is not in the form pages' first load.

const termsSchema = z
  .array(z.object({ r: quantity("K/W"), tau: quantity("s") }))
  .max(8, { message: "At most 8 terms" });

/** The case path's terms as typed, or the first problem with them. */
export function caseTerms(text: string) {
  const rows = parsePastedRows(text);
  const parsed = termsSchema.safeParse(rows);
  if (parsed.success) return { terms: parsed.data, error: null };
  const issue = parsed.error.issues[0];
  const line = typeof issue.path[0] === "number" ? `Term ${issue.path[0] + 1}` : "Terms";
  return { terms: null, error: `${line}: ${issue.message}` };
}

export const projectFormSchema = z
  .object({
    name: z.string(),
    description: z.string(),
    caseTemp: z.string(),
    utilisationLimit: z.string(),
    tjGuard: z.string(),
    voltageLimit: z.string(),
    betweenCurves: z.enum(["loglog", "next-longer", "thermal"]),
    ownerId: z.string(),
    caseNetwork: z.string(),
    applyCaseNetwork: z.boolean(),
  })
  .superRefine((f, ctx) => {
    const network = caseTerms(f.caseNetwork);
    if (network.error) ctx.addIssue({ code: "custom", path: ["caseNetwork"], message: network.error });
    else if (f.applyCaseNetwork && !network.terms?.length) {
      ctx.addIssue({
        code: "custom",
        path: ["caseNetwork"],
        message: "Give the terms, or do not apply the path",
      });
    }
    for (const key of ["utilisationLimit", "voltageLimit"] as const) {
      const percent = percentOf(f[key]);
      if (!(percent > 0 && percent <= 100)) {
        ctx.addIssue({ code: "custom", path: [key], message: "A percentage above 0 and at most 100" });
      }
    }
    const guard = Number(f.tjGuard);
    if (f.tjGuard.trim() === "" || !(guard >= 0 && guard <= 200)) {
      ctx.addIssue({ code: "custom", path: ["tjGuard"], message: "Kelvin from 0 to 200" });
    }
  })
  .transform((f): z.input<typeof projectSchema> => {
    return {
      ...f,
      utilisationLimit: percentOf(f.utilisationLimit) / 100,
      voltageLimit: percentOf(f.voltageLimit) / 100,
      tjGuard: f.tjGuard.trim() === "" ? Number.NaN : Number(f.tjGuard),
      ownerId: f.ownerId === "" ? null : f.ownerId,
      caseNetwork: caseTerms(f.caseNetwork).terms?.length ? parsePastedRows(f.caseNetwork) : null,
      applyCaseNetwork: f.applyCaseNetwork,
    };
  })
  .pipe(projectSchema);

/** A percentage as typed ("80", "80 %", "80,5"); NaN when empty or not a number. */
function percentOf(text: string): number {
  const trimmed = text.replace("%", "").replace(",", ".").trim();
  return trimmed === "" ? Number.NaN : Number(trimmed);
}
