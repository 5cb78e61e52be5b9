import { SelectField } from "@/components/form";
import type { Bind } from "@/components/form-errors";
import { type PartInput, technologies, technologyLabels } from "@/lib/library/part-schema";
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

/** The datasheet's absolute ratings. */
export function RatingFields({ bind }: { bind: PartBind }) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
      <legend className="mb-1 text-sm font-semibold">Ratings</legend>
      <p className="col-span-full -mt-1 mb-1 text-xs text-ink-muted">
        From the datasheet, at 25&nbsp;°C unless it says otherwise. {notation}
      </p>
      <UnitField
        id="part-vds"
        label={<Sym main="V" sub="DSS" />}
        unit="V"
        inputMode="decimal"
        {...bind("vdsMax")}
      />
      <UnitField
        id="part-id"
        label={<Sym main="I" sub="D" />}
        unit="A"
        inputMode="decimal"
        hint="Optional"
        {...bind("idMax")}
      />
      <UnitField
        id="part-idm"
        label={<Sym main="I" sub="DM" />}
        unit="A"
        inputMode="decimal"
        hint="Optional, pulsed"
        {...bind("idPulseMax")}
      />
      <UnitField
        id="part-rds"
        label={<Sym main="R" sub="DS(on)" />}
        unit="Ω"
        placeholder="4.2m"
        hint="Optional"
        {...bind("rdsOn")}
      />
      <UnitField
        id="part-tj"
        label={<Sym main="T" sub="j,max" />}
        unit="°C"
        inputMode="decimal"
        {...bind("tjMax")}
      />
      <UnitField
        id="part-rth"
        label={<Sym main="R" sub="th(j-c)" />}
        unit="K/W"
        inputMode="decimal"
        hint="Optional"
        {...bind("rthJc")}
      />
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
      <UnitField
        id="part-eas"
        label={<Sym main="E" sub="AS" />}
        unit="J"
        placeholder="250m"
        hint="Optional"
        {...bind("avalancheEnergy")}
      />
      <UnitField
        id="part-ias"
        label={<Sym main="I" sub="AS" />}
        unit="A"
        inputMode="decimal"
        hint="Optional"
        {...bind("avalancheCurrent")}
      />
      <UnitField
        id="part-vbr"
        label={<Sym main="V" sub="BR" />}
        unit="V"
        inputMode="decimal"
        hint="Optional"
        {...bind("avalancheBreakdown")}
      />
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
