"use client";

import { useMemo } from "react";
import type { z } from "zod";
import { Sym } from "@/components/library/symbols";
import { editable, q } from "@/lib/format";
import type { FosterTerm } from "@/lib/soa/foster";
import { faultSequence } from "@/lib/soa/sequence";
import { waveformRiseVI } from "@/lib/soa/thermal-waveform";
import type { ProjectDetail } from "../api";
import { TraceCharts, type TracePanel, type TraceSeries } from "../captures/trace-charts";
import { BuilderFields, type Built, caseOfPulse, useBuilderForm } from "./builder-form";
import { BuilderLayout, type BuilderProps } from "./builder-layout";
import { sequenceForm } from "./builder-schemas";
import { TurnOffChoice } from "./turn-off-choice";

type Values = z.input<typeof sequenceForm>;
type Input = z.output<typeof sequenceForm>;
type Samples = { t: number[]; v: number[]; i: number[] };

const STYLES = [
  { stroke: "var(--color-accent)", dash: undefined },
  { stroke: "var(--color-ink)", dash: "6 3" },
  { stroke: "var(--color-ink-muted)", dash: "2 2" },
  { stroke: "var(--color-accent-strong)", dash: "9 3 2 3" },
];
/** Points drawn in all; each step between samples gets its share, at least 2. */
const DRAWN_POINTS = 6000;

function build(input: Input): Built {
  const circuit = {
    busVoltageMax: input.supply,
    currentLimitMax: input.limitCurrent,
    faultTimeMax: input.holdTime,
    inductance: input.inductance,
    ...(input.clamp === "clamp" ? { clampVoltage: input.clampVoltage } : { breakdown: input.breakdown }),
    retryCount: input.restarts,
    ...(input.restarts > 0 ? { pause: input.pause } : {}),
  };
  const built = faultSequence({
    supply: input.supply,
    limitCurrent: input.limitCurrent,
    holdTime: input.holdTime,
    inductance: input.inductance,
    turnOff:
      input.clamp === "clamp"
        ? { kind: "clamped", clampVoltage: input.clampVoltage ?? Number.NaN }
        : { kind: "avalanche", breakdown: input.breakdown ?? Number.NaN },
    restarts: input.restarts,
    ...(input.pause !== undefined ? { pause: input.pause } : {}),
  });
  return caseOfPulse(built, "waveform", "waveform", circuit, (pulse) => ({
    kind: "waveform",
    samples: { t: pulse.t, v: pulse.v, i: pulse.i },
  }));
}

/**
 * The samples with points added inside every step, for drawing. Between two samples either V or I is constant in a
 * built sequence, so V and I interpolated linearly keep the power linear: the rise at the added points is exact.
 */
function drawnSamples(samples: Samples): Samples {
  const steps = samples.t.length - 1;
  const inside = Math.max(1, Math.floor(DRAWN_POINTS / steps));
  const out: Samples = { t: [samples.t[0]], v: [samples.v[0]], i: [samples.i[0]] };
  for (let n = 1; n <= steps; n++) {
    for (let k = 1; k <= inside; k++) {
      const w = k / inside;
      out.t.push(samples.t[n - 1] + w * (samples.t[n] - samples.t[n - 1]));
      out.v.push(samples.v[n - 1] + w * (samples.v[n] - samples.v[n - 1]));
      out.i.push(samples.i[n - 1] + w * (samples.i[n] - samples.i[n - 1]));
    }
  }
  return out;
}

/** P and T_j over the whole sequence: T_j per candidate with a thermal model, from the project's case. */
function sequencePanels(samples: Samples, detail: ProjectDetail): TracePanel[] {
  const drawn = drawnSamples(samples);
  const pairs = (values: ArrayLike<number>): [number, number][] =>
    Array.from(values, (y) => [y, y] as [number, number]);
  const power = drawn.v.map((v, n) => v * drawn.i[n]);
  const { project } = detail;
  const caseNetwork =
    project.applyCaseNetwork && project.caseNetwork?.length ? (project.caseNetwork as FosterTerm[]) : null;
  const caseRise = caseNetwork
    ? waveformRiseVI(drawn.t, drawn.v, drawn.i, caseNetwork, { trace: true }).trace
    : null;
  const junction: TraceSeries[] = [];
  for (const { part } of detail.candidates) {
    if (!part.foster?.length) continue;
    const style = STYLES[junction.length % STYLES.length];
    const rise = waveformRiseVI(drawn.t, drawn.v, drawn.i, part.foster as FosterTerm[], { trace: true });
    const trace = rise.trace ?? new Float64Array(0);
    junction.push({
      key: part.id,
      label: part.partNumber,
      t: drawn.t,
      y: pairs(Array.from(trace, (r, n) => project.caseTemp + r + (caseRise?.[n] ?? 0))),
      ...style,
    });
  }
  // Each distinct T_j,max as a thin line in the fail colour, so a trace that crosses it stands out.
  const span = [drawn.t[0], drawn.t[drawn.t.length - 1]];
  for (const tjMax of new Set(
    detail.candidates.filter((c) => c.part.foster?.length).map((c) => c.part.tjMax),
  )) {
    junction.push({
      key: `tj-max-${tjMax}`,
      label: `T_j,max ${q(tjMax, "°C")}`,
      t: span,
      y: [
        [tjMax, tjMax],
        [tjMax, tjMax],
      ],
      stroke: "var(--color-fail)",
      dash: "1 3",
    });
  }
  const panels: TracePanel[] = [
    {
      key: "p",
      symbol: { main: "P" },
      name: "Power P (W)",
      unit: "W",
      series: [{ key: "p", label: "P = V·I", t: drawn.t, y: pairs(power), stroke: "var(--color-ink)" }],
    },
  ];
  if (junction.length > 0) {
    panels.push({
      key: "tj",
      symbol: { main: "T", sub: "j" },
      name: "T_j (°C)",
      unit: "°C",
      series: junction,
    });
  }
  return panels;
}

