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
// Z_th per JEDEC JESD24-3. The starting state is rest (θ_i = 0 at t_0) or, with `steady`, settled at the first
// sample's power (θ_i = R_i·p_0; METHODS.md §6). Power below zero is taken as zero: power flowing back never cools
// the junction in a check (METHODS.md §6).
//
// Between samples (METHODS.md §4, v2): inside a segment the rise r(s) has a closed form and its maxima lie at the
// ends or where the rate r'(s) = Σ_i (R_i·p(s) − θ_i(s))/τ_i crosses zero from positive to negative. Each term's
// rate q_i(s) = (R_i·p(s) − θ_i(s))/τ_i is monotone inside a segment (q_i' = (R_i·p' − q_i)/τ_i), but their sum is
// not, so each segment is scanned on a grid that starts at min τ_i/8 and grows by GRID_GROWTH; a segment shorter
// than min τ_i/8 (a dense capture) is tested at its two ends only. Every sign change found is refined by bisection
// to 1e-12 of the segment. Segments are refined only where r could exceed the best rise known: on the segment,
// r(s) ≤ r(0) + s·Σ_i max(q_i(0), q_i(h)) since each q_i is monotone.
//
// Long file: the exact update, its fast paths (one pass over v·i, the trace, the largest rise between samples)
// and their shared step arithmetic must stay bit-for-bit alike, so they are kept side by side.

import type { FosterTerm } from "./foster";

/** Rise over a record: at the sample instants, and its true maximum between samples included. */
export interface WaveformRise {
  /** Largest rise at the sample instants (t_0 included), K. */
  peak: number;
  /** First sample where `peak` is reached; −1 for an empty record or non-finite power. */
  peakIndex: number;
  /** Largest rise over the whole record, between samples included (METHODS.md §4), K. */
  maxRise: number;
  /** When `maxRise` is reached, s (NaN for an empty record or non-finite power). */
  maxTime: number;
  trace?: Float64Array;
}

