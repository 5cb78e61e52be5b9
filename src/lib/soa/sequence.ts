// The fault-sequence builder (PRODUCT.md "fault sequence"; METHODS.md §6 checks the result): a fault built as
// one waveform from its pieces, hold in current limit until the timer, turn-off (clamped or in avalanche), pause,
// restart, so that the check sees the combined stress. Each piece alone may pass while the whole does not: the
// junction does not cool between pieces, and the whole record's energy sets the widths read on the curves.
import type { BuilderResult } from "./builders";
import type { WaveformPulse } from "./types";

export type SequenceTurnOff =
  /** The current falls through a clamp at V_cl (above the supply). */
  | { kind: "clamped"; clampVoltage: number }
  /** No clamp below breakdown: the drain sits at V_BR while the current falls (METHODS.md §13). */
  | { kind: "avalanche"; breakdown: number };

export interface SequenceInput {
  id?: string;
  /** Supply V_bus,max in V: the voltage across the transistor while it holds a short in current limit. */
  supply: number;
  /** Current limit I_lim,max in A. */
  limitCurrent: number;
  /** Fault timer t_hold in s: how long each attempt holds the current limit. */
  holdTime: number;
  /** Loop inductance L in H, which drives the current down at turn-off. */
  inductance: number;
  turnOff: SequenceTurnOff;
  /** Restarts after the first attempt (0 to 100); each one holds and turns off again. */
  restarts: number;
  /** Pause before each restart in s (needed when restarts > 0). */
  pause?: number;
}

export interface SequenceFigures {
  /** V during turn-off: V_cl, or V_BR in avalanche. */
  turnOffVoltage: number;
  /** t_off = L·I_lim/(V_off − V_bus) in s. */
  turnOffTime: number;
  /** V_bus·I_lim·t_hold in J. */
  holdEnergy: number;
  /** ½·L·I_lim²·V_off/(V_off − V_bus) in J. */
  turnOffEnergy: number;
  attempts: number;
  /** attempts·(hold + turn-off energy) in J. */
  totalEnergy: number;
  /** V_off·I_lim in W. */
  peakPower: number;
  /** From the first hold's start to the last turn-off's end, in s. */
  length: number;
}

/** Samples along each turn-off ramp: its power is linear in time, but every (v, i) on it is read on the curves. */
const RAMP_STEPS = 8;
const MAX_RESTARTS = 100;

function invalidInput(input: SequenceInput): string | null {
  const positive: Record<string, number> = {
    supply: input.supply,
    limitCurrent: input.limitCurrent,
    holdTime: input.holdTime,
    inductance: input.inductance,
  };
  if (input.turnOff.kind === "clamped") positive.clampVoltage = input.turnOff.clampVoltage;
  else positive.breakdown = input.turnOff.breakdown;
  if (input.restarts > 0) positive.pause = input.pause ?? Number.NaN;
  for (const [name, value] of Object.entries(positive)) {
    if (!(Number.isFinite(value) && value > 0))
      return `${name} must be a finite number greater than 0, got ${value}`;
  }
  if (!(Number.isInteger(input.restarts) && input.restarts >= 0 && input.restarts <= MAX_RESTARTS)) {
    return `restarts must be a whole number from 0 to ${MAX_RESTARTS}, got ${input.restarts}`;
  }
  const off = input.turnOff.kind === "clamped" ? input.turnOff.clampVoltage : input.turnOff.breakdown;
  if (!(off > input.supply)) {
    const name = input.turnOff.kind === "clamped" ? "clampVoltage" : "breakdown";
    return `${name} (${off} V) must exceed the supply (${input.supply} V), else the current never falls`;
  }
  return null;
}

/**
 * Builds the sequence as one waveform pulse starting from rest (0 A at t = 0). Attempt k (k = 0 … restarts) starts
 * at t_k = ε + k·(t_hold + t_off + t_pause): V_bus × I_lim for t_hold, then V_off with the current falling linearly from
 * I_lim to 0 over t_off = L·I_lim/(V_off − V_bus) (the clamp builder's triangle, METHODS.md §11), then 0 A at V_bus
 * for t_pause. Power is piecewise linear between samples (METHODS.md §4), so each step between pieces is a ramp of
 * ε = 10⁻³ of the shortest piece, placed so that the higher power covers the step: the model's power is never below
 * the sequence's at any instant, and its energy exceeds it by at most ½·ε·ΔP per step (conservative; derived).
 */
export function faultSequence(input: SequenceInput): BuilderResult<SequenceFigures> {
  const invalid = invalidInput(input);
  if (invalid !== null) return { ok: false, reason: invalid };
  const { supply, limitCurrent: current, holdTime, inductance, restarts, id = "fault-sequence" } = input;
  const pause = restarts > 0 ? (input.pause as number) : 0;
  const off = input.turnOff.kind === "clamped" ? input.turnOff.clampVoltage : input.turnOff.breakdown;
  const turnOffTime = (inductance * current) / (off - supply);
  const epsilon = 1e-3 * Math.min(holdTime, turnOffTime, restarts > 0 ? pause : Number.POSITIVE_INFINITY);
  const t: number[] = [];
  const v: number[] = [];
  const i: number[] = [];
  const push = (time: number, volts: number, amps: number) => {
    t.push(time);
    v.push(volts);
    i.push(amps);
  };
  const period = holdTime + turnOffTime + pause;
  for (let k = 0; k <= restarts; k++) {
    const start = epsilon + k * period;
    // From rest (or the pause's 0 A) up to the hold within ε before the attempt starts: the record starts at rest.
    push(start - epsilon, supply, 0);
    push(start, supply, current);
    push(start + holdTime - epsilon, supply, current);
    for (let s = 0; s <= RAMP_STEPS; s++) {
      push(start + holdTime + (turnOffTime * s) / RAMP_STEPS, off, current * (1 - s / RAMP_STEPS));
    }
    if (k < restarts) push(start + holdTime + turnOffTime + epsilon, supply, 0);
  }
  const holdEnergy = supply * current * holdTime;
  const turnOffEnergy = ((inductance * current * current) / 2) * (off / (off - supply));
  const pulse: WaveformPulse = { id, kind: "waveform", t, v, i, start: "rest" };
  return {
    ok: true,
    pulses: [pulse],
    figures: {
      turnOffVoltage: off,
      turnOffTime,
      holdEnergy,
      turnOffEnergy,
      attempts: restarts + 1,
      totalEnergy: (restarts + 1) * (holdEnergy + turnOffEnergy),
      peakPower: off * current,
      length: t[t.length - 1] - t[0],
    },
  };
}
