// A curve set made ready for many queries (METHODS.md §1, §3): points sorted by V, finite curves ordered by
// pulse width, the DC curve kept apart. Preparing once per part keeps sorting out of the per-pulse path.
import type { CurvePoint } from "./interpolate-curve";
import type { CurveSet, Duration } from "./types";

export interface PreparedCurve<D extends Duration = Duration> {
  /** Position of the curve in the input, for messages that point back at the data. */
  index: number;
  duration: D;
  /** Sorted by V ascending. */
  points: CurvePoint[];
}

export interface PreparedCurveSet {
  refCaseTemp: number;
  /** Curves with a finite duration, shortest first. */
  finite: PreparedCurve<number>[];
  dc: PreparedCurve<"DC"> | null;
}

/** Datasheet SOA figures hold at 25 °C case unless they say otherwise (common practice, no source). */
export const DEFAULT_REF_CASE_TEMP = 25;

function isPositiveFinite(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/**
 * Sorts a validated curve set for querying. Total on unvalidated input: points that are not finite and > 0
 * and curves whose duration is neither finite > 0 nor "DC" are left out; of two curves with the same
 * duration, or of several DC curves, the first in input order is kept (validation rejects all of these before
 * a check).
 */
export function prepareCurveSet(set: CurveSet): PreparedCurveSet {
  const finite: PreparedCurve<number>[] = [];
  let dc: PreparedCurve<"DC"> | null = null;
  set.curves.forEach((curve, index) => {
    const points: CurvePoint[] = curve.points
      .filter(([v, i]) => isPositiveFinite(v) && isPositiveFinite(i))
      .map(([v, i]) => [v, i] as const)
      .sort((a, b) => a[0] - b[0]);
    if (curve.duration === "DC") {
      dc ??= { index, duration: "DC", points };
    } else if (isPositiveFinite(curve.duration)) {
      const duration = curve.duration;
      if (!finite.some((c) => c.duration === duration)) finite.push({ index, duration, points });
    }
  });
  finite.sort((a, b) => a.duration - b.duration);
  return { refCaseTemp: set.refCaseTemp ?? DEFAULT_REF_CASE_TEMP, finite, dc };
}