export interface WaveformRiseOptions {
  /** Keep the rise at every sample. */
  trace?: boolean;
  /** Start settled at the first sample's power (θ_i = R_i·p_0) instead of from rest. */
  steady?: boolean;
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
// The between-samples grid (METHODS.md §4): first point at min τ_i/8, then growing geometrically by this factor.
const GRID_START = 1 / 8;
const GRID_GROWTH = 1.1;
// Bisection on a sign change of the rate stops at this share of the segment (METHODS.md asks 1e-9 in time).
const ROOT_TOLERANCE = 1e-12;

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
 * p = v·i sample by sample, in W (not clamped). Lengths must match (RangeError otherwise). For the rise,
 * waveformRiseVI forms p inside its pass instead of storing it.
 */
export function powerFromVI(v: ArrayLike<number>, i: ArrayLike<number>): Float64Array {
  if (v.length !== i.length) throw new RangeError(`v has ${v.length} samples but i has ${i.length}`);
  const p = new Float64Array(v.length);
  for (let n = 0; n < p.length; n++) p[n] = v[n] * i[n];
  return p;
}

/**
 * Rise in K of Σθ_i for power max(p, 0) (W) at times t (s), from rest or settled (options.steady).
 * Empty input → peak 0, peakIndex −1. Empty network → 0 everywhere. Lengths differing or t decreasing (or NaN)
 * → RangeError; a zero step is a power step at one instant. NaN or infinite power → peaks NaN, peakIndex −1.
 */
export function waveformRise(
  t: ArrayLike<number>,
  p: ArrayLike<number>,
  network: readonly FosterTerm[],
  options?: WaveformRiseOptions,
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
  options?: WaveformRiseOptions,
): WaveformRise {
  const n = t.length;
  if (v.length !== n || i.length !== n) {
    throw new RangeError(`t has ${n} samples but v has ${v.length} and i has ${i.length}`);
  }
  return risePass(t, v, i, 1, network, options);
}

// The second factor of the power for waveformRise, read at index 0 only (stride 0).
const UNIT = Float64Array.of(1);

/** Arrays of a network's terms: R, τ, 1/τ and R/τ. */
interface Terms {
  r: Float64Array;
  tau: Float64Array;
  inverse: Float64Array;
  rate: Float64Array;
  tauMin: number;
}

function termsOf(network: readonly FosterTerm[]): Terms {
  const k = network.length;
  const terms: Terms = {
    r: new Float64Array(k),
    tau: new Float64Array(k),
    inverse: new Float64Array(k),
    rate: new Float64Array(k),
    tauMin: Number.POSITIVE_INFINITY,
  };
  for (let j = 0; j < k; j++) {
    const { r, tau } = network[j];
    terms.r[j] = r;
    terms.tau[j] = tau;
    terms.inverse[j] = 1 / tau;
    terms.rate[j] = r / tau;
    terms.tauMin = Math.min(terms.tauMin, tau);
  }
  return terms;
}

/**
 * The pass behind both entry points, for power p_j = max(a_j·b_(j·bStride), 0) with lengths already checked. Both
 * read the power the same way, so that V8 compiles one loop for both rather than one that deoptimises on the other's
 * input.
 */
function risePass(
  t: ArrayLike<number>,
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  network: readonly FosterTerm[],
  options: WaveformRiseOptions | undefined,
): WaveformRise {
  const n = t.length;
  const trace = options?.trace ? new Float64Array(n) : undefined;
  const steady = options?.steady === true;
  if (n === 0) return withTrace({ peak: 0, peakIndex: -1, maxRise: 0, maxTime: Number.NaN }, trace);

  const terms = termsOf(network);
  const step = uniformStep(t);
  const dense = network.length <= 4 && !Number.isNaN(step) && step < GRID_START * terms.tauMin;
  const result = dense
    ? uniformPass(a, b, bStride, step, terms, steady, trace)
    : generalPass(t, a, b, bStride, terms, steady, trace);
  if (!Number.isFinite(result.last)) {
    return withTrace({ peak: Number.NaN, peakIndex: -1, maxRise: Number.NaN, maxTime: Number.NaN }, trace);
  }
  let maxRise = result.peak;
  let maxTime = t[result.peakIndex];
  // Dense records: search again, between samples, the blocks whose bound beats the best rise at the samples.
  const blocks = result.blockBounds;
  for (let block = 0; block < blocks.length; block++) {
    if (!(blocks[block] > maxRise)) continue;
    const found = replayBlock(terms, a, b, bStride, step, block, result.blockStates, maxRise);
    if (found.rise > maxRise) {
      maxRise = found.rise;
      maxTime = t[found.index] + found.s;
    }
  }
  if (result.between.rise > maxRise) {
    maxRise = result.between.rise;
    maxTime = result.between.time;
  }
  return withTrace({ peak: result.peak, peakIndex: result.peakIndex, maxRise, maxTime }, trace);
}

function power(a: ArrayLike<number>, b: ArrayLike<number>, bStride: number, j: number): number {
  return Math.max(a[j] * b[j * bStride], 0);
}

function withTrace(result: WaveformRise, trace: Float64Array | undefined): WaveformRise {
  if (trace !== undefined) result.trace = trace;
  return result;
}

interface PassResult {
  peak: number;
  peakIndex: number;
  last: number;
  /** Dense records: per block of BLOCK segments, a bound on the rise inside them, and the terms' states at its start. */
  blockBounds: Float64Array;
  blockStates: Float64Array;
  /** Other records: the best maximum found between samples (−∞ when none). */
  between: { rise: number; time: number };
}

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

// Segments per block of a dense pass: the states at each block's start are kept, so that a block whose bound beats
// the best rise can be searched again between its samples.
const BLOCK = 4096;
const NO_BLOCKS = new Float64Array(0);

/**
 * Uniform axis, steps below min τ_i/8, up to four terms: per term θ_(n+1) = θ_n + α·p_n + β·p_(n+1) − (1 − a)·θ_n
 * with α = R·(1 − a − φ), β = R·φ fixed, in one unrolled loop with the state in locals. Unused lanes have R = 0.
 * Per block of BLOCK segments it keeps the states at the block's start and a bound on the rise inside its segments:
 * r(s) ≤ r_n + h·Σ_i R_i·max(p_n, p_(n+1))/τ_i, since every θ_i ≥ 0 makes each rate q_i ≤ R_i·p/τ_i.
 */
function uniformPass(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  h: number,
  terms: Terms,
  steady: boolean,
  trace: Float64Array | undefined,
): PassResult {
  const c = new Float64Array(16);
  let gain = 0;
  for (let lane = 0; lane < terms.r.length; lane++) {
    const x = h / terms.tau[lane];
    const oneMinusA = -Math.expm1(-x);
    const ramp = rampFactor(x);
    c[lane] = oneMinusA;
    c[4 + lane] = terms.r[lane] * (oneMinusA - ramp);
    c[8 + lane] = terms.r[lane] * ramp;
    if (steady) c[12 + lane] = terms.r[lane];
    gain += terms.rate[lane];
  }
  const [e0, e1, e2, e3, al0, al1, al2, al3, be0, be1, be2, be3] = c;
  const hGain = h * gain;
  const n = a.length;
  const blocks = Math.ceil((n - 1) / BLOCK);
  const blockBounds = new Float64Array(blocks);
  const blockStates = new Float64Array(4 * blocks);
  // Without a trace, every sum goes to one slot (stride 0), which ends holding the last sum.
  const out = trace ?? new Float64Array(1);
  const outStride = trace === undefined ? 0 : 1;
  let previous = Math.max(a[0] * b[0], 0);
  // Rest: θ_i = 0; settled: θ_i = R_i·p_0 (c[12..15] hold R_i only when steady).
  let th0 = c[12] * previous;
  let th1 = c[13] * previous;
  let th2 = c[14] * previous;
  let th3 = c[15] * previous;
  let sum = th0 + th1 + th2 + th3;
  out[0] = sum;
  let peak = sum;
  let peakIndex = 0;
  for (let block = 0; block < blocks; block++) {
    blockStates[4 * block] = th0;
    blockStates[4 * block + 1] = th1;
    blockStates[4 * block + 2] = th2;
    blockStates[4 * block + 3] = th3;
    let bound = Number.NEGATIVE_INFINITY;
    const end = Math.min(n, 1 + (block + 1) * BLOCK);
    for (let j = 1 + block * BLOCK; j < end; j++) {
      const current = Math.max(a[j] * b[j * bStride], 0);
      th0 += al0 * previous + be0 * current - e0 * th0;
      th1 += al1 * previous + be1 * current - e1 * th1;
      th2 += al2 * previous + be2 * current - e2 * th2;
      th3 += al3 * previous + be3 * current - e3 * th3;
      const reach = sum + hGain * Math.max(previous, current);
      if (reach > bound) bound = reach;
      sum = th0 + th1 + th2 + th3;
      out[j * outStride] = sum;
      if (sum > peak) {
        peak = sum;
        peakIndex = j;
      }
      previous = current;
    }
    blockBounds[block] = bound;
  }
  return {
    peak,
    peakIndex,
    last: sum,
    blockBounds,
    blockStates,
    between: { rise: Number.NEGATIVE_INFINITY, time: Number.NaN },
  };
}

/**
 * One block of a dense pass again, term by term from its stored states: each segment where the rate turns from
 * positive to negative and whose bound beats `best` is searched between its samples. The update is the pass's own.
 */
function replayBlock(
  terms: Terms,
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  h: number,
  block: number,
  states: Float64Array,
  best: number,
): { rise: number; index: number; s: number } {
  const k = terms.r.length;
  const theta = states.slice(4 * block, 4 * block + k);
  const decay = new Float64Array(k);
  const alpha = new Float64Array(k);
  const beta = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    const x = h / terms.tau[i];
    decay[i] = -Math.expm1(-x);
    alpha[i] = terms.r[i] * (decay[i] - rampFactor(x));
    beta[i] = terms.r[i] * rampFactor(x);
  }
  const found = { rise: Number.NEGATIVE_INFINITY, index: 0, s: 0 };
  const first = block * BLOCK;
  const end = Math.min(a.length - 1, first + BLOCK);
  const old = new Float64Array(k);
  let previous = power(a, b, bStride, first);
  for (let j = first; j < end; j++) {
    const current = power(a, b, bStride, j + 1);
    let before = 0;
    let rateBefore = 0;
    let rateAfter = 0;
    let bound = 0;
    for (let i = 0; i < k; i++) {
      const th = theta[i];
      old[i] = th;
      before += th;
      const next = th + (alpha[i] * previous + beta[i] * current - decay[i] * th);
      theta[i] = next;
      const q0 = terms.rate[i] * previous - terms.inverse[i] * th;
      const q1 = terms.rate[i] * current - terms.inverse[i] * next;
      rateBefore += q0;
      rateAfter += q1;
      bound += Math.max(q0, q1, 0);
    }
    if (rateBefore > 0 && !(rateAfter > 0) && before + h * bound > Math.max(best, found.rise)) {
      const inside = segmentMaximum(terms, old, previous, current, h);
      if (inside.rise > found.rise) {
        found.rise = inside.rise;
        found.index = j;
        found.s = inside.s;
      }
    }
    previous = current;
  }
  return found;
}

