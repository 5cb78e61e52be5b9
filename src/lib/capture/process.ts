// What the server keeps of a capture besides its samples: the summary (METHODS.md §6: p = v·i, energy, peak, the
// equal-energy rectangle at peak power), min/max-decimated traces for drawing, and the samples themselves as a
// compact binary object (./samples-binary.ts) so that a later check reloads them without parsing the CSV again.
// Pure. Decisions:
// - energy integrates max(p, 0) over the whole capture by the trapezoid rule with a compensated (Neumaier) sum, as
//   the engine does (METHODS.md §6, v2); the equal-energy rectangle is drawn at the peak-power sample;
// - a capture counts as uniform when every time stamp lies within a quarter step of the uniform grid from the first
//   to the last (a scope samples uniformly, but time printed to 8 or 9 significant digits jitters each step by a
//   few per cent; a missing sample or a gap moves stamps by half a step or more);
// - decimation splits the samples into `buckets` runs of equal count (a uniform capture: equal time), each drawn
//   at its first sample's time as [min, max] of the run, so that no spike between drawn points is lost; NaN
//   samples are left out of min and max (a run of only NaN gives [NaN, NaN]);
// - the binary form of the samples is in ./samples-binary.ts.
import type { CaptureSummary, CaptureTrace } from "@/db/schema";
import { recordEnergy, waveformEquivalent } from "@/lib/soa/equivalent-rectangle";
import type { FosterTerm } from "@/lib/soa/foster";
import { powerFromVI, waveformRise } from "@/lib/soa/thermal-waveform";
import type { RecordStart } from "@/lib/soa/types";
import { recordStart } from "@/lib/soa/waveform-check";
import type { CaptureSamples } from "./parse-stream";

/** Points per series of a drawn trace. */
export const TRACE_BUCKETS = 2000;

const UNIFORM_TOLERANCE = 0.25;

export interface MinMaxTrace {
  t: number[];
  y: [number, number][];
}

/**
 * Min/max decimation of y(t) into at most `buckets` runs of (nearly) equal sample count; fewer samples than
 * buckets keep every sample ([y, y]). Lengths may differ: the shorter one counts. Empty input → empty trace.
 */
export function decimateMinMax(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  buckets = TRACE_BUCKETS,
): MinMaxTrace {
  const n = Math.min(t.length, y.length);
  const count = Math.min(n, Math.max(1, Math.floor(buckets)));
  const out: MinMaxTrace = { t: new Array(count), y: new Array(count) };
  for (let b = 0; b < count; b++) {
    const first = Math.floor((b * n) / count);
    const end = Math.floor(((b + 1) * n) / count);
    let min = Number.POSITIVE_INFINITY;
    let max = Number.NEGATIVE_INFINITY;
    for (let k = first; k < end; k++) {
      const value = y[k];
      if (value < min) min = value;
      if (value > max) max = value;
    }
    out.t[b] = t[first];
    out.y[b] = min <= max ? [min, max] : [Number.NaN, Number.NaN];
  }
  return out;
}

/**
 * Summary of a capture with power p (p = v·i, see `powerFromVI`). Peak power and its time are those of the first
 * sample of maximum p. Fewer than one sample → RangeError.
 */
export function summariseCapture(
  t: ArrayLike<number>,
  v: ArrayLike<number>,
  i: ArrayLike<number>,
  p: ArrayLike<number>,
): CaptureSummary {
  const n = t.length;
  if (n < 1 || v.length !== n || i.length !== n || p.length !== n) {
    throw new RangeError(`a capture needs one or more samples of t, v, i and p of equal length (t has ${n})`);
  }
  const t0 = t[0];
  const meanStep = n > 1 ? (t[n - 1] - t0) / (n - 1) : 0;
  const tolerance = UNIFORM_TOLERANCE * meanStep;
  let uniform = true;
  let vMax = Number.NEGATIVE_INFINITY;
  let iMaxAbs = 0;
  let pPeak = Number.NEGATIVE_INFINITY;
  let peakIndex = 0;
  for (let k = 0; k < n; k++) {
    if (v[k] > vMax) vMax = v[k];
    const current = Math.abs(i[k]);
    if (current > iMaxAbs) iMaxAbs = current;
    if (p[k] > pPeak) {
      pPeak = p[k];
      peakIndex = k;
    }
    if (Math.abs(t[k] - (t0 + k * meanStep)) > tolerance) uniform = false;
  }
  const rect = waveformEquivalent(t, p);
  return {
    samples: n,
    uniform,
    tStart: t[0],
    tEnd: t[n - 1],
    vMax,
    iMaxAbs,
    pPeak,
    tPeak: t[peakIndex],
    energy: n > 1 ? recordEnergy(t, p) : 0,
    equivalent:
      n < 2
        ? { ok: false, flag: "too-few-samples" }
        : rect.ok
          ? {
              ok: true,
              v: Math.abs(v[rect.peakIndex]),
              i: Math.abs(i[rect.peakIndex]),
              duration: rect.duration,
            }
          : { ok: false, flag: rect.flag },
  };
}

