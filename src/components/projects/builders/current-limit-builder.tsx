"use client";

import type { z } from "zod";
import { Sym } from "@/components/library/symbols";
import { currentLimitFault } from "@/lib/soa/builders";
import { BuilderFields, type Built, caseOfPulse, useBuilderForm } from "./builder-form";
import { BuilderLayout, type BuilderProps } from "./builder-layout";
import { currentLimitForm } from "./builder-schemas";

type Values = z.input<typeof currentLimitForm>;

type Input = z.output<typeof currentLimitForm>;

function build(input: Input): Built {
  const circuit = {
    busVoltageMax: input.supplyMax,
    currentLimitMax: input.limitCurrentMax,
    faultTimeMax: input.holdTimeMax,
    ...(input.restarts && input.restartPeriod !== undefined ? { retryPeriod: input.restartPeriod } : {}),
    ...(input.restarts && input.restartCount !== undefined ? { retryCount: input.restartCount } : {}),
  };
  return caseOfPulse(currentLimitFault(circuit), "rect", "rectangle", circuit, (pulse) => ({
    kind: "rect",
    v: pulse.v,
    i: pulse.i,
    duration: pulse.duration,
    repeat: pulse.repeat ?? null,
  }));
}

/** A short held in current limit until the hold timer turns the switch off; with restarts, a train. */
export function CurrentLimitBuilder({ create, currentLimit }: BuilderProps & { currentLimit?: string }) {
  const { form, values, frame } = useBuilderForm<Values, Input>({
    schema: currentLimitForm,
    defaultValues: {
      name: "Output short in current limit",
      supplyMax: "",
      limitCurrentMax: currentLimit ?? "",
      holdTimeMax: "",
      restarts: false,
      restartPeriod: "",
      restartCount: "",
    },
    build,
    origin: "current-limit",
    create,
    nameId: "cl-name",
  });

  return (
    <BuilderLayout
      title="Short in current limit"
      description={
        <>
          The worst case of a short held in current limit: the whole supply across the transistor at the
          highest limit current, for the longest hold before it is turned off. If the protection turns the
          switch on again after a pause, the pulse repeats at the restart period.
        </>
      }
      fields={
        <BuilderFields
          form={form}
          className="grid gap-4 sm:grid-cols-3"
          items={[
            {
              name: "supplyMax",
              id: "cl-bus",
              label: (
                <>
                  Highest supply <Sym main="V" sub="DS" />
                </>
              ),
              unit: "V",
              inputMode: "decimal",
              placeholder: "54.6",
              hint: "The whole supply lies across the transistor",
            },
            {
              name: "limitCurrentMax",
              id: "cl-limit",
              label: (
                <>
                  Limit current <Sym main="I" sub="D" />
                </>
              ),
              unit: "A",
              inputMode: "decimal",
              placeholder: "8",
              hint: "The highest the limit can be set or drift",
            },
            {
              name: "holdTimeMax",
              id: "cl-time",
              label: "Longest hold",
              unit: "s",
              placeholder: "2m",
              hint: "Until the protection turns the switch off",
            },
            <label key="restarts" className="flex items-center gap-2 text-sm sm:col-span-3">
              <input
                type="checkbox"
                {...form.register("restarts")}
                className="accent-[var(--color-accent)]"
              />
              Restarts: the protection turns the switch on again after a pause
            </label>,
            values.restarts
              ? {
                  name: "restartPeriod",
                  id: "cl-period",
                  label: "Restart period",
                  unit: "s",
                  placeholder: "100m",
                  hint: "From one turn-on to the next",
                }
              : null,
            values.restarts
              ? {
                  name: "restartCount",
                  id: "cl-count",
                  label: "Restarts",
                  inputMode: "numeric",
                  hint: "Blank: it restarts for as long as the short lasts",
                }
              : null,
          ]}
        />
      }
      {...frame}
    />
  );
}
