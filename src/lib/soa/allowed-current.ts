// Allowed current for a pulse width t_p between digitised curves (METHODS.md §3). Policy "loglog"
// interpolates ln I linearly in ln t at fixed V:
//   I = exp( ln I_k(V) + (ln t_p − ln t_k)/(ln t_(k+1) − ln t_k) · (ln I_(k+1)(V) − ln I_k(V)) ),
// exact where Z_th grows as √t and optimistic where Z_th bends toward R_th (up to about 27 % within a decade
// for a one-term network, derived from the Foster formula). Policy "next-longer" reads the next longer curve
// instead. Shorter than the shortest curve: the shortest curve (conservative). Longer than the longest: the
// DC curve if any.
import type { PreparedCurve, PreparedCurveSet } from "./curve-set";
import { interpolateCurve } from "./interpolate-curve";
import type { BetweenCurves, Flag } from "./types";

/** Relative tolerance within which a pulse width matches a digitised curve's width (METHODS.md §3). */
export const WIDTH_TOLERANCE = 1e-9;

export interface AllowedCurrent {
  /** Allowed current in A at the reference case temperature (not derated), or null where there is no data. */
  current: number | null;
  flags: Flag[];
}

function onCurve(curve: PreparedCurve, v: number, flags: Flag[]): number | null {
  const { current, flag } = interpolateCurve(curve.points, v);
  if (flag !== null && !flags.includes(flag)) flags.push(flag);
  return current;
}

/**
 * Allowed current at voltage `v` for a pulse of width `width` seconds (not derated). NaN or non-positive
 * width: no value and no flag. Width Infinity: the DC curve, as for any width beyond the longest finite
 * curve. A set with only a DC curve treats every width as longer than its (absent) finite curves.
 */
export function allowedCurrent(
  set: PreparedCurveSet,
  v: number,
  width: number,
  betweenCurves: BetweenCurves = "loglog",
): AllowedCurrent {
  const flags: Flag[] = [];
  if (!(width > 0)) return { current: null, flags };
  const curves = set.finite;
  const m = curves.length;
  for (const curve of curves) {
    if (Math.abs(width - curve.duration) <= WIDTH_TOLERANCE * curve.duration) {
      return { current: onCurve(curve, v, flags), flags };
    }
  }
  if (m > 0 && width < curves[0].duration) {
    flags.push("shorter-than-shortest-curve");
    return { current: onCurve(curves[0], v, flags), flags };
  }
  if (m === 0 || width > curves[m - 1].duration) {
    if (set.dc === null) {
      flags.push("longer-than-longest-curve");
      return { current: null, flags };
    }
    flags.push("dc-curve-used");
    return { current: onCurve(set.dc, v, flags), flags };
  }
  let k = 0;
  while (curves[k + 1].duration < width) k++;
  const shorter = curves[k];
  const longer = curves[k + 1];
  if (betweenCurves === "next-longer") {
    flags.push("next-longer-curve");
    return { current: onCurve(longer, v, flags), flags };
  }
  flags.push("interpolated");
  const ik = onCurve(shorter, v, flags);
  const ik1 = onCurve(longer, v, flags);
  if (ik === null || ik1 === null) return { current: null, flags };
  const lnIk = Math.log(ik);
  const fraction =
    (Math.log(width) - Math.log(shorter.duration)) / (Math.log(longer.duration) - Math.log(shorter.duration));
  return { current: Math.exp(lnIk + fraction * (Math.log(ik1) - lnIk)), flags };
}
