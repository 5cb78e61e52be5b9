// Repetition on the curves (METHODS.md §7, v2). The single-pulse allowed current of a pulse read at width t_eq and
// repeated with period T (N times, or continuously) is multiplied by s = min(1, Z_th(t_eq)/Z_rep):
// - N = 1: s = 1 exactly, whatever the data (one pulse is one pulse);
// - with a Foster network, Z_rep is the exact peak of N rectangles of width t_eq,
//   Z_rep = Σ_i R_i·(1 − a_i)·(1 − b_i^N)/(1 − b_i), a_i = e^(−t_eq/τ_i), b_i = e^(−T/τ_i) (N → ∞: continuous);
// - without one, Z_th comes from the curves (thermal-impedance.ts). With N given and (N − 1)·T + t_eq within the
//   data, superposition of N single pulses (Stout and Billings, InterPACK 2007):
//   Z_rep = Σ_(k=0..N−1) [Z_th(k·T + t_eq) − Z_th(k·T)], Z_th(0) = 0;
//   otherwise the duty-cycle impedance Z_rep = D·R_th + (1 − D)·Z_th(t_eq + T) − Z_th(T) + Z_th(t_eq), D = t_eq/T,
//   the usual single-pulse-plus-average form, never below the exact periodic peak for positive Foster terms
//   (derived). Where a needed value is outside the data: no scale, flag `repetition-outside-data`.
// Z_θ as defined by JEDEC JESD24-3.
import { type FosterTerm, zth } from "./foster";
import type { ImpedanceSource } from "./thermal-impedance";
import { trainRise } from "./thermal-rect";

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

/** Σ_(k<N) [Z_th(k·T + t_eq) − Z_th(k·T)] from a source, or null where a value is missing. */
export function superposedImpedance(
  source: ImpedanceSource,
  tEq: number,
  period: number,
  count: number,
): number | null {
  let sum = 0;
  for (let k = 0; k < count; k++) {
    const on = source.zth(k * period + tEq);
    const off = k === 0 ? 0 : source.zth(k * period);
    if (on === null || off === null) return null;
    sum += on - off;
  }
  return sum;
}

export type RepetitionScale =
  | { scale: number; flag: null }
  | { scale: null; flag: "repetition-outside-data" };

export interface RepetitionInput {
  /** The part's Foster network, when it has one. */
  network: readonly FosterTerm[] | null;
  /** Z_th and R_th read off the curves, used without a network. */
  curves: ImpedanceSource;
  tEq: number;
  period: number;
  /** Number of pulses; undefined: a continuous train. */
  count?: number;
}

/** The repetition scale s = min(1, Z_th(t_eq)/Z_rep), or no value (flag `repetition-outside-data`). */
export function repetitionScale({ network, curves, tEq, period, count }: RepetitionInput): RepetitionScale {
  if (count === 1) return { scale: 1, flag: null };
  let zEq: number | null;
  let zRep: number | null;
  if (network !== null) {
    zEq = zth(network, tEq);
    zRep = trainRise(network, 1, tEq, period, count);
  } else {
    zEq = curves.zth(tEq);
    const superposed =
      count !== undefined && curves.zth((count - 1) * period + tEq) !== null
        ? superposedImpedance(curves, tEq, period, count)
        : null;
    zRep = superposed ?? dutyCycleImpedance(curves, tEq, period);
  }
  if (zEq === null || zRep === null || !(zRep > 0) || !(zEq > 0)) {
    return { scale: null, flag: "repetition-outside-data" };
  }
  return { scale: Math.min(1, zEq / zRep), flag: null };
}
