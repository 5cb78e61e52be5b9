// Repetition on the curves (METHODS.md §7). A pulse repeated with period T at duty D = t_eq/T sees the
// duty-cycle impedance
//   Z(t_eq, D) = D·R_th + (1 − D)·Z_th(t_eq + T) − Z_th(T) + Z_th(t_eq),
// the usual single-pulse-plus-average approximation of a periodic train, never below the exact periodic peak
// for positive Foster terms (derived). The single-pulse allowed current is scaled by Z_th(t_eq)/Z(t_eq, D),
// capped at 1: a repeated pulse is never allowed more current than the same pulse once. Z_θ as defined by
// JEDEC JESD24-3.
import type { ImpedanceSource } from "./thermal-impedance";

/**
 * Z(t_eq, D) in K/W for a pulse of width `tEq` repeated every `period` seconds, or null when a needed Z_th
 * value or R_th is unknown. NaN inputs give NaN (or null where the source has no value).
 */
export function dutyCycleImpedance(source: ImpedanceSource, tEq: number, period: number): number | null {
  const duty = tEq / period;
  const zEq = source.zth(tEq);
  const zSum = source.zth(tEq + period);
  const zPeriod = source.zth(period);
  if (zEq === null || zSum === null || zPeriod === null || source.rth === null) return null;
  return duty * source.rth + (1 - duty) * zSum - zPeriod + zEq;
}

export type RepetitionScale =
  | { scale: number; flag: null }
  | { scale: null; flag: "repetition-outside-data" };

/**
 * Factor min(1, Z_th(t_eq)/Z(t_eq, D)) on the single-pulse allowed current. No value (flag
 * `repetition-outside-data`) when the data do not reach a needed Z_th or R_th, or when they are so
 * inconsistent that Z(t_eq, D) or Z_th(t_eq) is not > 0.
 */
export function repetitionScale(source: ImpedanceSource, tEq: number, period: number): RepetitionScale {
  const z = dutyCycleImpedance(source, tEq, period);
  const zEq = source.zth(tEq);
  if (z === null || zEq === null || !(z > 0) || !(zEq > 0)) {
    return { scale: null, flag: "repetition-outside-data" };
  }
  return { scale: Math.min(1, zEq / z), flag: null };
}
