// Allowed current on one SOA curve at voltage V (METHODS.md §2): a straight line on log-log axes between
// digitised points, I(V) = I_j·(V/V_j)^s with s = ln(I_(j+1)/I_j) / ln(V_(j+1)/V_j). Below the first point
// the first current holds (the R_DS(on)/package region, where the thermal limit is not binding); above the
// last point the curve says nothing. SOA ratings as defined by IEC 60747-8.

export type CurvePoint = readonly [v: number, i: number];

export interface CurveValue {
  /** Allowed current in A, or null where the curve gives no value. */
  current: number | null;
  flag: "below-curve-range" | "above-curve-range" | null;
}

/**
 * Allowed current of one curve (points sorted by V ascending, every V and I > 0) at voltage `v`. Empty curve
 * or NaN `v`: no value and no flag. `v` below the first point (zero and negatives included): the first
 * current, flag `below-curve-range`. Above the last point: no value, flag `above-curve-range`.
 */
export function interpolateCurve(points: readonly CurvePoint[], v: number): CurveValue {
  const n = points.length;
  if (n === 0 || Number.isNaN(v)) return { current: null, flag: null };
  if (v < points[0][0]) return { current: points[0][1], flag: "below-curve-range" };
  if (v > points[n - 1][0]) return { current: null, flag: "above-curve-range" };
  // Largest j with V_j ≤ v (binary search: curves are sorted once, queried many times).
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (points[mid][0] <= v) lo = mid;
    else hi = mid - 1;
  }
  const [vj, ij] = points[lo];
  if (vj === v) return { current: ij, flag: null };
  const [vk, ik] = points[lo + 1];
  const s = Math.log(ik / ij) / Math.log(vk / vj);
  return { current: ij * (v / vj) ** s, flag: null };
}
