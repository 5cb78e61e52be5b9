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
import type { FosterTerm } from "./foster";
import { waveformRiseVI } from "./thermal-waveform";
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

/** What a record is, whatever part reads it: computed once per record (`recordFigures`). */
export interface RecordFigures {
  /** Largest v_n (V), largest |i_n| (A) and largest p_n = v_n·i_n (W, 0 when none is positive). */
  vMax: number;
  iMaxAbs: number;
  peakPower: number;
  /** Some p_n < −0.01·p_peak: power flowing back, counted as zero (`negative-power-clamped`). */
  negativePower: boolean;
  /** E = ∫ max(p, 0) dt by trapezoids (J), and T_rec = t_last − t_0 (s). */
  energy: number;
  recordLength: number;
}

// A record checked against many parts (a project's candidates) is summed once. Keyed by the pulse object, whose
// sample arrays the engine never changes; the memory goes with the pulse.
const figuresOf = new WeakMap<WaveformPulse, RecordFigures>();
const caseRisesOf = new WeakMap<WaveformPulse, Map<string, number>>();

/** The figures of a record (METHODS.md §6), computed at its first reading and reused for every other part. */
export function recordFigures(pulse: WaveformPulse): RecordFigures {
  const known = figuresOf.get(pulse);
  if (known) return known;
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
  let negativePower = false;
  for (let k = 0; k < n && !negativePower; k++) negativePower = v[k] * i[k] < -0.01 * peakPower;
  const figures: RecordFigures = {
    vMax,
    iMaxAbs,
    peakPower,
    negativePower,
    energy: peakPower > 0 ? recordEnergy(t, v, i) : 0,
    recordLength: t[n - 1] - t[0],
  };
  figuresOf.set(pulse, figures);
  return figures;
}

/**
 * The case's largest rise over a record through the project's case path (METHODS.md §14), the same for every part
 * checked on it: computed once per record, network and start. The network is keyed by its terms' values.
 */
export function recordCaseRise(
  pulse: WaveformPulse,
  network: readonly FosterTerm[],
  steady: boolean,
): number {
  let rises = caseRisesOf.get(pulse);
  if (rises === undefined) {
    rises = new Map();
    caseRisesOf.set(pulse, rises);
  }
  const key = `${steady ? "s" : "r"}${network.map((term) => `${term.r}/${term.tau}`).join(",")}`;
  let rise = rises.get(key);
  if (rise === undefined) {
    rise = waveformRiseVI(pulse.t, pulse.v, pulse.i, network, { steady }).maxRise;
    rises.set(key, rise);
  }
  return rise;
}

/**
 * Reads a waveform (at least two samples, t strictly increasing) on the curves through `reader`, with the
 * derating factor `derating` (k of METHODS.md §5; only its logarithm enters, to order samples when k = 0).
 */
export function readWaveform(reader: CurveReader, pulse: WaveformPulse, derating: number): WaveformReading {
  const { t, v, i } = pulse;
  const n = t.length;
  const { vMax, iMaxAbs, peakPower, negativePower, energy, recordLength } = recordFigures(pulse);
  const flags = negativePower ? FLAG_BIT["negative-power-clamped"] : 0;
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
  const lnEnergy = Math.log(energy);
  const lnRecord = Math.log(recordLength);
  reading.energy = energy;
  reading.equivalentWidth = energy / peakPower;
  reading.flags |= FLAG_BIT["equivalent-rectangle"];
  const lnDerating = Math.log(derating);
  const threshold = READ_CURRENT_SHARE * iMaxAbs;
  reader.flags = 0;
  // Long records: a table of lower bounds on the allowed current lets most samples be classified (flags, no value)
  // without being evaluated, when they cannot beat the largest ratio found so far.
  const bounds =
    n >= SKIP_FROM_SAMPLES && derating > 0
      ? LowerBounds.of(reader, { vMax, peakPower, energy, recordLength })
      : null;
  let best = Number.NEGATIVE_INFINITY;
  let bestRatio = 0;
  let binding: WaveformReading["binding"] = null;
  let anyNoValue = false;
  // With the table, a few samples spread over the record are visited first to seed the largest ratio, so that
  // skipping starts early; then every sample in order (a seed visited twice changes nothing).
  const stride = Math.ceil(n / SEEDS);
  const seeds = bounds === null ? 0 : Math.ceil(n / stride);
  for (let s = 0; s < seeds + n; s++) {
    const k = s < seeds ? s * stride : s - seeds;
    const vk = v[k];
    const ik = i[k];
    if (!(vk > 0 && ik > threshold)) continue;
    let width = energy / (vk * ik);
    const capped = !(width < recordLength);
    if (capped) width = recordLength;
    if (!reader.classify(vk, width)) {
      anyNoValue = true;
      continue;
    }
    if (bounds !== null && ik <= bestRatio * derating * bounds.at(vk, vk * ik)) continue;
    const lnV = Math.log(vk);
    const lnI = Math.log(ik);
    const lnAllowed = reader.evaluate(lnV, width, capped ? lnRecord : lnEnergy - lnV - lnI);
    const lnRatio = lnI - lnAllowed - lnDerating;
    // Ratios within TIE of each other are equal: rounding must not decide which sample binds (earliest wins).
    if (lnRatio > best + TIE || (lnRatio >= best - TIE && binding !== null && k < binding.index)) {
      best = lnRatio;
      bestRatio = Math.exp(lnRatio);
      binding = { index: k, width, lnAllowed };
    }
  }
  if (reading.start === "steady" && v[0] > 0 && i[0] > threshold) {
    // A settled first sample had flowed for as long as it liked: read it at unlimited width as well.
    const lnAllowed = reader.read(v[0], Number.POSITIVE_INFINITY);
    if (Number.isNaN(lnAllowed)) anyNoValue = true;
    else if (Math.log(i[0]) - lnAllowed - lnDerating > best + TIE)
      binding = { index: 0, width: null, lnAllowed };
  }
  reading.flags |= reader.flags;
  reading.anyNoValue = anyNoValue;
  reading.binding = binding;
  return reading;
}

