import { useEffect, useState } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { SelectField } from "@/components/form";
import type { Bind } from "@/components/form-errors";
import { TextAreaField, UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import type { FosterTerm } from "@/lib/soa/foster";
import { CasePathPreview } from "./case-path-preview";
import type { ProjectFormValues } from "./project-form-values";

// The project form's fieldsets, each bound to the form by field name.

type ProjectBind = Bind<ProjectFormValues>;

export interface OwnerChoice {
  id: string;
  name: string;
  role: string;
}

/** Name, owner and description. A new project without a chosen owner is the creator's. */
export function DesignFields({
  bind,
  owners,
  editing,
}: {
  bind: ProjectBind;
  owners: OwnerChoice[];
  editing: boolean;
}) {
  return (
    <fieldset className="grid gap-4 md:grid-cols-2">
      <legend className="mb-3 text-sm font-semibold">The design under review</legend>
      <UnitField
        id="project-name"
        label="Name"
        placeholder="48 V battery disconnect, rev B"
        {...bind("name")}
      />
      <SelectField
        id="project-owner"
        label="Owner"
        hint="Receives an e-mail when a measured pulse or capture fails."
        {...bind("ownerId")}
      >
        {editing ? <option value="">No owner</option> : <option value="">Me</option>}
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
        {...bind("description")}
      />
    </fieldset>
  );
}

/** The case temperature and the margin policy every pulse of the project is checked under. */
export function PolicyFields({ bind }: { bind: ProjectBind }) {
  return (
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
        {...bind("caseTemp")}
      />
      <UnitField
        id="project-utilisation"
        label="Utilisation limit"
        unit="%"
        inputMode="decimal"
        hint="Above it, a pulse within the curves is marginal."
        {...bind("utilisationLimit")}
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
        {...bind("tjGuard")}
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
        {...bind("voltageLimit")}
      />
      <SelectField
        id="project-between"
        label="Between datasheet widths"
        hint="How a width between two datasheet curves is read. Default: interpolate."
        className="sm:col-span-2"
        {...bind("betweenCurves")}
      >
        <option value="loglog">Interpolate (log-log)</option>
        <option value="next-longer">Next longer curve (strict)</option>
        <option value="thermal">Scale the shorter curve by the thermal model</option>
      </SelectField>
      <BetweenCurvesHelp />
    </fieldset>
  );
}

function BetweenCurvesHelp() {
  return (
    <div className="col-span-full space-y-1 text-xs text-ink-muted" data-testid="policy-help">
      <p>
        <strong className="font-medium text-ink">Interpolate</strong> reads between the two neighbouring
        curves on log-log axes, as an engineer reads the chart; it can overstate the limit by a few per cent
        where the thermal impedance flattens. <strong className="font-medium text-ink">Next longer</strong>{" "}
        never overstates it. <strong className="font-medium text-ink">Thermal</strong> scales the next shorter
        curve by the part&apos;s thermal model, Z<sub>th</sub>(t<sub>k</sub>)/Z<sub>th</sub>(t): exact where
        that curve is thermally limited; a part without a thermal model is read as next longer.
      </p>
      <p>
        Whatever the choice, a longer pulse is never allowed more current than a shorter one at the same
        voltage.
      </p>
    </div>
  );
}

/** The case-to-ambient Foster terms, whether every check heats the case through them, and their preview. */
export function CasePathFields({
  bind,
  apply,
  text,
}: {
  bind: ProjectBind;
  /** The checkbox that applies the path. */
  apply: UseFormRegisterReturn;
  text: string;
}) {
  const parse = useCaseTermsParser(text);
  return (
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
          {...bind("caseNetwork")}
        />
        <label className="flex items-start gap-2 text-sm">
          <input type="checkbox" className="mt-1" {...apply} />
          <span>Heat the case through this path in every check of the project</span>
        </label>
      </div>
      <CasePathPreview text={text} parse={parse} />
    </fieldset>
  );
}

type TermsParser = (text: string) => FosterTerm[] | null;
const nothingYet: TermsParser = () => null;

/** The case path's parser, loaded (with zod) once a case path is typed, so the form's pages load without it. */
function useCaseTermsParser(text: string): TermsParser {
  const [parser, setParser] = useState<TermsParser | null>(null);
  const typed = text.trim() !== "";
  useEffect(() => {
    if (!typed || parser) return;
    let live = true;
    void import("./project-form-schema").then(({ caseTerms }) => {
      if (live) setParser(() => (t: string) => caseTerms(t).terms ?? null);
    });
    return () => {
      live = false;
    };
  }, [typed, parser]);
  return parser ?? nothingYet;
}
