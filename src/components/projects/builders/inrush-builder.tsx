"use client";

import type { z } from "zod";
import { Sym } from "@/components/library/symbols";
import { inrushPulses } from "@/lib/soa/builders";
import { BuilderFields, type Built, builtCase, useBuilderForm } from "./builder-form";
import { BuilderLayout, type BuilderProps } from "./builder-layout";
import { inrushForm } from "./builder-schemas";

type Values = z.input<typeof inrushForm>;

const defaults: Values = {
  name: "Pre-charge inrush",
  supply: "",
  capacitance: "",
  slew: "",
  load: "",
  equivalent: "triangle",
};

type Input = z.output<typeof inrushForm>;

/**
 * The fault case an inrush makes. Without a load it is the engine's falling triangle. With a resistive load the
 * engine gives a waveform; a fault case is a rectangle or a triangle, so the waveform is replaced by a pulse of
 * the same energy at the same peak power (V*, I* at the peak): a rectangle E/P_peak wide, or a falling triangle
 * twice that. The curves read both exactly as they read the waveform itself (METHODS.md §6).
 */
export function buildInrush(input: Input): Built {
  const { name: _name, equivalent, ...circuit } = input;
  const built = inrushPulses({ ...circuit, samples: 3 });
  if (!built.ok) return { ok: false, reason: built.reason };
  const { figures } = built;
  const pulse = built.pulses[0];
  if (pulse.kind === "triangle") {
    return builtCase(
      { kind: "triangle" as const, v: pulse.v, i: pulse.i, duration: pulse.duration, repeat: null },
      circuit,
      figures,
    );
  }
  const t = figures.peakPowerTime;
  const v = circuit.supply - circuit.slew * t;
  const i = figures.chargeCurrent + (circuit.slew * t) / circuit.load!;
  const width = (equivalent === "rect" ? 1 : 2) * (figures.energy / figures.peakPower);
  const shown = { ...figures, equivalentV: v, equivalentI: i, equivalentWidth: width };
  return {
    ok: true as const,
    figures: shown,
    pulse: { kind: equivalent, v, i, duration: width, repeat: null },
    origin: { input: { ...circuit, equivalent }, figures: shown },
  };
}

/** The pulses a loaded inrush's waveform may be saved as, in the order offered. */
const equivalents = [
  ["triangle", "an equal-energy falling triangle at the peak power"],
  ["rect", "an equal-energy rectangle at the peak power"],
] as const;

export function InrushBuilder({ create }: BuilderProps) {
  const { form, values, frame } = useBuilderForm<Values, Input>({
    schema: inrushForm,
    defaultValues: defaults,
    build: buildInrush,
    origin: "inrush",
    create,
    nameId: "inrush-name",
  });
  const withLoad = String(values.load ?? "").trim() !== "";

  return (
    <BuilderLayout
      title="Inrush"
      description={
        <>
          Charging the load capacitance C<sub>L</sub> at a controlled slew S from V<sub>in</sub>: the
          transistor carries C<sub>L</sub>·S while its V<sub>DS</sub> falls from V<sub>in</sub> to 0, a
          falling triangle of power. The energy is ½·C<sub>L</sub>·V<sub>in</sub>² whatever the slew; a slower
          slew lowers the peak but stretches the pulse.
        </>
      }
      fields={
        <BuilderFields
          form={form}
          className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4"
          items={[
            {
              name: "supply",
              id: "inrush-supply",
              label: (
                <>
                  Supply <Sym main="V" sub="in" />
                </>
              ),
              unit: "V",
              inputMode: "decimal",
              placeholder: "48",
            },
            {
              name: "capacitance",
              id: "inrush-capacitance",
              label: (
                <>
                  Load capacitance <Sym main="C" sub="L" />
                </>
              ),
              unit: "F",
              placeholder: "1.5m",
            },
            {
              name: "slew",
              id: "inrush-slew",
              label: "Slew rate dV/dt",
              unit: "V/ms",
              inputMode: "decimal",
              placeholder: "1",
            },
            {
              name: "load",
              id: "inrush-load",
              label: (
                <>
                  Resistive load <Sym main="R" sub="L" />
                </>
              ),
              unit: "Ω",
              hint: "Optional: present from the start",
            },
            withLoad ? (
              <fieldset key="equivalent" className="sm:col-span-2 xl:col-span-4">
                <legend className="text-sm font-medium">
                  With a load the pulse is a waveform; save it as
                </legend>
                <div className="mt-1.5 flex flex-wrap gap-x-6 gap-y-1 text-sm">
                  {equivalents.map(([value, words]) => (
                    <label key={value} className="inline-flex items-center gap-2">
                      <input
                        type="radio"
                        value={value}
                        {...form.register("equivalent")}
                        className="accent-[var(--color-accent)]"
                      />
                      {words}
                    </label>
                  ))}
                </div>
                <p className="mt-1 text-xs text-ink-muted">
                  Fault cases are rectangles or triangles, so the waveform is replaced by a pulse with the
                  same energy and the same peak power (at V* and I* of the peak). The SOA curves read either
                  exactly as they read the waveform itself; with a thermal model the triangle is the closer of
                  the two.
                </p>
              </fieldset>
            ) : null,
          ]}
        />
      }
      {...frame}
    />
  );
}
