"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, SelectField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { type PartInput, partSchema, technologies, technologyLabels } from "@/lib/library/part-schema";
import { TextAreaField, UnitField } from "./fields";
import { Sym } from "./symbols";

export type PartFormValues = {
  partNumber: string;
  maker: string;
  technology: string;
  package: string;
  vdsMax: string;
  idMax: string;
  idPulseMax: string;
  rdsOn: string;
  tjMax: string;
  rthJc: string;
  avalancheEnergy: string;
  avalancheCurrent: string;
  avalancheBreakdown: string;
  unitCost: string;
  currency: string;
  datasheetRevision: string;
  notes: string;
};

export const emptyPart: PartFormValues = {
  partNumber: "",
  maker: "",
  technology: "si-mosfet",
  package: "",
  vdsMax: "",
  idMax: "",
  idPulseMax: "",
  rdsOn: "",
  tjMax: "175",
  rthJc: "",
  avalancheEnergy: "",
  avalancheCurrent: "",
  avalancheBreakdown: "",
  unitCost: "",
  currency: "EUR",
  datasheetRevision: "",
  notes: "",
};

const fields = Object.keys(emptyPart) as (keyof PartFormValues)[];

const notation = "Engineering notation works: 4.2m, 4.2 mΩ, 1.5k.";

/**
 * A part's ratings: new (POST /api/parts) or edited (PATCH /api/parts/:id). One zod schema checks the form
 * here and the request on the server; numbers may be typed in engineering notation and are stored in SI units.
 */
export function PartForm({
  partId,
  defaults,
  facets,
}: {
  partId?: string;
  defaults: PartFormValues;
  facets: { makers: string[]; packages: string[] };
}) {
  const router = useRouter();
  const [navigating, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PartInput, unknown, ReturnType<typeof partSchema.parse>>({
    resolver: zodResolver(partSchema),
    defaultValues: defaults as PartInput,
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { part } = partId
        ? await sendJson<{ part: { id: string } }>("PATCH", `/api/parts/${partId}`, values)
        : await sendJson<{ part: { id: string } }>("POST", "/api/parts", values);
      startTransition(() => {
        router.push(`/library/${part.id}`);
        router.refresh();
      });
    } catch (error) {
      applyServerErrors(error, setError, fields, { "conflict:part": "partNumber" });
    }
  });

  const err = (name: keyof PartFormValues) => errors[name]?.message as string | undefined;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6 rounded-md border border-line bg-panel p-5">
      <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="mb-3 text-sm font-semibold">Identity</legend>
        <UnitField
          id="part-number"
          label="Part number"
          error={err("partNumber")}
          {...register("partNumber")}
        />
        <UnitField
          id="part-maker"
          label="Maker"
          list="part-makers"
          autoComplete="off"
          error={err("maker")}
          {...register("maker")}
        />
        <SelectField
          id="part-technology"
          label="Technology"
          error={err("technology")}
          {...register("technology")}
        >
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
          error={err("package")}
          {...register("package")}
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
          error={err("vdsMax")}
          {...register("vdsMax")}
        />
        <UnitField
          id="part-id"
          label={<Sym main="I" sub="D" />}
          unit="A"
          inputMode="decimal"
          hint="Optional"
          error={err("idMax")}
          {...register("idMax")}
        />
        <UnitField
          id="part-idm"
          label={<Sym main="I" sub="DM" />}
          unit="A"
          inputMode="decimal"
          hint="Optional, pulsed"
          error={err("idPulseMax")}
          {...register("idPulseMax")}
        />
        <UnitField
          id="part-rds"
          label={<Sym main="R" sub="DS(on)" />}
          unit="Ω"
          placeholder="4.2m"
          hint="Optional"
          error={err("rdsOn")}
          {...register("rdsOn")}
        />
        <UnitField
          id="part-tj"
          label={<Sym main="T" sub="j,max" />}
          unit="°C"
          inputMode="decimal"
          error={err("tjMax")}
          {...register("tjMax")}
        />
        <UnitField
          id="part-rth"
          label={<Sym main="R" sub="th(j-c)" />}
          unit="K/W"
          inputMode="decimal"
          hint="Optional"
          error={err("rthJc")}
          {...register("rthJc")}
        />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
        <legend className="mb-1 text-sm font-semibold">Avalanche</legend>
        <p className="col-span-full -mt-1 mb-1 text-xs text-ink-muted">
          Single-pulse avalanche ratings, for turn-offs of an inductive current without a clamp. E
          <sub>AS</sub> is rated from 25&nbsp;°C; the check derates it linearly to zero at{" "}
          <Sym main="T" sub="j,max" />. Without <Sym main="V" sub="BR" /> the check takes{" "}
          <Sym main="V" sub="DSS" />, which overstates the energy (conservative).
        </p>
        <UnitField
          id="part-eas"
          label={<Sym main="E" sub="AS" />}
          unit="J"
          placeholder="250m"
          hint="Optional"
          error={err("avalancheEnergy")}
          {...register("avalancheEnergy")}
        />
        <UnitField
          id="part-ias"
          label={<Sym main="I" sub="AS" />}
          unit="A"
          inputMode="decimal"
          hint="Optional"
          error={err("avalancheCurrent")}
          {...register("avalancheCurrent")}
        />
        <UnitField
          id="part-vbr"
          label={<Sym main="V" sub="BR" />}
          unit="V"
          inputMode="decimal"
          hint="Optional"
          error={err("avalancheBreakdown")}
          {...register("avalancheBreakdown")}
        />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
        <legend className="mb-3 text-sm font-semibold">Purchasing and source</legend>
        <UnitField
          id="part-cost"
          label="Unit cost"
          inputMode="decimal"
          hint="Optional"
          error={err("unitCost")}
          {...register("unitCost")}
        />
        <UnitField
          id="part-currency"
          label="Currency"
          maxLength={3}
          error={err("currency")}
          {...register("currency")}
        />
        <UnitField
          id="part-revision"
          label="Datasheet revision"
          placeholder="Rev. 2.1, 2024-03"
          hint="Optional"
          className="sm:col-span-2"
          error={err("datasheetRevision")}
          {...register("datasheetRevision")}
        />
      </fieldset>

      <TextAreaField
        id="part-notes"
        label="Notes"
        hint="Optional"
        error={err("notes")}
        {...register("notes")}
      />

      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions
        aside={
          <Link href={partId ? `/library/${partId}` : "/library"} className="hover:text-ink hover:underline">
            Cancel
          </Link>
        }
      >
        <Button type="submit" variant="primary" pending={isSubmitting || navigating}>
          {partId ? "Save part" : "Create part"}
        </Button>
      </FormActions>
    </form>
  );
}
