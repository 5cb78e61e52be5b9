"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/form";
import { UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import { tripWindow } from "@/lib/soa/builders";
import { formatQuantity } from "@/lib/soa/units";
import { BuilderLayout } from "./builder-layout";
import { tripWindowForm } from "./builder-schemas";

type Values = z.input<typeof tripWindowForm>;

type Input = z.output<typeof tripWindowForm>;

function build(input: Input) {
  return tripWindow({
    shunt: { nominal: input.shunt, tolerance: input.shuntTolerance },
    reference: { nominal: input.reference, tolerance: input.referenceTolerance },
    ...(input.divider && input.r1 !== undefined && input.r2 !== undefined
      ? { divider: { r1: input.r1, r2: input.r2, tolerance: input.dividerTolerance } }
      : {}),
    offset: input.offset ?? 0,
  });
}

/**
 * The over-current trip window from component tolerances, worst case. It makes no pulse by itself: its maximum
 * is the current the other builders start from, and one click carries it over.
 */
export function TripWindowBuilder({
  onUse,
}: {
  onUse: (target: "current-limit" | "clamp", amps: string) => void;
}) {
  const {
    register,
    control,
    formState: { errors },
  } = useForm<Values, unknown, Input>({
    resolver: zodResolver(tripWindowForm),
    mode: "onTouched",
    defaultValues: {
      shunt: "",
      shuntTolerance: "1",
      reference: "",
      referenceTolerance: "1",
      divider: false,
      r1: "",
      r2: "",
      dividerTolerance: "1",
      offset: "",
    },
  });
  const values = useWatch({ control });
  const parsed = tripWindowForm.safeParse(values);
  const built = parsed.success ? build(parsed.data) : null;
  const max = built?.ok ? formatQuantity(built.figures.max, "", 6).replace("\u2009", "") : null;

  return (
    <BuilderLayout
      title="Trip window"
      description={
        <>
          Where the over-current comparator really trips, from the tolerances of the shunt, the reference, the
          divider and the comparator&apos;s offset, taken all at their worst together (not root-sum-square):
          the maximum drives the SOA stress, the minimum must stay above the largest normal load.
        </>
      }
      fields={
        <div className="grid gap-4 sm:grid-cols-4">
          <UnitField
            id="tw-shunt"
            label={
              <>
                Shunt <Sym main="R" sub="sh" />
              </>
            }
            unit="Ω"
            placeholder="2m"
            error={errors.shunt?.message}
            {...register("shunt")}
          />
          <UnitField
            id="tw-shunt-tol"
            label="± tolerance"
            unit="%"
            inputMode="decimal"
            error={errors.shuntTolerance?.message}
            {...register("shuntTolerance")}
          />
          <UnitField
            id="tw-ref"
            label={
              <>
                Reference <Sym main="V" sub="ref" />
              </>
            }
            unit="V"
            inputMode="decimal"
            error={errors.reference?.message}
            {...register("reference")}
          />
          <UnitField
            id="tw-ref-tol"
            label="± tolerance"
            unit="%"
            inputMode="decimal"
            error={errors.referenceTolerance?.message}
            {...register("referenceTolerance")}
          />
          <label className="flex items-center gap-2 text-sm sm:col-span-4">
            <input type="checkbox" {...register("divider")} className="accent-[var(--color-accent)]" />
            The reference is divided down: k = R2/(R1 + R2)
          </label>
          {values.divider ? (
            <>
              <UnitField
                id="tw-r1"
                label="R1 (top)"
                unit="Ω"
                placeholder="23k"
                error={errors.r1?.message}
                {...register("r1")}
              />
              <UnitField
                id="tw-r2"
                label="R2 (bottom)"
                unit="Ω"
                placeholder="1k"
                error={errors.r2?.message}
                {...register("r2")}
              />
              <UnitField
                id="tw-div-tol"
                label="± tolerance"
                unit="%"
                inputMode="decimal"
                error={errors.dividerTolerance?.message}
                {...register("dividerTolerance")}
              />
            </>
          ) : null}
          <UnitField
            id="tw-offset"
            label={
              <>
                Offset ±<Sym main="V" sub="os" />
              </>
            }
            unit="V"
            placeholder="2m"
            hint="Optional"
            error={errors.offset?.message}
            {...register("offset")}
          />
        </div>
      }
      figures={built?.ok ? built.figures : null}
      reason={built && !built.ok ? built.reason : null}
      result={
        max ? (
          <div className="space-y-2">
            <p className="text-sm">
              Carry{" "}
              <span className="num font-mono">
                {built?.ok ? formatQuantity(built.figures.max, "A", 4) : null}
              </span>{" "}
              over as
            </p>
            <div className="flex flex-wrap gap-2">
              <Button size="sm" onClick={() => onUse("current-limit", max)}>
                the current limit
              </Button>
              <Button size="sm" onClick={() => onUse("clamp", max)}>
                the trip current at turn-off
              </Button>
            </div>
          </div>
        ) : null
      }
      pending={false}
      action={null}
      onSubmit={() => undefined}
    />
  );
}
