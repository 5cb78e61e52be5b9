// Junction rise for a sampled power waveform on a Foster network: the exact update (METHODS.md §4).
//
// Power is taken piecewise-linear between samples. Over one step h = t_(n+1) − t_n, each term of
// dθ_i/dt = (R_i·p − θ_i)/τ_i has the exact solution, with x = h/τ_i and a = e^(−x),
//
//   θ_(n+1) = a·θ_n + R_i·[ p_n·(1 − a) + (p_(n+1) − p_n)·φ(x) ],   φ(x) = 1 − (1 − a)/x
//
// so the result is exact for any step length (no stability limit, no truncation error): only rounding remains.
// 1 − a is −expm1(−x); φ cancels badly for small x, so below x = 1/4 it comes from its Taylor series. The update
// is applied as θ += α·p_n + β·p_(n+1) − (1 − a)·θ: a itself, rounded next to 1 when h ≪ τ, would carry a
// relative error of up to 1e-16/x into the decay rate on every step, whereas 1 − a keeps full relative precision.
// Cost is O(N·K) in one pass. A uniform time axis (the usual capture) shares one set of coefficients per term;
// a non-uniform one recomputes them per step, reusing them while the step repeats exactly. From a capture, p = v·i
// is formed sample by sample inside the same pass (waveformRiseVI) rather than stored first.
// Z_th per JEDEC JESD24-3; the starting state is rest (θ_i = 0 at t_0).

import type { FosterTerm } from "./foster";

/** Peak rise over the sample instants (t_0 included, where the rise is 0), and optionally the whole trace. */
export interface WaveformRise {
  peak: number;
  peakIndex: number;
  trace?: Float64Array;
}

// φ(x) = Σ_(k≥1) (−x)^(k−1)·x/(k+1)!; 13 terms reach full double precision for x < 1/4.
const SERIES_LIMIT = 0.25;
const SERIES = Float64Array.from({ length: 13 }, (_, k) => {
  let factorial = 1;
  for (let j = 2; j <= k + 2; j++) factorial *= j;
  return 1 / factorial;
});

// Relative tolerance on the step length under which a time axis counts as uniform.
const UNIFORM_TOLERANCE = 1e-9;

/** φ(x) = 1 − (1 − e^(−x))/x, the weight of a linear power change over a step of x time constants. φ(0) = 0. */
export function rampFactor(x: number): number {
  if (x < SERIES_LIMIT) {
    let sum = SERIES[SERIES.length - 1];
    for (let k = SERIES.length - 2; k >= 0; k--) sum = SERIES[k] - x * sum;
    return x * sum;
  }
  return 1 + Math.expm1(-x) / x;
}

/**
 * p = v·i sample by sample, in W. Lengths must match (RangeError otherwise). For the rise, waveformRiseVI forms p
 * inside its pass instead of storing it.
 */
export function powerFromVI(v: ArrayLike<number>, i: ArrayLike<number>): Float64Array {
  if (v.length !== i.length) throw new RangeError(`v has ${v.length} samples but i has ${i.length}`);
  const p = new Float64Array(v.length);
  for (let n = 0; n < p.length; n++) p[n] = v[n] * i[n];
  return p;
}

/**
 * Rise in K of Σθ_i at the sample instants for power p (W) at times t (s), from rest.
 * Empty input → peak 0, peakIndex −1. Empty network → 0 everywhere. Lengths differing or t decreasing (or NaN)
 * → RangeError; a zero step is a power step at one instant. NaN or infinite power → peak NaN, peakIndex −1.
 */
export function waveformRise(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  network: readonly FosterTerm[],
  options?: { trace?: boolean },
): WaveformRise {
  if (p.length !== t.length) throw new RangeError(`t has ${t.length} samples but p has ${p.length}`);
  // p·1 is p exactly (−0, ±∞ and NaN included), so this is the same pass as waveformRiseVI.
  return risePass(t, p, UNIT, 0, network, options);
}

/**
 * waveformRise(t, powerFromVI(v, i), network, options) with p = v·i formed sample by sample inside the pass, so the
 * power is never stored: the same result, bit for bit. Lengths of t, v and i differing → RangeError.
 */
