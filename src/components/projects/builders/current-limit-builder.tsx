"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import { currentLimitFault } from "@/lib/soa/builders";
import { BuilderLayout, type BuilderProps, PulseSummary, saveBuilt } from "./builder-layout";
import { currentLimitForm } from "./builder-schemas";

type Values = z.input<typeof currentLimitForm>;

type Input = z.output<typeof currentLimitForm>;

function build(input: Input) {
  const circuit = {
    busVoltageMax: input.supplyMax,
    currentLimitMax: input.limitCurrentMax,
    faultTimeMax: input.holdTimeMax,
    ...(input.restarts && input.restartPeriod !== undefined ? { retryPeriod: input.restartPeriod } : {}),
    ...(input.restarts && input.restartCount !== undefined ? { retryCount: input.restartCount } : {}),
  };
  const built = currentLimitFault(circuit);
  if (!built.ok) return built;
  const pulse = built.pulses[0];
  if (pulse.kind !== "rect") return { ok: false as const, reason: "the builder made no rectangle" };
  return {
    ok: true as const,
    figures: built.figures,
    pulse: {
      kind: "rect" as const,
      v: pulse.v,
      i: pulse.i,
      duration: pulse.duration,
      repeat: pulse.repeat ?? null,
    },
    origin: { input: circuit, figures: built.figures },
  };
}

/** A short held in current limit until the hold timer turns the switch off; with restarts, a train. */
export function CurrentLimitBuilder({ create, currentLimit }: BuilderProps & { currentLimit?: string }) {
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, Input>({
    resolver: zodResolver(currentLimitForm),
    mode: "onTouched",
    defaultValues: {
      name: "Output short in current limit",
      supplyMax: "",
      limitCurrentMax: currentLimit ?? "",
      holdTimeMax: "",
      restarts: false,
      restartPeriod: "",
      restartCount: "",
    },
  });
  const values = useWatch({ control });
  const parsed = currentLimitForm.safeParse(values);
  const built = parsed.success ? build(parsed.data) : null;

  const onSubmit = handleSubmit((input) =>
    saveBuilt("current-limit", input.name, build(input), create, setError),
  );

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
        <div className="grid gap-4 sm:grid-cols-3">
          <UnitField
            id="cl-bus"
            label={
              <>
                Highest supply <Sym main="V" sub="DS" />
              </>
            }
            unit="V"
            inputMode="decimal"
            placeholder="54.6"
            hint="The whole supply lies across the transistor"
            error={errors.supplyMax?.message}
            {...register("supplyMax")}
          />
          <UnitField
            id="cl-limit"
            label={
              <>
                Limit current <Sym main="I" sub="D" />
              </>
            }
            unit="A"
            inputMode="decimal"
            placeholder="8"
            hint="The highest the limit can be set or drift"
            error={errors.limitCurrentMax?.message}
            {...register("limitCurrentMax")}
          />
          <UnitField
            id="cl-time"
            label="Longest hold"
            unit="s"
            placeholder="2m"
            hint="Until the protection turns the switch off"
            error={errors.holdTimeMax?.message}
            {...register("holdTimeMax")}
          />
          <label className="flex items-center gap-2 text-sm sm:col-span-3">
            <input type="checkbox" {...register("restarts")} className="accent-[var(--color-accent)]" />
            Restarts: the protection turns the switch on again after a pause
          </label>
          {values.restarts ? (
            <>
              <UnitField
                id="cl-period"
                label="Restart period"
                unit="s"
                placeholder="100m"
                hint="From one turn-on to the next"
                error={errors.restartPeriod?.message}
                {...register("restartPeriod")}
              />
              <UnitField
                id="cl-count"
                label="Restarts"
                inputMode="numeric"
                hint="Blank: it restarts for as long as the short lasts"
                error={errors.restartCount?.message}
                {...register("restartCount")}
              />
            </>
          ) : null}
        </div>
      }
      figures={built?.ok ? built.figures : null}
      reason={built && !built.ok ? built.reason : null}
      result={built?.ok ? <PulseSummary pulse={built.pulse} /> : null}
      footer={
        <UnitField
          id="cl-name"
          label="Fault case name"
          className="max-w-sm"
          error={errors.name?.message}
          {...register("name")}
        />
      }
      error={errors.root?.server?.message}
      pending={isSubmitting}
      onSubmit={onSubmit}
    />
  );
}
