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

/** A segment to search between its samples: its first sample, the terms' states there and a bound on its rise. */
interface Candidate {
  index: number;
  theta: Float64Array;
  bound: number;
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
  // Dense records: refine the segments the pass kept, most promising first, while one can still beat the best.
  result.candidates.sort((x, y) => y.bound - x.bound);
  for (const candidate of result.candidates) {
    if (candidate.bound <= maxRise) break;
    const j = candidate.index;
    const found = segmentMaximum(
      terms,
      candidate.theta,
      power(a, b, bStride, j),
      power(a, b, bStride, j + 1),
      step,
    );
    if (found.rise > maxRise) {
      maxRise = found.rise;
      maxTime = t[j] + found.s;
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
  /** Dense records: segments where the rate turns from positive to negative, kept for refinement. */
  candidates: Candidate[];
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

/**
 * Uniform axis, steps below min τ_i/8, up to four terms: per term θ_(n+1) = θ_n + α·p_n + β·p_(n+1) − (1 − a)·θ_n
 * with α = R·(1 − a − φ), β = R·φ fixed, in one unrolled loop with the state in locals. The rate Σ(R_i·p − θ_i)/τ_i
 * is followed too; where it turns from positive to negative and the segment's bound beats the best rise so far, the
 * segment is kept for refinement. Unused lanes have R = 0 and 1/τ = 0.
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
  const c = new Float64Array(24);
  for (let lane = 0; lane < terms.r.length; lane++) {
    const x = h / terms.tau[lane];
    const oneMinusA = -Math.expm1(-x);
    const ramp = rampFactor(x);
    c[lane] = oneMinusA;
    c[4 + lane] = terms.r[lane] * (oneMinusA - ramp);
    c[8 + lane] = terms.r[lane] * ramp;
    c[12 + lane] = terms.inverse[lane];
    c[16 + lane] = terms.rate[lane];
    if (steady) c[20 + lane] = terms.r[lane];
  }
  const [e0, e1, e2, e3, al0, al1, al2, al3, be0, be1, be2, be3, w0, w1, w2, w3, g0, g1, g2, g3] = c;
  const n = a.length;
  // Without a trace, every sum goes to one slot (stride 0), which ends holding the last sum.
  const out = trace ?? new Float64Array(1);
  const outStride = trace === undefined ? 0 : 1;
  let previous = Math.max(a[0] * b[0], 0);
  // Rest: θ_i = 0; settled: θ_i = R_i·p_0 (c[20..23] hold R_i only when steady).
  let th0 = c[20] * previous;
  let th1 = c[21] * previous;
  let th2 = c[22] * previous;
  let th3 = c[23] * previous;
  let sum = th0 + th1 + th2 + th3;
  out[0] = sum;
  let peak = sum;
  let peakIndex = 0;
  const candidates: Candidate[] = [];
  let q0 = g0 * previous - w0 * th0;
  let q1 = g1 * previous - w1 * th1;
  let q2 = g2 * previous - w2 * th2;
  let q3 = g3 * previous - w3 * th3;
  let rate = q0 + q1 + q2 + q3;
  for (let j = 1; j < n; j++) {
    const current = Math.max(a[j] * b[j * bStride], 0);
    const o0 = th0;
    const o1 = th1;
    const o2 = th2;
    const o3 = th3;
    th0 += al0 * previous + be0 * current - e0 * th0;
    th1 += al1 * previous + be1 * current - e1 * th1;
    th2 += al2 * previous + be2 * current - e2 * th2;
    th3 += al3 * previous + be3 * current - e3 * th3;
    const before = sum;
    sum = th0 + th1 + th2 + th3;
    out[j * outStride] = sum;
    if (sum > peak) {
      peak = sum;
      peakIndex = j;
    }
    const n0 = g0 * current - w0 * th0;
    const n1 = g1 * current - w1 * th1;
    const n2 = g2 * current - w2 * th2;
    const n3 = g3 * current - w3 * th3;
    const nextRate = n0 + n1 + n2 + n3;
    if (rate > 0 && !(nextRate > 0)) {
      const bound =
        before + h * (Math.max(q0, n0, 0) + Math.max(q1, n1, 0) + Math.max(q2, n2, 0) + Math.max(q3, n3, 0));
      if (bound > peak) {
        candidates.push({
          index: j - 1,
          theta: Float64Array.of(o0, o1, o2, o3).subarray(0, terms.r.length),
          bound,
        });
      }
    }
    q0 = n0;
    q1 = n1;
    q2 = n2;
    q3 = n3;
    rate = nextRate;
    previous = current;
  }
  return {
    peak,
    peakIndex,
    last: sum,
    candidates,
    between: { rise: Number.NEGATIVE_INFINITY, time: Number.NaN },
  };
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
  return { peak, peakIndex, last: sum, candidates: [], between };
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
