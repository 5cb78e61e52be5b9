"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/form";
import { Sym } from "@/components/library/symbols";
import { editable, q } from "@/lib/format";
import { tripWindow } from "@/lib/soa/builders";
import { BuilderFields, type FieldSpec } from "./builder-form";
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

/** A "± tolerance" field in percent. */
function tolerance(
  name: "shuntTolerance" | "referenceTolerance" | "dividerTolerance",
  id: string,
): FieldSpec<Values> {
  return { name, id, label: "± tolerance", unit: "%", inputMode: "decimal" };
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
  const form = useForm<Values, unknown, Input>({
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
  const values = useWatch({ control: form.control });
  const parsed = tripWindowForm.safeParse(values);
  const built = parsed.success ? build(parsed.data) : null;
  const max = built?.ok ? editable(built.figures.max, "prefixed", 6) : null;

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
        <BuilderFields
          form={form}
          className="grid gap-4 sm:grid-cols-4"
          items={[
            {
              name: "shunt",
              id: "tw-shunt",
              label: (
                <>
                  Shunt <Sym main="R" sub="sh" />
                </>
              ),
              unit: "Ω",
              placeholder: "2m",
            },
            tolerance("shuntTolerance", "tw-shunt-tol"),
            {
              name: "reference",
              id: "tw-ref",
              label: (
                <>
                  Reference <Sym main="V" sub="ref" />
                </>
              ),
              unit: "V",
              inputMode: "decimal",
            },
            tolerance("referenceTolerance", "tw-ref-tol"),
            <label key="divider" className="flex items-center gap-2 text-sm sm:col-span-4">
              <input type="checkbox" {...form.register("divider")} className="accent-[var(--color-accent)]" />
              The reference is divided down: k = R2/(R1 + R2)
            </label>,
            values.divider
              ? { name: "r1", id: "tw-r1", label: "R1 (top)", unit: "Ω", placeholder: "23k" }
              : null,
            values.divider
              ? { name: "r2", id: "tw-r2", label: "R2 (bottom)", unit: "Ω", placeholder: "1k" }
              : null,
            values.divider ? tolerance("dividerTolerance", "tw-div-tol") : null,
            {
              name: "offset",
              id: "tw-offset",
              label: (
                <>
                  Offset ±<Sym main="V" sub="os" />
                </>
              ),
              unit: "V",
              placeholder: "2m",
              hint: "Optional",
            },
          ]}
        />
      }
      figures={built?.ok ? built.figures : null}
      reason={built && !built.ok ? built.reason : null}
      result={
        max ? (
          <div className="space-y-2">
            <p className="text-sm">
              Carry <span className="num font-mono">{built?.ok ? q(built.figures.max, "A", 4) : null}</span>{" "}
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