export function waveformRiseVI(
  t: ArrayLike<number>,
  v: ArrayLike<number>,
  i: ArrayLike<number>,
  network: readonly FosterTerm[],
  options?: { trace?: boolean },
): WaveformRise {
  const n = t.length;
  if (v.length !== n || i.length !== n) {
    throw new RangeError(`t has ${n} samples but v has ${v.length} and i has ${i.length}`);
  }
  return risePass(t, v, i, 1, network, options);
}

// The second factor of the power for waveformRise, read at index 0 only (stride 0).
const UNIT = Float64Array.of(1);

/**
 * The pass behind both entry points, for power p_j = a_j·b_(j·bStride) with lengths already checked. Both read the
 * power the same way, so that V8 compiles one loop for both rather than one that deoptimises on the other's input.
 */
function risePass(
  t: ArrayLike<number>,
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  network: readonly FosterTerm[],
  options: { trace?: boolean } | undefined,
): WaveformRise {
  const n = t.length;
  const trace = options?.trace ? new Float64Array(n) : undefined;
  if (n === 0) return withTrace({ peak: 0, peakIndex: -1 }, trace);

  const step = uniformStep(t);
  const result = Number.isNaN(step)
    ? generalPass(t, a, b, bStride, network, trace)
    : uniformPasses(a, b, bStride, step, network, trace);
  if (!Number.isFinite(result.last)) return withTrace({ peak: Number.NaN, peakIndex: -1 }, trace);
  return withTrace({ peak: result.peak, peakIndex: result.peakIndex }, trace);
}

function withTrace(result: WaveformRise, trace: Float64Array | undefined): WaveformRise {
  if (trace !== undefined) result.trace = trace;
  return result;
}

interface PassResult {
  peak: number;
  peakIndex: number;
  last: number;
}

// Stands in for the partial sums of earlier term groups when there are none: read at index 0 only (stride 0).
const NO_PARTIAL_SUMS = new Float64Array(1);

/** The common step if every step is within UNIFORM_TOLERANCE of the mean step, else NaN. */
function uniformStep(t: ArrayLike<number>): number {
  const n = t.length;
  if (n < 2) return 0;
  const mean = (t[n - 1] - t[0]) / (n - 1);
  if (!(mean >= 0)) return Number.NaN;
  // Time stamps like j·h carry their own rounding, a few ulps of the largest |t|: that is not non-uniformity.
  const tolerance =
    UNIFORM_TOLERANCE * mean + 4 * Number.EPSILON * Math.max(Math.abs(t[0]), Math.abs(t[n - 1]));
  let previous = t[0];
  for (let j = 1; j < n; j++) {
    const current = t[j];
    if (!(Math.abs(current - previous - mean) <= tolerance)) return Number.NaN;
    previous = current;
  }
  return mean;
}

/**
 * Uniform axis: per term θ_(n+1) = θ_n + α·p_n + β·p_(n+1) − (1 − a)·θ_n with α = R·(1 − a − φ), β = R·φ fixed.
 * Terms go four at a time through one unrolled sample-major loop (state in locals, one read of p per sample); with
 * more than four terms, earlier groups leave their partial sums in a buffer the next group adds to. Power is
 * p_j = a_j·b_(j·bStride), formed again by every group: the same product each time.
 */
function uniformPasses(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  h: number,
  network: readonly FosterTerm[],
  trace: Float64Array | undefined,
): PassResult {
  const n = a.length;
  const groups = Math.max(1, Math.ceil(network.length / 4));
  // Without a trace, the last group writes every sum to one slot (stride 0), which ends holding the last sum.
  const lastSum = new Float64Array(1);
  const partial = groups > 1 ? (trace ?? new Float64Array(n)) : NO_PARTIAL_SUMS;
  const coefficients = new Float64Array(12);
  let result = { peak: 0, peakIndex: 0 };
  for (let g = 0; g < groups; g++) {
    coefficients.fill(0);
    for (let lane = 0; lane < 4; lane++) {
      const term = network[4 * g + lane];
      if (term === undefined) continue;
      const x = h / term.tau;
      const oneMinusA = -Math.expm1(-x);
      const ramp = rampFactor(x);
      coefficients[lane] = oneMinusA;
      coefficients[4 + lane] = term.r * (oneMinusA - ramp);
      coefficients[8 + lane] = term.r * ramp;
    }
    const first = g === 0;
    const toPartial = g < groups - 1;
    const out = toPartial ? partial : (trace ?? lastSum);
    const outStride = toPartial || trace !== undefined ? 1 : 0;
    result = uniformGroup(
      a,
      b,
      bStride,
      coefficients,
      first ? NO_PARTIAL_SUMS : partial,
      first ? 0 : 1,
      out,
      outStride,
    );
  }
  const last = trace === undefined ? lastSum[0] : trace[n - 1];
  return { peak: result.peak, peakIndex: result.peakIndex, last };
}

