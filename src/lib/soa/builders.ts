// Pulse builders: fault cases derived from the circuit (METHODS.md §11). Each returns the pulses in the check
// contract's form and the intermediate figures an engineer would write down beside them. Inputs are SI
// values; any input that is not finite and > 0 (or breaks a stated relation) gives { ok: false, reason }
// naming it.
//
// Long file: every builder of METHODS.md §11 with its figures, one function each, kept together as one table.
import type { Pulse, RectPulse, TrianglePulse, WaveformPulse } from "./types";

export type BuilderResult<F> = { ok: true; pulses: Pulse[]; figures: F } | { ok: false; reason: string };

function firstInvalid(values: Record<string, number | undefined>): string | null {
  for (const [name, value] of Object.entries(values)) {
    if (value !== undefined && !(Number.isFinite(value) && value > 0)) {
      return `${name} must be a finite number greater than 0, got ${value}`;
    }
  }
  return null;
}

export interface InrushInput {
  id?: string;
  /** Load capacitance C_L in F. */
  capacitance: number;
  /** Output slew rate S = dV/dt in V/s. */
  slew: number;
  /** Supply voltage V_in in V. */
  supply: number;
  /** Resistive load R_L in Ω present from the start; absent: no load during the ramp. */
  load?: number;
  /** Samples of the capture built for a resistive load (default 1001, at least 3). */
  samples?: number;
}

export interface InrushFigures {
  /** Capacitor charging current C_L·S in A (the whole drain current without load). */
  chargeCurrent: number;
  /** Ramp time t_r = V_in/S in s. */
  rampTime: number;
  /** Peak power in the transistor in W, and when it occurs (s from the start). */
  peakPower: number;
  peakPowerTime: number;
  /** Energy in the transistor over the ramp in J. */
  energy: number;
}

/**
 * Inrush into C_L at slew S from V_in. No load: I = C_L·S for t_r = V_in/S while V_DS falls from V_in to 0, a
 * falling triangle of power with peak C_L·S·V_in and energy ½·C_L·V_in² whatever S is. With R_L:
 * P(t) = (V_in − S·t)·(C_L·S + S·t/R_L), peak at t* = (V_in − C_L·S·R_L)/(2S) (at 0 when that is negative),
 * energy ½·C_L·V_in² + V_in³/(6·R_L·S) (derived), given as a capture sampled uniformly over the ramp.
 */
export function inrushPulses(input: InrushInput): BuilderResult<InrushFigures> {
  const { capacitance: c, slew: s, supply: vin, load: r, id = "inrush" } = input;
  const invalid = firstInvalid({ capacitance: c, slew: s, supply: vin, load: r });
  if (invalid !== null) return { ok: false, reason: invalid };
  const samples = input.samples ?? 1001;
  if (!(Number.isInteger(samples) && samples >= 3)) {
    return { ok: false, reason: `samples must be a whole number of at least 3, got ${samples}` };
  }
  const chargeCurrent = c * s;
  const rampTime = vin / s;
  if (r === undefined) {
    const pulse: TrianglePulse = { id, kind: "triangle", v: vin, i: chargeCurrent, duration: rampTime };
    const figures = {
      chargeCurrent,
      rampTime,
      peakPower: vin * chargeCurrent,
      peakPowerTime: 0,
      energy: (c * vin * vin) / 2,
    };
    return { ok: true, pulses: [pulse], figures };
  }
  const power = (t: number) => (vin - s * t) * (chargeCurrent + (s * t) / r);
  const peakPowerTime = Math.max(0, (vin - chargeCurrent * r) / (2 * s));
  const t: number[] = [];
  const v: number[] = [];
  const i: number[] = [];
  for (let k = 0; k < samples; k++) {
    const time = (rampTime * k) / (samples - 1);
    t.push(time);
    v.push(k === samples - 1 ? 0 : vin - s * time);
    i.push(chargeCurrent + (s * time) / r);
  }
  const pulse: WaveformPulse = { id, kind: "waveform", t, v, i };
  const energy = (c * vin * vin) / 2 + vin ** 3 / (6 * r * s);
  return {
    ok: true,
    pulses: [pulse],
    figures: { chargeCurrent, rampTime, peakPower: power(peakPowerTime), peakPowerTime, energy },
  };
}

export interface CurrentLimitInput {
  id?: string;
  /** Highest bus voltage V_bus,max in V. */
  busVoltageMax: number;
  /** Highest current-limit setting I_lim,max in A. */
  currentLimitMax: number;
  /** Longest fault-timer delay t_fault,max in s. */
  faultTimeMax: number;
  /** Auto-retry period in s (must exceed the fault time); absent: one shot, latched off. */
  retryPeriod?: number;
  /** Number of retries before the controller gives up; absent: retries forever. */
  retryCount?: number;
}