/**
 * Any axis and any number of terms: coefficients per step and term, recomputed only when the step length changes.
 * Segments of min τ_i/8 or longer are scanned between their samples at once; shorter ones where their rate turns
 * from positive to negative and their bound beats the best rise so far.
 */
function generalPass(
  t: ArrayLike<number>,
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  bStride: number,
  terms: Terms,
  steady: boolean,
  trace: Float64Array | undefined,
): PassResult {
  const k = terms.r.length;
  const { r, inverse, rate: gain } = terms;
  const theta = new Float64Array(k);
  const old = new Float64Array(k);
  const decay = new Float64Array(k);
  const alpha = new Float64Array(k);
  const beta = new Float64Array(k);
  const n = t.length;
  const out = trace ?? new Float64Array(1);
  const outStride = trace === undefined ? 0 : 1;
  let previous = Math.max(a[0] * b[0], 0);
  let sum = 0;
  for (let i = 0; i < k; i++) {
    theta[i] = steady ? r[i] * previous : 0;
    sum += theta[i];
  }
  out[0] = sum;
  let peak = sum;
  let peakIndex = 0;
  const between = { rise: Number.NEGATIVE_INFINITY, time: Number.NaN };
  let lastStep = Number.NaN;
  for (let j = 1; j < n; j++) {
    const h = t[j] - t[j - 1];
    if (!(h >= 0)) throw new RangeError(`t must be non-decreasing: t[${j}] = ${t[j]} after ${t[j - 1]}`);
    if (h !== lastStep) {
      for (let i = 0; i < k; i++) {
        const x = h / terms.tau[i];
        const oneMinusA = -Math.expm1(-x);
        const ramp = rampFactor(x);
        decay[i] = oneMinusA;
        alpha[i] = r[i] * (oneMinusA - ramp);
        beta[i] = r[i] * ramp;
      }
      lastStep = h;
    }
    const current = Math.max(a[j] * b[j * bStride], 0);
    const before = sum;
    let rateBefore = 0;
    let rateAfter = 0;
    let bound = 0;
    sum = 0;
    for (let i = 0; i < k; i++) {
      const th = theta[i];
      old[i] = th;
      const next = th + (alpha[i] * previous + beta[i] * current - decay[i] * th);
      theta[i] = next;
      sum += next;
      const q0 = gain[i] * previous - inverse[i] * th;
      const q1 = gain[i] * current - inverse[i] * next;
      rateBefore += q0;
      rateAfter += q1;
      bound += Math.max(q0, q1, 0);
    }
    out[j * outStride] = sum;
    if (sum > peak) {
      peak = sum;
      peakIndex = j;
    }
    const sparse = h >= GRID_START * terms.tauMin;
    const turns = rateBefore > 0 && !(rateAfter > 0);
    if (h > 0 && (sparse || turns) && before + h * bound > Math.max(peak, between.rise)) {
      const found = segmentMaximum(terms, old, previous, current, h);
      if (found.rise > between.rise) {
        between.rise = found.rise;
        between.time = t[j - 1] + found.s;
      }
    }
    previous = current;
  }
  return { peak, peakIndex, last: sum, blockBounds: NO_BLOCKS, blockStates: NO_BLOCKS, between };
}