/**
 * One group of up to four terms over all samples. acc (partial sums in) and out (sums out) are read and written
 * with a stride of 1, or 0 where they are single slots, so that every call runs the same loop body: an operation
 * first reached inside V8's optimised loop (a trace store an earlier call skipped) would drop the rest of the pass
 * back to the interpreter. Power is p_j = a_j·b_(j·bStride), as in uniformPasses.
 */
function uniformGroup(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  c: Float64Array,
  acc: Float64Array,
  accStride: number,
  out: Float64Array,
  outStride: number,
): { peak: number; peakIndex: number } {
  const e0 = c[0];
  const e1 = c[1];
  const e2 = c[2];
  const e3 = c[3];
  const al0 = c[4];
  const al1 = c[5];
  const al2 = c[6];
  const al3 = c[7];
  const be0 = c[8];
  const be1 = c[9];
  const be2 = c[10];
  const be3 = c[11];
  const n = a.length;
  let th0 = 0;
  let th1 = 0;
  let th2 = 0;
  let th3 = 0;
  let peak = 0;
  let peakIndex = 0;
  out[0] = 0;
  let previous = a[0] * b[0];
  for (let j = 1; j < n; j++) {
    const current = a[j] * b[j * bStride];
    th0 += al0 * previous + be0 * current - e0 * th0;
    th1 += al1 * previous + be1 * current - e1 * th1;
    th2 += al2 * previous + be2 * current - e2 * th2;
    th3 += al3 * previous + be3 * current - e3 * th3;
    const sum = th0 + th1 + th2 + th3 + acc[j * accStride];
    out[j * outStride] = sum;
    if (sum > peak) {
      peak = sum;
      peakIndex = j;
    }
    previous = current;
  }
  return { peak, peakIndex };
}

/**
 * Non-uniform axis: coefficients per step and term, recomputed only when the step length changes. Power is
 * p_j = a_j·b_(j·bStride), as in uniformPasses.
 */
function generalPass(
  t: ArrayLike<number>,
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  network: readonly FosterTerm[],
  trace: Float64Array | undefined,
): PassResult {
  const k = network.length;
  const r = new Float64Array(k);
  const tau = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    r[i] = network[i].r;
    tau[i] = network[i].tau;
  }
  const theta = new Float64Array(k);
  const decay = new Float64Array(k);
  const alpha = new Float64Array(k);
  const beta = new Float64Array(k);
  const n = t.length;
  // As in uniformGroup: without a trace, every sum goes to one slot (stride 0).
  const out = trace ?? new Float64Array(1);
  const outStride = trace === undefined ? 0 : 1;
  let lastStep = Number.NaN;
  let peak = 0;
  let peakIndex = 0;
  out[0] = 0;
  let previous = a[0] * b[0];
  for (let j = 1; j < n; j++) {
    const h = t[j] - t[j - 1];
    if (!(h >= 0)) throw new RangeError(`t must be non-decreasing: t[${j}] = ${t[j]} after ${t[j - 1]}`);
    if (h !== lastStep) {
      for (let i = 0; i < k; i++) {
        const x = h / tau[i];
        const oneMinusA = -Math.expm1(-x);
        const ramp = rampFactor(x);
        decay[i] = oneMinusA;
        alpha[i] = r[i] * (oneMinusA - ramp);
        beta[i] = r[i] * ramp;
      }
      lastStep = h;
    }
    const current = a[j] * b[j * bStride];
    let sum = 0;
    for (let i = 0; i < k; i++) {
      const th = theta[i];
      const next = th + (alpha[i] * previous + beta[i] * current - decay[i] * th);
      theta[i] = next;
      sum += next;
    }
    out[j * outStride] = sum;
    if (sum > peak) {
      peak = sum;
      peakIndex = j;
    }
    previous = current;
  }
  return { peak, peakIndex, last: out[(n - 1) * outStride] };
}