export interface CurrentLimitFigures {
  /** V_bus,max·I_lim,max in W. */
  power: number;
  /** Energy of one fault pulse in J. */
  energy: number;
  /** t_fault/T for auto-retry, else null. */
  duty: number | null;
}

/**
 * Current-limit fault until the timer trips: a rectangle V_bus,max × I_lim,max for t_fault,max; auto-retry
 * makes it a periodic train with the retry period (METHODS.md §11).
 */
export function currentLimitFault(input: CurrentLimitInput): BuilderResult<CurrentLimitFigures> {
  const {
    busVoltageMax: v,
    currentLimitMax: i,
    faultTimeMax: t,
    retryPeriod,
    retryCount,
    id = "current-limit",
  } = input;
  const invalid = firstInvalid({ busVoltageMax: v, currentLimitMax: i, faultTimeMax: t, retryPeriod });
  if (invalid !== null) return { ok: false, reason: invalid };
  if (retryPeriod !== undefined && !(retryPeriod > t)) {
    return { ok: false, reason: `retryPeriod (${retryPeriod} s) must be longer than faultTimeMax (${t} s)` };
  }
  if (retryCount !== undefined && !(Number.isInteger(retryCount) && retryCount >= 1)) {
    return { ok: false, reason: `retryCount must be a whole number of at least 1, got ${retryCount}` };
  }
  const pulse: RectPulse = { id, kind: "rect", v, i, duration: t };
  if (retryPeriod !== undefined) {
    pulse.repeat =
      retryCount === undefined ? { period: retryPeriod } : { period: retryPeriod, count: retryCount };
  }
  const figures = {
    power: v * i,
    energy: v * i * t,
    duty: retryPeriod === undefined ? null : t / retryPeriod,
  };
  return { ok: true, pulses: [pulse], figures };
}

/** A component value with its relative tolerance (0.01 for ±1 %). */
export interface Toleranced {
  nominal: number;
  tolerance: number;
}

export interface TripWindowInput {
  /** Current-sense shunt R_sh in Ω. */
  shunt: Toleranced;
  /** Comparator reference V_ref in V. */
  reference: Toleranced;
  /** Divider R1 (top) / R2 (bottom) scaling the reference by k = R2/(R1 + R2); absent: k = 1. */
  divider?: { r1: number; r2: number; tolerance: number };
  /** Comparator input offset ±V_os in V (default 0). */
  offset?: number;
}

export interface TripWindowFigures {
  nominal: number;
  min: number;
  max: number;
}

/**
 * Over-current trip window from tolerances, worst case (not RSS) for the SOA verdict:
 *   k_max = R2(1+ε)/(R2(1+ε) + R1(1−ε)),   k_min = R2(1−ε)/(R2(1−ε) + R1(1+ε)),
 *   I_max = (k_max·V_ref,max + V_os)/R_sh,min,   I_min = (k_min·V_ref,min − V_os)/R_sh,max,
 *   I_nom = k·V_ref/R_sh.
 * A window, not a pulse: no pulses; its maximum feeds `currentLimitFault` or `clampTurnOff`. Tolerances must
 * lie in [0, 1); a window whose minimum is not > 0 is reported as an error.
 */
export function tripWindow(input: TripWindowInput): BuilderResult<TripWindowFigures> {
  const { shunt, reference, divider, offset = 0 } = input;
  const invalid = firstInvalid({
    "shunt.nominal": shunt.nominal,
    "reference.nominal": reference.nominal,
    "divider.r1": divider?.r1,
    "divider.r2": divider?.r2,
  });
  if (invalid !== null) return { ok: false, reason: invalid };
  const tolerances = {
    shunt: shunt.tolerance,
    reference: reference.tolerance,
    divider: divider?.tolerance ?? 0,
  };
  for (const [name, value] of Object.entries(tolerances)) {
    if (!(value >= 0 && value < 1)) {
      return { ok: false, reason: `${name} tolerance must lie in [0, 1), got ${value}` };
    }
  }
  if (!(Number.isFinite(offset) && offset >= 0)) {
    return { ok: false, reason: `offset must be 0 V or more, got ${offset}` };
  }
  const eps = tolerances.divider;
  let k = 1;
  let kMax = 1;
  let kMin = 1;
  if (divider !== undefined) {
    const { r1, r2 } = divider;
    k = r2 / (r1 + r2);
    kMax = (r2 * (1 + eps)) / (r2 * (1 + eps) + r1 * (1 - eps));
    kMin = (r2 * (1 - eps)) / (r2 * (1 - eps) + r1 * (1 + eps));
  }
  const nominal = (k * reference.nominal) / shunt.nominal;
  const max =
    (kMax * reference.nominal * (1 + reference.tolerance) + offset) / (shunt.nominal * (1 - shunt.tolerance));
  const min =
    (kMin * reference.nominal * (1 - reference.tolerance) - offset) / (shunt.nominal * (1 + shunt.tolerance));
  if (!(min > 0)) {
    return { ok: false, reason: `the offset swallows the threshold: minimum trip current ${min} A` };
  }
  return { ok: true, pulses: [], figures: { nominal, min, max } };
}