/** The drawn trace of a capture: V, I and P decimated on the same buckets. */
export function captureTrace(
  t: ArrayLike<number>,
  v: ArrayLike<number>,
  i: ArrayLike<number>,
  p: ArrayLike<number>,
  buckets = TRACE_BUCKETS,
): CaptureTrace {
  const dv = decimateMinMax(t, v, buckets);
  return { t: dv.t, v: dv.y, i: decimateMinMax(t, i, buckets).y, p: decimateMinMax(t, p, buckets).y };
}

export interface ProcessedCapture {
  p: Float64Array;
  summary: CaptureSummary;
  trace: CaptureTrace;
}

/** Power, summary and drawn trace of parsed samples. */
export function processCapture(samples: CaptureSamples, buckets = TRACE_BUCKETS): ProcessedCapture {
  const { t, v, i } = samples;
  const p = powerFromVI(v, i);
  return { p, summary: summariseCapture(t, v, i, p), trace: captureTrace(t, v, i, p, buckets) };
}

export interface JunctionTrace {
  /** Highest junction temperature over the record, between samples included, °C. */
  tjPeak: number;
  /** When it is reached, s. */
  tPeak: number;
  /** Whether the trace starts from rest or settled at the first sample's power (METHODS.md §6). */
  start: RecordStart;
  /** Tj in °C, decimated like the capture's trace. */
  trace: MinMaxTrace;
}

/**
 * Junction temperature through a capture on a Foster network at `caseTemp` (METHODS.md §4, the engine's exact
 * update), from the start the check uses (METHODS.md §6: as stated at upload, else decided from the data), with
 * its decimated trace. Power below zero counts as zero, as in the check. With a case path (METHODS.md §14) the case
 * heats through it from the same power: the junction's trace is the response of both networks' terms together, as
 * in the check, so its peak is the check's T_j,peak.
 */
export function junctionTrace(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  network: readonly FosterTerm[],
  caseTemp: number,
  {
    start: given = null,
    buckets = TRACE_BUCKETS,
    caseNetwork = null,
    peakPower,
  }: {
    start?: RecordStart | null;
    buckets?: number;
    caseNetwork?: readonly FosterTerm[] | null;
    /** max(p, 0) when already known (a job checking many candidates passes the summary's). */
    peakPower?: number;
  } = {},
): JunctionTrace {
  return riseTrace(
    t,
    p,
    caseNetwork?.length ? [...network, ...caseNetwork] : network,
    caseTemp,
    given,
    buckets,
    peakPower,
  );
}

/**
 * The case temperature through a capture on the case path (METHODS.md §14): T_C + ΔT_ca from the same power and the
 * same start as the junction's trace, for drawing beside it.
 */
export function caseTrace(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  caseNetwork: readonly FosterTerm[],
  caseTemp: number,
  options: { start?: RecordStart | null; buckets?: number; peakPower?: number } = {},
): JunctionTrace {
  // The case path alone: the junction's trace of the same power on that network, with no further path below it.
  return junctionTrace(t, p, caseNetwork, caseTemp, { ...options, caseNetwork: null });
}

function riseTrace(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  network: readonly FosterTerm[],
  base: number,
  given: RecordStart | null,
  buckets: number,
  knownPeak?: number,
): JunctionTrace {
  let peakPower = Math.max(knownPeak ?? 0, 0);
  if (knownPeak === undefined) for (let k = 0; k < p.length; k++) if (p[k] > peakPower) peakPower = p[k];
  const { start } = recordStart(Math.max(p[0] ?? 0, 0), peakPower, given ?? undefined);
  const rise = waveformRise(t, p, network, { trace: true, steady: start === "steady" });
  const temperature = rise.trace ?? new Float64Array(0);
  for (let k = 0; k < temperature.length; k++) temperature[k] += base;
  return {
    tjPeak: base + rise.maxRise,
    tPeak: rise.maxTime,
    start,
    trace: decimateMinMax(t, temperature, buckets),
  };
}
