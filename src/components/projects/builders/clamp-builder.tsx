"use client";

import type { z } from "zod";
import { Sym } from "@/components/library/symbols";
import { clampTurnOff, unclampedTurnOff } from "@/lib/soa/builders";
import { BuilderFields, type Built, caseOfPulse, useBuilderForm } from "./builder-form";
import { BuilderLayout, type BuilderProps } from "./builder-layout";
import { clampForm } from "./builder-schemas";
import { TurnOffChoice } from "./turn-off-choice";

type Values = z.input<typeof clampForm>;

type Input = z.output<typeof clampForm>;

function build(input: Input): Built {
  const delay = input.delay !== undefined ? { delay: input.delay } : {};
  if (input.clamp === "none") {
    const circuit = {
      inductance: input.inductance,
      tripCurrent: input.tripCurrent,
      busVoltage: input.busVoltage,
      ...delay,
    };
    return caseOfPulse(unclampedTurnOff(circuit), "avalanche", "avalanche pulse", circuit, (pulse) => ({
      kind: "avalanche",
      supply: pulse.supply,
      current: pulse.current,
      inductance: pulse.inductance,
    }));
  }
  const circuit = {
    inductance: input.inductance,
    tripCurrent: input.tripCurrent,
    busVoltage: input.busVoltage,
    clampVoltage: input.clampVoltage ?? Number.NaN,
    ...delay,
  };
  return caseOfPulse(clampTurnOff(circuit), "triangle", "triangle", circuit, (pulse) => ({
    kind: "triangle",
    v: pulse.v,
    i: pulse.i,
    duration: pulse.duration,
    repeat: null,
  }));
}

/**
 * A short turned off: into a clamp (the loop inductance drives the current down through the clamp voltage, a falling
 * triangle) or with no clamp below breakdown (an avalanche pulse, METHODS.md §13, checked per candidate at its V_BR).
 */
export function ClampBuilder({ create, tripCurrent }: BuilderProps & { tripCurrent?: string }) {
  const { form, values, frame } = useBuilderForm<Values, Input>({
    schema: clampForm,
    defaultValues: {
      name: "Short at turn-off, clamped",
      clamp: "clamp",
      inductance: "",
      tripCurrent: tripCurrent ?? "",
      busVoltage: "",
      clampVoltage: "",
      delay: "",
    },
    build,
    origin: (input) => (input.clamp === "none" ? "unclamped" : "clamp"),
    create,
    nameId: "clamp-name",
  });
  const unclamped = values.clamp === "none";

  return (
    <BuilderLayout
      title="Turn-off"
      description={
        unclamped ? (
          <>
            A short is detected at I<sub>trip,max</sub> and, after the turn-off delay, the transistor opens
            with no clamp below its breakdown: the drain rises to V<sub>BR</sub> and the loop inductance dumps
            its energy in the transistor (avalanche). Each candidate is checked at its own V<sub>BR</sub>{" "}
            against its avalanche energy rating, derated for the starting temperature. Rely on a rated
            avalanche only where the manufacturer allows repeated or single avalanche for this use.
          </>
        ) : (
          <>
            A short is detected at I<sub>trip,max</sub> and, after the turn-off delay, the transistor opens
            into a clamp. The current keeps rising by V<sub>bus</sub>/L during the delay, then falls through
            the clamp voltage: a falling triangle at V<sub>cl</sub>.
          </>
        )
      }
      fields={
        <BuilderFields
          form={form}
          className="grid gap-4 sm:grid-cols-3"
          items={[
            <TurnOffChoice key="clamp" registration={form.register("clamp")} className="sm:col-span-3" />,
            { name: "inductance", id: "clamp-l", label: "Loop inductance L", unit: "H", placeholder: "1µ" },
            {
              name: "tripCurrent",
              id: "clamp-trip",
              label: <Sym main="I" sub="trip,max" />,
              unit: "A",
              inputMode: "decimal",
              hint: "From the trip window",
            },
            {
              name: "delay",
              id: "clamp-delay",
              label: (
                <>
                  Turn-off delay <Sym main="t" sub="delay" />
                </>
              ),
              unit: "s",
              placeholder: "0",
              hint: "Optional",
            },
            {
              name: "busVoltage",
              id: "clamp-bus",
              label: <Sym main="V" sub="bus" />,
              unit: "V",
              inputMode: "decimal",
            },
            unclamped
              ? null
              : {
                  name: "clampVoltage",
                  id: "clamp-vcl",
                  label: (
                    <>
                      Clamp <Sym main="V" sub="cl" />
                    </>
                  ),
                  unit: "V",
                  inputMode: "decimal",
                  hint: "Above the bus voltage",
                },
          ]}
        />
      }
      {...frame}
    />
  );
}
