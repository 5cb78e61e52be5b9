"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, SelectField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { TextAreaField, UnitField } from "@/components/library/fields";
import { parsePastedRows } from "@/components/library/paste-rows";
import { Sym } from "@/components/library/symbols";
import { quantity } from "@/lib/library/part-schema";
import { projectSchema } from "@/lib/projects/schema";
import { invalidateProject } from "./api";
import { CasePathPreview } from "./case-path-preview";

export interface ProjectFormValues {
  name: string;
  description: string;
  caseTemp: string;
  /** In percent on the form; the schema takes a fraction. */
  utilisationLimit: string;
  tjGuard: string;
  /** In percent of V_DSS on the form; the schema takes a fraction. */
  voltageLimit: string;
  betweenCurves: "loglog" | "next-longer" | "thermal";
  ownerId: string;
  /** The case path's Foster terms as typed or pasted: one "R τ" per line. */
  caseNetwork: string;
  applyCaseNetwork: boolean;
}

export const emptyProject: ProjectFormValues = {
  name: "",
  description: "",
  caseTemp: "25",
  utilisationLimit: "80",
  tjGuard: "25",
  voltageLimit: "80",
  betweenCurves: "loglog",
  ownerId: "",
  caseNetwork: "",
  applyCaseNetwork: false,
};

const termsSchema = z
  .array(z.object({ r: quantity("K/W"), tau: quantity("s") }))
  .max(8, { message: "At most 8 terms" });

/** The case path's terms as typed, or the first problem with them. */
function caseTerms(text: string) {
  const rows = parsePastedRows(text);
  const parsed = termsSchema.safeParse(rows);
  if (parsed.success) return { terms: parsed.data, error: null };
  const issue = parsed.error.issues[0];
  const line = typeof issue.path[0] === "number" ? `Term ${issue.path[0] + 1}` : "Terms";
  return { terms: null, error: `${line}: ${issue.message}` };
}

const formSchema = z
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

const fields = Object.keys(emptyProject) as (keyof ProjectFormValues)[];

/** A percentage as typed ("80", "80 %", "80,5"); NaN when empty or not a number. */
function percentOf(text: string): number {
  const trimmed = text.replace("%", "").replace(",", ".").trim();
  return trimmed === "" ? Number.NaN : Number(trimmed);
}

export interface OwnerChoice {
  id: string;
  name: string;
  role: string;
}

/**
 * A project's settings: new (POST /api/projects) or edited (PATCH /api/projects/:id). The margin policy is the
 * utilisation limit in percent, the junction guard in kelvin below T_j,max, and how to read between curves.
 */