// Two ratios whose logarithms differ by at most this much are a tie (1e-12 relative).
const TIE = 1e-12;
// Records at least this long use the table of lower bounds; shorter ones evaluate every sample.
const SKIP_FROM_SAMPLES = 4096;
// Samples evaluated first, spread over the record, to seed the largest ratio.
const SEEDS = 64;
const VOLTAGE_BINS = 256;
const POWER_BINS = 64;
// Lower bounds are lowered by this share so that rounding can never let a sample be skipped wrongly.
const SAFETY = 1 - 1e-9;

/**
 * Lower bounds of the allowed current (not derated) over cells of voltage × power of one record (METHODS.md §3, §6).
 * A sample at (v, p) is read at width min(E/p, T_rec), no longer than its cell's longest width min(E/p_lo, T_rec),
 * and where no reading can rise with width (every curve at or below every shorter one, and not the thermal
 * reading) the allowed current at that longest width bounds it from below. Over a cell's voltages the log-log
 * reading is linear between digitised voltages, so its least value lies at the cell's ends or at a digitised
 * voltage inside. Cells where a reading has no value bound nothing (0).
 */
class LowerBounds {
  private constructor(
    private readonly table: Float64Array,
    private readonly vScale: number,
    private readonly pScale: number,
  ) {}

  static of(
    reader: CurveReader,
    record: { vMax: number; peakPower: number; energy: number; recordLength: number },
  ): LowerBounds | null {
    if (reader.betweenCurves === "thermal" || !reader.ordered()) return null;
    const { vMax, peakPower, energy, recordLength } = record;
    const saved = reader.flags;
    const voltages = reader.voltages();
    const dv = vMax / VOLTAGE_BINS;
    const dp = peakPower / POWER_BINS;
    const table = new Float64Array(VOLTAGE_BINS * POWER_BINS);
    const lowest = (voltages[0] ?? vMax) / 2;
    for (let b = 0; b < POWER_BINS; b++) {
      const width = b === 0 ? recordLength : Math.min((energy / (b * dp)) * (1 + 1e-9), recordLength);
      for (let a = 0; a < VOLTAGE_BINS; a++) {
        const lo = a === 0 ? Math.min(lowest, dv) : a * dv;
        const hi = (a + 1) * dv;
        let least = Number.POSITIVE_INFINITY;
        const consider = (x: number) => {
          const ln = reader.read(x, width);
          least = Number.isNaN(ln) ? 0 : Math.min(least, Math.exp(ln));
        };
        consider(lo);
        consider(hi);
        for (const x of voltages) if (x > lo && x < hi) consider(x);
        table[a * POWER_BINS + b] = least * SAFETY;
      }
    }
    reader.flags = saved;
    return new LowerBounds(table, VOLTAGE_BINS / vMax, POWER_BINS / peakPower);
  }

  /** A lower bound of the allowed current for a sample at voltage v and power p (0 when none is known). */
  at(v: number, p: number): number {
    const a = Math.min(VOLTAGE_BINS - 1, Math.floor(v * this.vScale));
    const b = Math.min(POWER_BINS - 1, Math.floor(p * this.pScale));
    return this.table[a * POWER_BINS + b];
  }
}
