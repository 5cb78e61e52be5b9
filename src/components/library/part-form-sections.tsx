import type { ReactNode } from "react";
import type { Path } from "react-hook-form";
import { SelectField } from "@/components/form";
import type { Bind } from "@/components/form-errors";
import type { PartInput } from "@/lib/library/part-schema";
import { technologies, technologyLabels } from "@/lib/library/technologies";
import { UnitField } from "./fields";
import { Sym } from "./symbols";

// The part form's fieldsets, each bound to the form by field name.

type PartBind = Bind<PartInput>;

const notation = "Engineering notation works: 4.2m, 4.2 mΩ, 1.5k.";

/** Part number, maker, technology and package; makers and packages already in the library are offered. */
export function IdentityFields({
  bind,
  facets,
}: {
  bind: PartBind;
  facets: { makers: string[]; packages: string[] };
}) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
      <legend className="mb-3 text-sm font-semibold">Identity</legend>
      <UnitField id="part-number" label="Part number" {...bind("partNumber")} />
      <UnitField id="part-maker" label="Maker" list="part-makers" autoComplete="off" {...bind("maker")} />
      <SelectField id="part-technology" label="Technology" {...bind("technology")}>
        {technologies.map((t) => (
          <option key={t} value={t}>
            {technologyLabels[t]}
          </option>
        ))}
      </SelectField>
      <UnitField
        id="part-package"
        label="Package"
        list="part-packages"
        autoComplete="off"
        {...bind("package")}
      />
      <datalist id="part-makers">
        {facets.makers.map((m) => (
          <option key={m} value={m} />
        ))}
      </datalist>
      <datalist id="part-packages">
        {facets.packages.map((p) => (
          <option key={p} value={p} />
        ))}
      </datalist>
    </fieldset>
  );
}

/** A unit field of the part form: what differs from one to the next. */
interface UnitSpec {
  name: Path<PartInput>;
  id: string;
  label: ReactNode;
  unit: string;
  hint?: string;
  /** Shows the notation where a value is usually small; the fields without one open the decimal keypad. */
  placeholder?: string;
}

const optional = "Optional";

const ratings: UnitSpec[] = [
  { name: "vdsMax", id: "part-vds", label: <Sym main="V" sub="DSS" />, unit: "V" },
  { name: "idMax", id: "part-id", label: <Sym main="I" sub="D" />, unit: "A", hint: optional },
  {
    name: "idPulseMax",
    id: "part-idm",
    label: <Sym main="I" sub="DM" />,
    unit: "A",
    hint: "Optional, pulsed",
  },
  {
    name: "rdsOn",
    id: "part-rds",
    label: <Sym main="R" sub="DS(on)" />,
    unit: "Ω",
    placeholder: "4.2m",
    hint: optional,
  },
  { name: "tjMax", id: "part-tj", label: <Sym main="T" sub="j,max" />, unit: "°C" },
  { name: "rthJc", id: "part-rth", label: <Sym main="R" sub="th(j-c)" />, unit: "K/W", hint: optional },
];

const avalanche: UnitSpec[] = [
  {
    name: "avalancheEnergy",
    id: "part-eas",
    label: <Sym main="E" sub="AS" />,
    unit: "J",
    placeholder: "250m",
    hint: optional,
  },
  { name: "avalancheCurrent", id: "part-ias", label: <Sym main="I" sub="AS" />, unit: "A", hint: optional },
  { name: "avalancheBreakdown", id: "part-vbr", label: <Sym main="V" sub="BR" />, unit: "V", hint: optional },
];

function UnitFields({ specs, bind }: { specs: UnitSpec[]; bind: PartBind }) {
  return specs.map(({ name, placeholder, ...field }) => (
    <UnitField
      key={name}
      {...field}
      {...(placeholder ? { placeholder } : { inputMode: "decimal" as const })}
      {...bind(name)}
    />
  ));
}

/** The datasheet's absolute ratings. */
export function RatingFields({ bind }: { bind: PartBind }) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
      <legend className="mb-1 text-sm font-semibold">Ratings</legend>
      <p className="col-span-full -mt-1 mb-1 text-xs text-ink-muted">
        From the datasheet, at 25&nbsp;°C unless it says otherwise. {notation}
      </p>
      <UnitFields specs={ratings} bind={bind} />
    </fieldset>
  );
}

/** Single-pulse avalanche ratings. */
export function AvalancheFields({ bind }: { bind: PartBind }) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
      <legend className="mb-1 text-sm font-semibold">Avalanche</legend>
      <p className="col-span-full -mt-1 mb-1 text-xs text-ink-muted">
        Single-pulse avalanche ratings, for turn-offs of an inductive current without a clamp. E<sub>AS</sub>{" "}
        is rated from 25&nbsp;°C; the check derates it linearly to zero at <Sym main="T" sub="j,max" />.
        Without <Sym main="V" sub="BR" /> the check takes <Sym main="V" sub="DSS" />, which overstates the
        energy (conservative).
      </p>
      <UnitFields specs={avalanche} bind={bind} />
    </fieldset>
  );
}

/** Cost and the datasheet revision the figures come from. */
export function PurchasingFields({ bind }: { bind: PartBind }) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
      <legend className="mb-3 text-sm font-semibold">Purchasing and source</legend>
      <UnitField id="part-cost" label="Unit cost" inputMode="decimal" hint="Optional" {...bind("unitCost")} />
      <UnitField id="part-currency" label="Currency" maxLength={3} {...bind("currency")} />
      <UnitField
        id="part-revision"
        label="Datasheet revision"
        placeholder="Rev. 2.1, 2024-03"
        hint="Optional"
        className="sm:col-span-2"
        {...bind("datasheetRevision")}
      />
    </fieldset>
  );
}