export function ProjectForm({
  projectId,
  defaults,
  owners,
}: {
  projectId?: string;
  defaults: ProjectFormValues;
  owners: OwnerChoice[];
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [navigating, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<ProjectFormValues, unknown, z.output<typeof formSchema>>({
    resolver: zodResolver(formSchema),
    defaultValues: defaults,
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { project } = projectId
        ? await sendJson<{ project: { id: string } }>("PATCH", `/api/projects/${projectId}`, values)
        : await sendJson<{ project: { id: string } }>("POST", "/api/projects", values);
      await invalidateProject(queryClient, project.id);
      startTransition(() => {
        router.push(`/projects/${project.id}`);
        router.refresh();
      });
    } catch (error) {
      applyServerErrors(error, setError, fields);
    }
  });

  const err = (name: keyof ProjectFormValues) => errors[name]?.message as string | undefined;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6 rounded-md border border-line bg-panel p-5">
      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-3 text-sm font-semibold">The design under review</legend>
        <UnitField
          id="project-name"
          label="Name"
          placeholder="48 V battery disconnect, rev B"
          error={err("name")}
          {...register("name")}
        />
        <SelectField
          id="project-owner"
          label="Owner"
          hint="Receives an e-mail when a measured pulse or capture fails."
          error={err("ownerId")}
          {...register("ownerId")}
        >
          {projectId ? <option value="">No owner</option> : <option value="">Me</option>}
          {owners.map((o) => (
            <option key={o.id} value={o.id}>
              {o.name} ({o.role})
            </option>
          ))}
        </SelectField>
        <TextAreaField
          id="project-description"
          label="Description"
          hint="Optional: the circuit, the operating point, where the fault cases come from."
          className="md:col-span-2"
          error={err("description")}
          {...register("description")}
        />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-1 text-sm font-semibold">Temperature and margin policy</legend>
        <p className="col-span-full -mt-1 mb-1 text-xs text-ink-muted">
          Every pulse is checked at this case temperature (a fault case may override it) against the curves
          derated for it.
        </p>
        <UnitField
          id="project-case-temp"
          label={
            <>
              Case temperature <Sym main="T" sub="C" />
            </>
          }
          unit="°C"
          inputMode="decimal"
          error={err("caseTemp")}
          {...register("caseTemp")}
        />
        <UnitField
          id="project-utilisation"
          label="Utilisation limit"
          unit="%"
          inputMode="decimal"
          hint="Above it, a pulse within the curves is marginal."
          error={err("utilisationLimit")}
          {...register("utilisationLimit")}
        />
        <UnitField
          id="project-tj-guard"
          label="Junction guard"
          unit="K"
          inputMode="decimal"
          hint={
            <>
              Below <Sym main="T" sub="j,max" />, where a thermal model exists.
            </>
          }
          error={err("tjGuard")}
          {...register("tjGuard")}
        />
        <UnitField
          id="project-voltage-limit"
          label="Voltage limit"
          unit="%"
          inputMode="decimal"
          hint={
            <>
              Of <Sym main="V" sub="DSS" />; above it a pulse is at best marginal. Default 80 %.
            </>
          }
          error={err("voltageLimit")}
          {...register("voltageLimit")}
        />
        <SelectField
          id="project-between"
          label="Between datasheet widths"
          hint="How a width between two datasheet curves is read. Default: interpolate."
          className="sm:col-span-2"
          error={err("betweenCurves")}
          {...register("betweenCurves")}
        >
          <option value="loglog">Interpolate (log-log)</option>
          <option value="next-longer">Next longer curve (strict)</option>
          <option value="thermal">Scale the shorter curve by the thermal model</option>
        </SelectField>
        <div className="col-span-full space-y-1 text-xs text-ink-muted" data-testid="policy-help">
          <p>
            <strong className="font-medium text-ink">Interpolate</strong> reads between the two neighbouring
            curves on log-log axes, as an engineer reads the chart; it can overstate the limit by a few per
            cent where the thermal impedance flattens.{" "}
            <strong className="font-medium text-ink">Next longer</strong> never overstates it.{" "}
            <strong className="font-medium text-ink">Thermal</strong> scales the next shorter curve by the
            part&apos;s thermal model, Z<sub>th</sub>(t<sub>k</sub>)/Z<sub>th</sub>(t): exact where that curve
            is thermally limited; a part without a thermal model is read as next longer.
          </p>
          <p>
            Whatever the choice, a longer pulse is never allowed more current than a shorter one at the same
            voltage.
          </p>
        </div>
      </fieldset>

      <fieldset className="grid gap-4 lg:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]" data-testid="case-path">
        <legend className="mb-1 text-sm font-semibold">Case path</legend>
        <div className="space-y-3">
          <TextAreaField
            id="project-case-network"
            label="Case to ambient, Foster terms"
            hint={
              <>
                One term per line, <Sym main="R" sub="i" /> in K/W then <Sym main="τ" sub="i" /> with a unit
                (&ldquo;0.8, 2 s&rdquo;); paste rows from a spreadsheet. Heatsink and board, measured or
                estimated. Optional.
              </>
            }
            rows={4}
            error={err("caseNetwork")}
            {...register("caseNetwork")}
          />
          <label className="flex items-start gap-2 text-sm">
            <input type="checkbox" className="mt-1" {...register("applyCaseNetwork")} />
            <span>Heat the case through this path in every check of the project</span>
          </label>
        </div>
        <CasePathPreview text={watch("caseNetwork")} parse={(t) => caseTerms(t).terms} />
      </fieldset>

      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions
        aside={
          <Link
            href={projectId ? `/projects/${projectId}` : "/projects"}
            className="hover:text-ink hover:underline"
          >
            Cancel
          </Link>
        }
      >
        <Button type="submit" variant="primary" pending={isSubmitting || navigating}>
          {projectId ? "Save settings" : "Create project"}
        </Button>
      </FormActions>
    </form>
  );
}
