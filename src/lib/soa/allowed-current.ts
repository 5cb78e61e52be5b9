// Allowed current for a pulse width t_p (METHODS.md §3), one reading at a time: a thin wrapper over CurveReader
// (curve-reader.ts), which holds the rules. Callers that read many points of one part should keep a CurveReader.

import { CurveReader, flagsOf } from "./curve-reader";
import type { PreparedCurveSet } from "./curve-set";
import type { FosterTerm } from "./foster";
import type { BetweenCurves, Flag } from "./types";

export { WIDTH_TOLERANCE } from "./curve-reader";

export interface AllowedCurrent {
  /** Allowed current in A at the reference case temperature (not derated), or null where there is no data. */
  current: number | null;
  flags: Flag[];
}

/**
 * Allowed current at voltage `v` for a pulse of width `width` seconds (not derated). NaN or non-positive
 * width: no value and no flag. Width Infinity: unlimited (the DC curve, or the thermal scaling to R_th). `network`
 * is needed by the "thermal" reading only.
 */
export function allowedCurrent(
  set: PreparedCurveSet,
  v: number,
  width: number,
  betweenCurves: BetweenCurves = "loglog",
  network: readonly FosterTerm[] | null = null,
): AllowedCurrent {
  const reader = new CurveReader(set, betweenCurves, network);
  const ln = reader.read(v, width);
  return { current: Number.isNaN(ln) ? null : Math.exp(ln), flags: flagsOf(reader.flags) };
}
