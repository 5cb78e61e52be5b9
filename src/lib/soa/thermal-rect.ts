// Junction rise for rectangular power pulses on a Foster network (METHODS.md §4 and §7).
//
// One pulse P for t_p, from rest:   ΔT = Σ_i P·R_i·(1 − a_i),                          a_i = e^(−t_p/τ_i)
// N pulses, period T, at the end of the N-th pulse (its peak, since every term rises only while power flows):
//                                   ΔT = Σ_i P·R_i·(1 − a_i)·(1 − b_i^N)/(1 − b_i),    b_i = e^(−T/τ_i)
// continuous train (N → ∞):         ΔT = Σ_i P·R_i·(1 − a_i)/(1 − b_i)
//
// The train form is the geometric sum of N shifted single-pulse responses (superposition of linear thermal
// responses). 1 − a and the geometric ratio are computed with expm1, (1 − b^N)/(1 − b) as
// expm1(−N·T/τ)/expm1(−T/τ), so that pulses short against τ and periods short against τ do not cancel.

import type { FosterTerm } from "./foster";

/** Rise in K at the end of one rectangular pulse of `power` W lasting `width` s, from rest. width ≤ 0 → 0. */
export function rectRise(network: readonly FosterTerm[], power: number, width: number): number {
  if (width <= 0) return 0;
  let rise = 0;
  for (const { r, tau } of network) rise -= power * r * Math.expm1(-width / tau);
  return rise;
}

/**
 * Peak rise in K of a rectangular pulse train: at the end of pulse number `count` (count undefined → continuous).
 * width ≤ 0 or count < 1 → 0 (no pulse); period < width → NaN (the pulses would overlap: not a train).
 */
export function trainRise(
  network: readonly FosterTerm[],
  power: number,
  width: number,
  period: number,
  count?: number,
): number {
  if (width <= 0 || (count !== undefined && count < 1)) return 0;
  if (period < width) return Number.NaN;
  let rise = 0;
  for (const { r, tau } of network) {
    const oneMinusA = -Math.expm1(-width / tau);
    const oneMinusB = -Math.expm1(-period / tau);
    // Geometric sum Σ_{k<N} b^k; for the continuous train its limit 1/(1 − b).
    const sum = count === undefined ? 1 / oneMinusB : Math.expm1((-count * period) / tau) / -oneMinusB;
    rise += power * r * oneMinusA * sum;
  }
  return rise;
}
