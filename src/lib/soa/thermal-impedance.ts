// Where the repetition rule (METHODS.md §7) takes its thermal impedance from: the Foster network when the
// part has one (Z_th and R_th = Σ R_i), else the curves themselves. From the curves: each finite curve k
// holds a constant power level P_k = max_j V_j·I_j, so Z_k = (Tj,max − T_ref)/P_k, interpolated log-log in t
// between the digitised widths and undefined outside them; R_th from the part's R_th(j-c), else from the DC
// curve's power level. Z_θ (transient thermal impedance) as defined by JEDEC JESD24-3.
import type { PreparedCurve, PreparedCurveSet } from "./curve-set";
import { type FosterTerm, rth, zth } from "./foster";
import type { CurvePoint } from "./interpolate-curve";

/** Relative tolerance at the ends of the digitised width range, as for matching a width (METHODS.md §3). */
const RANGE_TOLERANCE = 1e-9;

export interface ImpedanceSource {
  /** Z_th(t) in K/W, or null where the data says nothing about t. */
  zth(t: number): number | null;
  /** R_th (junction to case) in K/W, or null when unknown. */
  rth: number | null;
}

/** Z_th and R_th of a Foster network (defined for every t ≥ 0). */
export function impedanceFromFoster(network: readonly FosterTerm[]): ImpedanceSource {
  return { zth: (t) => zth(network, t), rth: rth(network) };
}

/** Largest V·I on a curve: its constant-power (thermal) level in W; 0 for an empty curve. */
export function curvePowerLevel(curve: Pick<PreparedCurve, "points">): number {
  let power = 0;
  for (const [v, i] of curve.points) power = Math.max(power, v * i);
  return power;
}

/**
 * Z_th and R_th read off the curves of a part with `tjMax` (°C) and optional `rthJc` (K/W). Z_th(t) is null
 * for t outside [t_1, t_m] (tolerance 1e-9 relative) or when the set has no finite curve; everything is null
 * when Tj,max ≤ T_ref (no power level can be derived).
 */
export function impedanceFromCurves(set: PreparedCurveSet, tjMax: number, rthJc?: number): ImpedanceSource {
  const rise = tjMax - set.refCaseTemp;
  if (!(rise > 0)) return { zth: () => null, rth: null };
  const levels: CurvePoint[] = [];
  for (const curve of set.finite) {
    const power = curvePowerLevel(curve);
    if (power > 0) levels.push([curve.duration, rise / power]);
  }
  const dcPower = set.dc === null ? 0 : curvePowerLevel(set.dc);
  const rthValue = rthJc ?? (dcPower > 0 ? rise / dcPower : null);
  const zthValue = (t: number): number | null => {
    if (levels.length === 0 || Number.isNaN(t)) return null;
    const first = levels[0][0];
    const last = levels[levels.length - 1][0];
    if (t < first * (1 - RANGE_TOLERANCE) || t > last * (1 + RANGE_TOLERANCE)) return null;
    return levelAt(levels, Math.min(last, Math.max(first, t)));
  };
  return { zth: zthValue, rth: rthValue };
}

/**
 * Z_th at t within [t_1, t_m] (clamped by the caller): interpolateCurve's log-log arithmetic, step for step, without
 * its result object (repeated pulses read Z_th several times each).
 */
function levelAt(levels: readonly CurvePoint[], t: number): number {
  let lo = 0;
  let hi = levels.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (levels[mid][0] <= t) lo = mid;
    else hi = mid - 1;
  }
  const [tj, zj] = levels[lo];
  if (tj === t) return zj;
  const [tk, zk] = levels[lo + 1];
  const s = Math.log(zk / zj) / Math.log(tk / tj);
  return zj * (t / tj) ** s;
}
