import { z } from "zod";
import { getActiveCurveSet } from "@/db/queries/parts";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { fieldErrorsOf, json } from "@/lib/http";
import { computeLimits } from "@/lib/library/limits";
import { loadPart } from "@/lib/library/parts";
import { parseQuantity } from "@/lib/soa/units";

const limitsQuery = z.object({
  caseTemp: z.coerce.number().finite().min(-55).max(400).default(25),
  width: z
    .string()
    .optional()
    .transform((text, ctx) => {
      if (!text) return undefined;
      const parsed = parseQuantity(text, "s");
      if (!parsed.ok || typeof parsed.value !== "number" || !(parsed.value > 0)) {
        ctx.addIssue({ code: "custom", message: parsed.ok ? "Width must be > 0" : parsed.reason });
        return z.NEVER;
      }
      return parsed.value;
    }),
  policy: z.enum(["loglog", "next-longer", "thermal"]).default("loglog"),
});

/**
 * GET /api/parts/:id/limits?caseTemp=…&width=…&policy=…: the active curves, derated for the case temperature, and
 * the line for any pulse width, all computed by the engine on the server.
 */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const parsed = limitsQuery.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!parsed.success) {
    throw new AppError("invalid:query", "Invalid limits query.", {
      details: { fieldErrors: fieldErrorsOf(parsed.error) },
    });
  }
  const set = await getActiveCurveSet({ partId: part.id });
  if (!set) throw new AppError("not_found:curve-set", "This part has no SOA curves yet.");
  const limits = computeLimits(
    { refCaseTemp: set.refCaseTemp, curves: set.curves },
    { tjMax: part.tjMax, foster: part.foster, transfer: part.transfer },
    parsed.data,
  );
  return json({ ...limits, findings: set.findings });
});
