// A captured waveform read on the curves (METHODS.md §6, v2). Power p_n = max(v_n·i_n, 0); E is the trapezoid
// integral of p over the whole record and t_eq = E/p_peak. Every sample with v_n > 0 and i_n > 0.001·max|i| is
// read at its own voltage and its own width t_n = min(E/p_n, T_rec), T_rec = t_last − t_0: a phase at power p_n
// lasting d holds p_n·d ≤ E and cannot outlast the record, so each phase is read at a width no shorter than its
// own. The ratio r_n = i_n/(k·I_allowed(t_n, v_n)) is largest at the binding sample (the earliest on ties). When
// the record starts settled, its first sample is also read at unlimited width (the DC curve). What came before
// the record: `start` as given, else rest when p_0 < 0.01·p_peak and otherwise settled, flagged
// `starts-mid-pulse`; p_last ≥ 0.01·p_peak flags `ends-mid-pulse`.
import { type CurveReader, FLAG_BIT } from "./curve-reader";
import { recordEnergy } from "./equivalent-rectangle";
import type { RecordStart, WaveformPulse } from "./types";

/** Share of the peak power at which a record's first or last sample counts as inside a pulse (METHODS.md §6). */
export const MID_PULSE_SHARE = 0.01;
/** Share of the record's largest |i| below which a sample is not read on the curves (probe noise, leakage). */
export const READ_CURRENT_SHARE = 0.001;

/**
 * What came before a record (METHODS.md §6): the start given, else rest when p_0 < 0.01·p_peak and otherwise a
 * settled level, decided by the engine (which caps the verdict). `startsMidPulse` whenever p_0 ≥ 0.01·p_peak.
 */
export function recordStart(
  firstPower: number,
  peakPower: number,
  given?: RecordStart,
): { start: RecordStart; decided: boolean; startsMidPulse: boolean } {
  const startsMidPulse = peakPower > 0 && firstPower >= MID_PULSE_SHARE * peakPower;
  if (given !== undefined) return { start: given, decided: false, startsMidPulse };
  return { start: startsMidPulse ? "steady" : "rest", decided: startsMidPulse, startsMidPulse };
}

export interface WaveformReading {
  /** Largest v_n (V) and |i_n| (A), for the hard limits. */
  vMax: number;
  iMaxAbs: number;
  peakPower: number;
  energy: number;
  /** t_eq = E/p_peak in s; null without power. */
  equivalentWidth: number | null;
  /** The start used for the thermal trace, and whether the engine decided it (which caps the verdict). */
  start: RecordStart;
  startDecided: boolean;
  endsMidPulse: boolean;
  /** Flags raised (a mask of FLAG_BIT), the curve readings' included. */
  flags: number;
  /** Some read sample had no value on the curves. */
  anyNoValue: boolean;
  /** The binding sample with its reading; null when no read sample had a value. */
  binding: { index: number; width: number | null; lnAllowed: number } | null;
}

/**
 * Reads a waveform (at least two samples, t strictly increasing) on the curves through `reader`, with the
 * derating factor `derating` (k of METHODS.md §5; only its logarithm enters, to order samples when k = 0).
 */
export function readWaveform(reader: CurveReader, pulse: WaveformPulse, derating: number): WaveformReading {
  const { t, v, i } = pulse;
  const n = t.length;
  let vMax = Number.NEGATIVE_INFINITY;
  let iMaxAbs = 0;
  let peakPower = 0;
  for (let k = 0; k < n; k++) {
    vMax = Math.max(vMax, v[k]);
    iMaxAbs = Math.max(iMaxAbs, Math.abs(i[k]));
    peakPower = Math.max(peakPower, v[k] * i[k]);
  }
  let flags = 0;
  for (let k = 0; k < n; k++) {
    if (v[k] * i[k] < -0.01 * peakPower) {
      flags |= FLAG_BIT["negative-power-clamped"];
      break;
    }
  }
  const reading: WaveformReading = {
    vMax,
    iMaxAbs,
    peakPower,
    energy: 0,
    equivalentWidth: null,
    start: pulse.start ?? "rest",
    startDecided: false,
    endsMidPulse: false,
    flags,
    anyNoValue: false,
    binding: null,
  };
  if (!(peakPower > 0)) {
    reading.flags |= FLAG_BIT["no-power"];
    return reading;
  }
  const power = (k: number) => Math.max(v[k] * i[k], 0);
  const begin = recordStart(power(0), peakPower, pulse.start);
  if (begin.startsMidPulse) reading.flags |= FLAG_BIT["starts-mid-pulse"];
  reading.start = begin.start;
  reading.startDecided = begin.decided;
  if (power(n - 1) >= MID_PULSE_SHARE * peakPower) {
    reading.endsMidPulse = true;
    reading.flags |= FLAG_BIT["ends-mid-pulse"];
  }
  const energy = recordEnergy(t, v, i);
  const recordLength = t[n - 1] - t[0];
  const lnEnergy = Math.log(energy);
  const lnRecord = Math.log(recordLength);
  reading.energy = energy;
  reading.equivalentWidth = energy / peakPower;
  reading.flags |= FLAG_BIT["equivalent-rectangle"];
  const lnDerating = Math.log(derating);
  const threshold = READ_CURRENT_SHARE * iMaxAbs;
  reader.flags = 0;
  let best = Number.NEGATIVE_INFINITY;
  let binding: WaveformReading["binding"] = null;
  let anyNoValue = false;
  for (let k = 0; k < n; k++) {
    const vk = v[k];
    const ik = i[k];
    if (!(vk > 0 && ik > threshold)) continue;
    const lnV = Math.log(vk);
    const lnI = Math.log(ik);
    let width = energy / (vk * ik);
    let lnWidth = lnEnergy - lnV - lnI;
    if (!(width < recordLength)) {
      width = recordLength;
      lnWidth = lnRecord;
    }
    const lnAllowed = reader.readLn(lnV, width, lnWidth);
    if (Number.isNaN(lnAllowed)) {
      anyNoValue = true;
      continue;
    }
    const lnRatio = lnI - lnAllowed - lnDerating;
    if (lnRatio > best) {
      best = lnRatio;
      binding = { index: k, width, lnAllowed };
    }
  }
  if (reading.start === "steady" && v[0] > 0 && i[0] > threshold) {
    // A settled first sample had flowed for as long as it liked: read it at unlimited width as well.
    const lnV = Math.log(v[0]);
    const lnAllowed = reader.readLn(lnV, Number.POSITIVE_INFINITY, Number.POSITIVE_INFINITY);
    if (Number.isNaN(lnAllowed)) anyNoValue = true;
    else if (Math.log(i[0]) - lnAllowed - lnDerating > best) binding = { index: 0, width: null, lnAllowed };
  }
  reading.flags |= reader.flags;
  reading.anyNoValue = anyNoValue;
  reading.binding = binding;
  return reading;
}
