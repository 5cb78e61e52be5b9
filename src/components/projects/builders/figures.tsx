import { Fragment, type ReactNode } from "react";
import { Sym } from "@/components/library/symbols";
import { count, inUnit, q } from "@/lib/format";
import type { Unit } from "@/lib/soa/units";

// The builders' inputs and intermediate figures with their symbols and units, for the live panel beside each
// builder and for a fault case's stored origin.

type Format = (value: number) => string;

const unit =
  (u: Unit | "", digits = 4): Format =>
  (value) =>
    q(value, u, digits);

const slew: Format = (value) => `${inUnit(value, 1e3, 4)}\u2009V/ms`;
const fraction: Format = (value) => q(value * 100, "%", 3);
const plain: Format = (value) => count(value);

const known: Record<string, { label: ReactNode; format: Format }> = {
  supply: { label: <Sym main="V" sub="in" />, format: unit("V") },
  capacitance: { label: <Sym main="C" sub="L" />, format: unit("F") },
  slew: { label: "Slew dV/dt", format: slew },
  load: { label: <Sym main="R" sub="L" />, format: unit("Ω") },
  chargeCurrent: {
    label: (
      <>
        Charging current C<sub>L</sub>·S
      </>
    ),
    format: unit("A"),
  },
  rampTime: {
    label: (
      <>
        Ramp time t<sub>r</sub> = V<sub>in</sub>/S
      </>
    ),
    format: unit("s"),
  },
  peakPower: { label: <Sym main="P" sub="peak" />, format: unit("W") },
  peakPowerTime: { label: "Peak power at t =", format: unit("s") },
  energy: { label: "Energy in the transistor", format: unit("J") },
  busVoltageMax: { label: "Highest supply", format: unit("V") },
  currentLimitMax: { label: "Limit current", format: unit("A") },
  faultTimeMax: { label: "Longest hold", format: unit("s") },
  retryPeriod: { label: "Restart period", format: unit("s") },
  retryCount: { label: "Restarts", format: plain },
  power: {
    label: (
      <>
        Power V<sub>bus</sub>·I<sub>lim</sub>
      </>
    ),
    format: unit("W"),
  },
  duty: { label: "Duty", format: fraction },
  inductance: { label: "Loop inductance L", format: unit("H") },
  tripCurrent: { label: <Sym main="I" sub="trip,max" />, format: unit("A") },
  busVoltage: { label: <Sym main="V" sub="bus" />, format: unit("V") },
  clampVoltage: { label: <Sym main="V" sub="cl" />, format: unit("V") },
  delay: { label: <Sym main="t" sub="delay" />, format: unit("s") },
  peakCurrent: {
    label: (
      <>
        Peak current I<sub>pk</sub>
      </>
    ),
    format: unit("A"),
  },
  clampTime: {
    label: (
      <>
        Clamp time L·I<sub>pk</sub>/(V<sub>cl</sub> − V<sub>bus</sub>)
      </>
    ),
    format: unit("s"),
  },
  breakdown: { label: <Sym main="V" sub="BR" />, format: unit("V") },
  pause: { label: "Pause before each restart", format: unit("s") },
  turnOffVoltage: { label: "Voltage while the current falls", format: unit("V") },
  turnOffTime: {
    label: (
      <>
        Turn-off time L·I<sub>lim</sub>/(V − V<sub>bus</sub>)
      </>
    ),
    format: unit("s"),
  },
  holdEnergy: { label: "Energy per hold", format: unit("J") },
  turnOffEnergy: { label: "Energy per turn-off", format: unit("J") },
  attempts: { label: "Attempts", format: plain },
  totalEnergy: { label: "Energy over the sequence", format: unit("J") },
  length: { label: "Sequence length", format: unit("s") },
  inductorEnergy: { label: "Inductor energy ½·L·I²", format: unit("J") },
  nominal: { label: <Sym main="I" sub="trip,nom" />, format: unit("A") },
  min: { label: <Sym main="I" sub="trip,min" />, format: unit("A") },
  max: { label: <Sym main="I" sub="trip,max" />, format: unit("A") },
  equivalentV: {
    label: (
      <>
        Equal-energy pulse V<sub>DS</sub>
      </>
    ),
    format: unit("V"),
  },
  equivalentI: {
    label: (
      <>
        Equal-energy pulse I<sub>D</sub>
      </>
    ),
    format: unit("A"),
  },
  equivalentWidth: { label: "Equal-energy pulse width", format: unit("s") },
};

export interface FigureLine {
  key: string;
  label: ReactNode;
  value: string;
}

/** The known entries of `values` in the order above (stored origins come back with their keys reordered). */
function linesOf(values: object, prefix: string): FigureLine[] {
  const record = values as Record<string, unknown>;
  const lines: FigureLine[] = [];
  for (const [key, entry] of Object.entries(known)) {
    const value = record[key];
    if (typeof value === "number")
      lines.push({ key: `${prefix}${key}`, label: entry.label, value: entry.format(value) });
  }
  if (record.equivalent === "rect" || record.equivalent === "triangle") {
    lines.push({
      key: `${prefix}equivalent`,
      label: "Stands in for the waveform",
      value: record.equivalent === "triangle" ? "equal-energy triangle" : "equal-energy rectangle",
    });
  }
  return lines;
}

/** A builder's inputs then its figures, each with its symbol and unit. */
export function figureLines(
  _builder: string,
  input: Record<string, unknown>,
  figures: Record<string, unknown>,
): FigureLine[] {
  return [...linesOf(input, "in-"), ...linesOf(figures, "fig-")];
}

/** The live figures of a builder, as a definition list. */
export function FigureList({ figures, testId }: { figures: object; testId?: string }) {
  const lines = linesOf(figures, "");
  return (
    <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 text-sm" data-testid={testId}>
      {lines.map((line) => (
        <Fragment key={line.key}>
          <dt className="text-ink-muted">{line.label}</dt>
          <dd className="num text-right font-mono" data-figure={line.key}>
            {line.value}
          </dd>
        </Fragment>
      ))}
    </dl>
  );
}