export interface ClampInput {
  id?: string;
  /** Loop inductance L in H. */
  inductance: number;
  /** Current at the trip decision, I_trip,max in A. */
  tripCurrent: number;
  /** Bus voltage V_bus in V. */
  busVoltage: number;
  /** Clamp voltage V_cl in V (must exceed the bus voltage). */
  clampVoltage: number;
  /** Delay from trip to turn-off in s (default 0). */
  delay?: number;
}

export interface ClampFigures {
  /** I_pk = I_trip,max + (V_bus/L)·t_delay in A. */
  peakCurrent: number;
  /** L·I_pk/(V_cl − V_bus) in s. */
  clampTime: number;
  /** V_cl·I_pk in W. */
  peakPower: number;
  /** ½·L·I_pk²·V_cl/(V_cl − V_bus) in J. */
  energy: number;
}

/**
 * Short with a clamp at turn-off: the current keeps rising for the delay, then falls linearly through the
 * clamp. The transistor sees a falling triangle of peak V_cl·I_pk over the clamp time (METHODS.md §11).
 */
export function clampTurnOff(input: ClampInput): BuilderResult<ClampFigures> {
  const { inductance: l, tripCurrent, busVoltage, clampVoltage, delay = 0, id = "clamp-turn-off" } = input;
  const invalid = firstInvalid({ inductance: l, tripCurrent, busVoltage, clampVoltage });
  if (invalid !== null) return { ok: false, reason: invalid };
  if (!(Number.isFinite(delay) && delay >= 0)) {
    return { ok: false, reason: `delay must be 0 s or more, got ${delay}` };
  }
  if (!(clampVoltage > busVoltage)) {
    return {
      ok: false,
      reason:
        `clampVoltage (${clampVoltage} V) must exceed busVoltage (${busVoltage} V), ` +
        "else the current never falls",
    };
  }
  const margin = clampVoltage - busVoltage;
  const peakCurrent = tripCurrent + (busVoltage / l) * delay;
  const clampTime = (l * peakCurrent) / margin;
  const energy = (((l * peakCurrent * peakCurrent) / 2) * clampVoltage) / margin;
  const pulse: TrianglePulse = { id, kind: "triangle", v: clampVoltage, i: peakCurrent, duration: clampTime };
  return {
    ok: true,
    pulses: [pulse],
    figures: { peakCurrent, clampTime, peakPower: clampVoltage * peakCurrent, energy },
  };
}

export interface UnclampedInput {
  id?: string;
  /** Loop inductance L in H. */
  inductance: number;
  /** Current at the trip decision, I_trip,max in A. */
  tripCurrent: number;
  /** Supply V_DD in V (the bus the inductor discharges against). */
  busVoltage: number;
  /** Delay from trip to turn-off in s (default 0). */
  delay?: number;
}

export interface UnclampedFigures {
  /** I_pk = I_trip,max + (V_bus/L)·t_delay in A. */
  peakCurrent: number;
  /** ½·L·I_pk² in J: the inductor's energy; the transistor takes more, by V_BR/(V_BR − V_DD) (METHODS.md §13). */
  inductorEnergy: number;
}

/**
 * A short turned off with no clamp below breakdown: the current keeps rising for the delay, then the drain rises to
 * each candidate's V_BR and the inductor dumps its energy in the transistor. The pulse is METHODS.md §13's
 * `avalanche` pulse; time in avalanche and energy depend on each candidate's V_BR, so the check works them out.
 */
export function unclampedTurnOff(input: UnclampedInput): BuilderResult<UnclampedFigures> {
  const { inductance: l, tripCurrent, busVoltage, delay = 0, id = "unclamped-turn-off" } = input;
  const invalid = firstInvalid({ inductance: l, tripCurrent, busVoltage });
  if (invalid !== null) return { ok: false, reason: invalid };
  if (!(Number.isFinite(delay) && delay >= 0)) {
    return { ok: false, reason: `delay must be 0 s or more, got ${delay}` };
  }
  const peakCurrent = tripCurrent + (busVoltage / l) * delay;
  return {
    ok: true,
    pulses: [{ id, kind: "avalanche", inductance: l, current: peakCurrent, supply: busVoltage }],
    figures: { peakCurrent, inductorEnergy: (l * peakCurrent * peakCurrent) / 2 },
  };
}
