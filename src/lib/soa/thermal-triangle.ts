// Peak junction rise of a falling-triangle power pulse on a Foster network (METHODS.md §4, §6 and §7).
//
// Power falls linearly from P to 0 over the width w. For one Foster term (R, τ) entering the pulse at rise s, the
// exact solution of dθ/dt = (R·p(t) − θ)/τ inside the pulse is, with x = t/τ, e(x) = 1 − e^(−x) and
// φ(x) = 1 − e(x)/x (the exact update of METHODS.md §4 over one linear piece from 0 to t):
//
//   θ(t) = s·(1 − e(x)) + R·P·[e(x) − (t/w)·φ(x)],     0 ≤ t ≤ w
//
// One triangle from rest ends at g = R·P·[e(u) − φ(u)], u = w/τ. For a train of period T, the N-th triangle starts
// from s = g·e^(−(T−w)/τ)·(1 − b^(N−1))/(1 − b), b = e^(−T/τ); a continuous train from g·e^(−(T−w)/τ)/(1 − b)
// (METHODS.md §7; the geometric sum is computed as expm1(−(N−1)·T/τ)/expm1(−T/τ)).
//
// The peak of Σθ_i lies inside the pulse, not at its end. For terms with R_i > 0 and P > 0 every θ_i is strictly
// concave on [0, w] (θ_i'' ∝ s_i − R_i·P·(1 + τ_i/w) < 0, since s_i ≤ R_i·P), so the sum has one maximum, where
// its slope Σ(R_i·p(t) − θ_i)/τ_i crosses zero. Sub-steps including both ends bracket it; Newton steps on the slope
// (its derivative is closed-form too), kept inside the bracket by bisection, pin it to rounding. Networks with
// negative terms are outside the model: there the result is the best sub-step, refined only where the slope
// changes sign around it.

import type { FosterTerm } from "./foster";
import { rampFactor } from "./thermal-waveform";

const SUB_STEPS = 16;
const MAX_ITERATIONS = 100;

/**
 * True maximum rise in K over a falling triangle of `peakPower` W and width `width` s; with `repeat`, over the last
 * (`count`-th, or steady-state when count is undefined) triangle of a train of period `repeat.period`.
 * width ≤ 0, empty network or count < 1 → 0 (no pulse); period < width → NaN (overlapping pulses: not a train).
 */
export function trianglePeakRise(
  network: readonly FosterTerm[],
  peakPower: number,
  width: number,
  repeat?: { period: number; count?: number },
): number {
  if (width <= 0 || network.length === 0) return 0;
  const count = repeat?.count;
  if (count !== undefined && count < 1) return 0;
  if (repeat !== undefined && repeat.period < width) return Number.NaN;

  const k = network.length;
  const terms = new Float64Array(3 * k);
  for (let i = 0; i < k; i++) {
    const { r, tau } = network[i];
    let start = 0;
    if (repeat !== undefined) {
      const u = width / tau;
      const end = r * peakPower * (-Math.expm1(-u) - rampFactor(u));
      const gap = Math.exp(-(repeat.period - width) / tau);
      const denominator = Math.expm1(-repeat.period / tau);
      // Σ_(j<N−1) b^j, or its limit 1/(1 − b) for a continuous train.
      const sum =
        count === undefined
          ? -1 / denominator
          : Math.expm1((-(count - 1) * repeat.period) / tau) / denominator;
      start = end * gap * sum;
    }
    terms[3 * i] = tau;
    terms[3 * i + 1] = r * peakPower;
    terms[3 * i + 2] = start;
  }

  const out = new Float64Array(3);
  let best = Number.NEGATIVE_INFINITY;
  let bestStep = 0;
  for (let j = 0; j <= SUB_STEPS; j++) {
    const value = evaluate(terms, width, (width * j) / SUB_STEPS, out);
    if (value > best) {
      best = value;
      bestStep = j;
    }
  }
  if (best === Number.NEGATIVE_INFINITY) return Number.NaN;

  // The slope changes sign between the best sub-step's neighbours unless the rise is flat (no power) or the
  // network is outside the model; then the best sub-step stands.
  let lo = (width * Math.max(bestStep - 1, 0)) / SUB_STEPS;
  let hi = (width * Math.min(bestStep + 1, SUB_STEPS)) / SUB_STEPS;
  evaluate(terms, width, lo, out);
  const slopeLo = out[1];
  evaluate(terms, width, hi, out);
  if (!(slopeLo > 0 && out[1] < 0)) return best;

  let t = (lo + hi) / 2;
  let value = evaluate(terms, width, t, out);
  for (let n = 0; n < MAX_ITERATIONS && out[1] !== 0; n++) {
    if (out[1] > 0) lo = t;
    else hi = t;
    const newton = t - out[1] / out[2];
    const next = newton > lo && newton < hi ? newton : (lo + hi) / 2;
    if (Math.abs(next - t) <= 1e-15 * t) break;
    t = next;
    value = evaluate(terms, width, t, out);
  }
  return Math.max(best, value);
}

/**
 * Σθ_i at time t into the pulse; writes it, its slope and its curvature to out[0..2]. terms holds (τ, R·P, s) per
 * term. Differentiating the closed form, with c = R·P·(1 + τ/w) − s: θ' = e^(−x)·c/τ − R·P/w and
 * θ'' = −e^(−x)·c/τ². (Taken from the ODE instead, θ'' = (−R·P/w − θ')/τ cancels to noise for terms with τ ≪ t.)
 */
function evaluate(terms: Float64Array, width: number, t: number, out: Float64Array): number {
  const fraction = t / width;
  let value = 0;
  let slope = 0;
  let curvature = 0;
  for (let i = 0; i < terms.length; i += 3) {
    const tau = terms[i];
    const rp = terms[i + 1];
    const start = terms[i + 2];
    const x = t / tau;
    const e = -Math.expm1(-x);
    value += start * (1 - e) + rp * (e - fraction * rampFactor(x));
    const decaying = (Math.exp(-x) * (rp * (1 + tau / width) - start)) / tau;
    slope += decaying - rp / width;
    curvature -= decaying / tau;
  }
  out[0] = value;
  out[1] = slope;
  out[2] = curvature;
  return value;
}