/**
 * A fault as one pulse: hold in current limit until the timer, turn-off into a clamp or in avalanche, pause,
 * restart. The check sees the whole sequence, so pieces that pass alone cannot hide a whole that does not.
 */
export function SequenceBuilder({ create, detail }: BuilderProps & { detail: ProjectDetail }) {
  const lowestBreakdown = useMemo(() => {
    const values = detail.candidates.map((c) => c.part.avalancheBreakdown ?? c.part.vdsMax);
    return values.length ? Math.min(...values) : null;
  }, [detail.candidates]);
  const { form, values, built, frame } = useBuilderForm<Values, Input>({
    schema: sequenceForm,
    defaultValues: {
      name: "Short, turn-off and restart as one sequence",
      supply: "",
      limitCurrent: "",
      holdTime: "",
      inductance: "",
      clamp: "clamp",
      clampVoltage: "",
      breakdown: editable(lowestBreakdown, "plain"),
      restarts: "1",
      pause: "",
    },
    build,
    origin: "sequence",
    create,
    nameId: "seq-name",
  });
  const samples = built?.ok && built.pulse.kind === "waveform" ? built.pulse.samples : null;
  const panels = useMemo(() => (samples ? sequencePanels(samples, detail) : null), [samples, detail]);
  const unclamped = values.clamp === "none";

  return (
    <BuilderLayout
      title="Fault sequence"
      description={
        <>
          A short held in current limit until the fault timer, then turned off (into a clamp, or with no clamp
          in avalanche at V<sub>BR</sub>), a pause, and each restart doing the same again: built as one pulse,
          so the check sees the heat of every piece together. Each piece can pass alone while the whole does
          not, because the junction has not cooled when the next piece comes. The turn-off&apos;s current
          falls linearly; the power and each candidate&apos;s T<sub>j</sub> below cover the whole sequence.
          {unclamped ? (
            <>
              {" "}
              In avalanche the drain sits above V<sub>DSS</sub>, which the SOA curves do not cover: such a
              sequence fails the curve reading with an over-voltage; check the avalanche energy as an
              unclamped turn-off too.
            </>
          ) : null}
        </>
      }
      fields={
        <BuilderFields
          form={form}
          className="grid gap-4 sm:grid-cols-3"
          items={[
            {
              name: "supply",
              id: "seq-supply",
              label: (
                <>
                  Highest supply <Sym main="V" sub="bus" />
                </>
              ),
              unit: "V",
              inputMode: "decimal",
              placeholder: "54.6",
              hint: "Across the transistor while it holds the short",
            },
            {
              name: "limitCurrent",
              id: "seq-limit",
              label: (
                <>
                  Limit current <Sym main="I" sub="lim" />
                </>
              ),
              unit: "A",
              inputMode: "decimal",
              placeholder: "8",
            },
            {
              name: "holdTime",
              id: "seq-hold",
              label: "Fault timer",
              unit: "s",
              placeholder: "2m",
              hint: "How long each attempt holds the limit",
            },
            { name: "inductance", id: "seq-l", label: "Loop inductance L", unit: "H", placeholder: "1µ" },
            <TurnOffChoice key="clamp" registration={form.register("clamp")} className="sm:col-span-2" />,
            unclamped
              ? {
                  name: "breakdown",
                  id: "seq-vbr",
                  label: <Sym main="V" sub="BR" />,
                  unit: "V",
                  inputMode: "decimal",
                  hint: "Lowest of the candidates by default: the longest, most energetic avalanche",
                }
              : {
                  name: "clampVoltage",
                  id: "seq-vcl",
                  label: (
                    <>
                      Clamp <Sym main="V" sub="cl" />
                    </>
                  ),
                  unit: "V",
                  inputMode: "decimal",
                  hint: "Above the supply",
                },
            {
              name: "restarts",
              id: "seq-restarts",
              label: "Restarts",
              inputMode: "numeric",
              hint: "0 to 100; each holds and turns off again",
            },
            {
              name: "pause",
              id: "seq-pause",
              label: "Pause before each restart",
              unit: "s",
              placeholder: "100m",
            },
          ]}
        />
      }
      below={
        panels && samples ? (
          <div className="mt-4" data-testid="sequence-traces">
            <TraceCharts
              key={samples.t.length}
              panels={panels}
              span={[samples.t[0], samples.t[samples.t.length - 1]]}
            />
            <p className="mt-1 text-xs text-ink-muted">
              {panels.length > 1
                ? `T_j from the project's case temperature, ${q(detail.project.caseTemp, "°C")}, through each candidate's thermal model${detail.project.applyCaseNetwork ? ", plus the case path's rise" : ""}; the results give each candidate's verdict once the fault case is created.`
                : "No candidate has a thermal model yet: only the power is drawn."}
            </p>
          </div>
        ) : null
      }
      {...frame}
    />
  );
}