/**
 * Largest rise strictly inside one segment of length h, from the terms' states `theta` at its start, with power
 * linear from p0 to p1: every point where the rate turns from positive to negative on the grid (min τ_i/8, then
 * ×GRID_GROWTH, then h), refined by bisection. −∞ when the rate never turns inside.
 */
function segmentMaximum(
  terms: Terms,
  theta: ArrayLike<number>,
  p0: number,
  p1: number,
  h: number,
): { rise: number; s: number } {
  const slope = (p1 - p0) / h;
  const state = { rise: 0, rate: 0 };
  const at = (s: number) => {
    let rise = 0;
    let rate = 0;
    const p = p0 + slope * s;
    for (let i = 0; i < terms.r.length; i++) {
      const x = s / terms.tau[i];
      const oneMinusA = -Math.expm1(-x);
      const th = theta[i] - oneMinusA * theta[i] + terms.r[i] * (p0 * oneMinusA + (p - p0) * rampFactor(x));
      rise += th;
      rate += terms.rate[i] * p - terms.inverse[i] * th;
    }
    state.rise = rise;
    state.rate = rate;
  };
  let best = { rise: Number.NEGATIVE_INFINITY, s: 0 };
  at(0);
  let sLo = 0;
  let rateLo = state.rate;
  let next = GRID_START * terms.tauMin;
  for (;;) {
    const sHi = Math.min(next, h);
    at(sHi);
    const rateHi = state.rate;
    if (rateLo > 0 && !(rateHi > 0)) {
      let lo = sLo;
      let hi = sHi;
      while (hi - lo > ROOT_TOLERANCE * h) {
        const mid = (lo + hi) / 2;
        at(mid);
        if (state.rate > 0) lo = mid;
        else hi = mid;
      }
      at(lo);
      if (state.rise > best.rise) best = { rise: state.rise, s: lo };
    }
    if (sHi >= h) break;
    sLo = sHi;
    rateLo = rateHi;
    next *= GRID_GROWTH;
  }
  return best;
}
