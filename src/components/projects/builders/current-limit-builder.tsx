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
    busVoltageMax: input.busVoltageMax,
    currentLimitMax: input.currentLimitMax,
    faultTimeMax: input.faultTimeMax,
    ...(input.retry && input.retryPeriod !== undefined ? { retryPeriod: input.retryPeriod } : {}),
    ...(input.retry && input.retryCount !== undefined ? { retryCount: input.retryCount } : {}),
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

/** A short held in current limit until the fault timer trips; with auto-retry, a train at the retry period. */
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
      busVoltageMax: "",
      currentLimitMax: currentLimit ?? "",
      faultTimeMax: "",
      retry: false,
      retryPeriod: "",
      retryCount: "",
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
      title="Current-limit timer"
      description={
        <>
          The worst case of a short held in current limit: the highest bus voltage times the highest limit
          setting, for the longest the fault timer can take to trip. With auto-retry the controller tries
          again every retry period, so the pulse repeats.
        </>
      }
      fields={
        <div className="grid gap-4 sm:grid-cols-3">
          <UnitField
            id="cl-bus"
            label={<Sym main="V" sub="bus,max" />}
            unit="V"
            inputMode="decimal"
            error={errors.busVoltageMax?.message}
            {...register("busVoltageMax")}
          />
          <UnitField
            id="cl-limit"
            label={<Sym main="I" sub="lim,max" />}
            unit="A"
            inputMode="decimal"
            hint="The highest the limit can be set or drift"
            error={errors.currentLimitMax?.message}
            {...register("currentLimitMax")}
          />
          <UnitField
            id="cl-time"
            label={<Sym main="t" sub="fault,max" />}
            unit="s"
            placeholder="2m"
            hint="The timer's longest delay"
            error={errors.faultTimeMax?.message}
            {...register("faultTimeMax")}
          />
          <label className="flex items-center gap-2 text-sm sm:col-span-3">
            <input type="checkbox" {...register("retry")} className="accent-[var(--color-accent)]" />
            Auto-retry: the controller turns on again after a pause
          </label>
          {values.retry ? (
            <>
              <UnitField
                id="cl-period"
                label="Retry period"
                unit="s"
                placeholder="1"
                error={errors.retryPeriod?.message}
                {...register("retryPeriod")}
              />
              <UnitField
                id="cl-count"
                label="Retries"
                inputMode="numeric"
                hint="Blank: it retries for as long as the short lasts"
                error={errors.retryCount?.message}
                {...register("retryCount")}
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
