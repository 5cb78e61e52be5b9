// Quality findings on a digitised curve set (PRODUCT.md, library step), shown on the chart so that digitising
// mistakes are caught before anyone relies on them. Findings are data, never exceptions:
// - invalid-point: V or I not finite or not > 0 (left out of every other finding);
// - empty-curve: a curve without points;
// - not-increasing: V does not rise strictly from one point to the next, in the order digitised;
// - steeper-than-resistor: a segment rising faster than a resistor line, log-log slope > +1.05 (an R_DS(on)
//   line has slope +1; anything steeper is a digitising slip) — common practice, no source;
// - longer-above-shorter: a longer pulse's curve above a shorter one's (a longer pulse is never allowed more
//   current), compared log-log at the union of both curves' digitised voltages on their common V range,
//   reported once per pair at the voltage of the largest excess; DC counts as the longest;
// - thermal-mismatch: with a Foster network, the curve's constant-power level P_k = max V·I differs from
//   (Tj,max − T_ref)/Z_th(t_k) (R_th for DC) by more than 20 % of the latter.
import { DEFAULT_REF_CASE_TEMP } from "./curve-set";
import { type FosterTerm, rth, zth } from "./foster";
import { type CurvePoint, interpolateCurve } from "./interpolate-curve";
import type { CurveSet, Duration } from "./types";
import { formatQuantity } from "./units";

export type FindingKind =
  | "invalid-point"
  | "empty-curve"
  | "not-increasing"
  | "steeper-than-resistor"
  | "longer-above-shorter"
  | "thermal-mismatch";

export interface Finding {
  kind: FindingKind;
  /** The curve at fault: its position in the input and its pulse width. */
  curve: { index: number; duration: Duration };
  /** A voltage on the curve, or the position of a point in the input order. */
  location: { v: number } | { index: number };
  message: string;
}

/** The part's data the thermal-mismatch finding needs; without a Foster network it is skipped. */
export interface FindingPart {
  tjMax: number;
  foster?: readonly FosterTerm[];
}

/** Log-log slope above which a segment is steeper than a resistor line (slope 1) plus digitising slack. */
export const RESISTOR_SLOPE_LIMIT = 1.05;
/** Relative disagreement between a curve's power level and the thermal model that makes a finding. */
export const THERMAL_MISMATCH_LIMIT = 0.2;
/** A longer curve counts as above a shorter one beyond this relative excess (rounding only). */
const ABOVE_TOLERANCE = 1e-9;

interface Cleaned {
  index: number;
  duration: Duration;
  /** Valid points sorted by V, one per voltage (the first digitised). */
  sorted: CurvePoint[];
}

const width = (d: Duration): string => (d === "DC" ? "DC" : formatQuantity(d, "s"));
const volts = (v: number): string => formatQuantity(v, "V");
const amps = (i: number): string => formatQuantity(i, "A");

function isValidDuration(d: Duration): boolean {
  return d === "DC" || (Number.isFinite(d) && d > 0);
}

function pointFindings(set: CurveSet, findings: Finding[]): Cleaned[] {
  return set.curves.map(({ duration, points }, index) => {
    const curve = { index, duration };
    if (points.length === 0) {
      findings.push({
        kind: "empty-curve",
        curve,
        location: { index: 0 },
        message: "the curve has no points",
      });
    }
    const valid: CurvePoint[] = [];
    let previous: { v: number; at: number } | null = null;
    points.forEach(([v, i], at) => {
      if (!(Number.isFinite(v) && v > 0 && Number.isFinite(i) && i > 0)) {
        const message = `point ${at} is [${v}, ${i}]: voltage and current must be finite and greater than 0`;
        findings.push({ kind: "invalid-point", curve, location: { index: at }, message });
        return;
      }
      if (previous !== null && v <= previous.v) {
        const how = v === previous.v ? "repeats" : "is below";
        const message =
          `point ${at} at ${volts(v)} ${how} point ${previous.at} at ${volts(previous.v)}: ` +
          "points must be digitised with rising voltage";
        findings.push({ kind: "not-increasing", curve, location: { index: at }, message });
      }
      previous = { v, at };
      valid.push([v, i]);
    });
    const sorted = valid.sort((a, b) => a[0] - b[0]).filter((p, k, all) => k === 0 || p[0] !== all[k - 1][0]);
    return { index, duration, sorted };
  });
}

function slopeFindings(curves: Cleaned[], findings: Finding[]): void {
  for (const { index, duration, sorted } of curves) {
    for (let j = 0; j + 1 < sorted.length; j++) {
      const [v0, i0] = sorted[j];
      const [v1, i1] = sorted[j + 1];
      const slope = Math.log(i1 / i0) / Math.log(v1 / v0);
      if (slope > RESISTOR_SLOPE_LIMIT) {
        const message =
          `from ${volts(v0)} to ${volts(v1)} the curve rises with log-log slope ${slope.toFixed(2)}, ` +
          "steeper than a resistor line (slope 1)";
        findings.push({
          kind: "steeper-than-resistor",
          curve: { index, duration },
          location: { v: v0 },
          message,
        });
      }
    }
  }
}

function order(d: Duration): number {
  return d === "DC" ? Number.POSITIVE_INFINITY : d;
}

function crossingFindings(curves: Cleaned[], findings: Finding[]): void {
  const usable = curves.filter((c) => isValidDuration(c.duration) && c.sorted.length > 0);
  for (const shorter of usable) {
    for (const longer of usable) {
      if (!(order(longer.duration) > order(shorter.duration))) continue;
      const lo = Math.max(shorter.sorted[0][0], longer.sorted[0][0]);
      const hi = Math.min(
        shorter.sorted[shorter.sorted.length - 1][0],
        longer.sorted[longer.sorted.length - 1][0],
      );
      let worst: { v: number; ratio: number; iShort: number; iLong: number } | null = null;
      for (const [v] of [...shorter.sorted, ...longer.sorted]) {
        if (v < lo || v > hi) continue;
        const iShort = interpolateCurve(shorter.sorted, v).current as number;
        const iLong = interpolateCurve(longer.sorted, v).current as number;
        const ratio = iLong / iShort;
        if (ratio > 1 + ABOVE_TOLERANCE && (worst === null || ratio > worst.ratio)) {
          worst = { v, ratio, iShort, iLong };
        }
      }
      if (worst !== null) {
        const message =
          `the ${width(longer.duration)} curve lies above the ${width(shorter.duration)} curve ` +
          `at ${volts(worst.v)} (${amps(worst.iLong)} against ${amps(worst.iShort)}): ` +
          "a longer pulse cannot be allowed more current";
        findings.push({
          kind: "longer-above-shorter",
          curve: { index: longer.index, duration: longer.duration },
          location: { v: worst.v },
          message,
        });
      }
    }
  }
}

function thermalFindings(
  curves: Cleaned[],
  refCaseTemp: number,
  part: FindingPart,
  findings: Finding[],
): void {
  const network = part.foster;
  const rise = part.tjMax - refCaseTemp;
  if (network === undefined || network.length === 0 || !(rise > 0)) return;
  for (const { index, duration, sorted } of curves) {
    if (!isValidDuration(duration) || sorted.length === 0) continue;
    let power = 0;
    let at = sorted[0][0];
    for (const [v, i] of sorted) {
      if (v * i > power) {
        power = v * i;
        at = v;
      }
    }
    const impedance = duration === "DC" ? rth(network) : zth(network, duration);
    const model = rise / impedance;
    const deviation = (power - model) / model;
    if (Math.abs(deviation) > THERMAL_MISMATCH_LIMIT) {
      const message =
        `the curve's power level ${formatQuantity(power, "W")} differs from the thermal model's ` +
        `${formatQuantity(model, "W")} by ${Math.round(deviation * 100)} %`;
      findings.push({ kind: "thermal-mismatch", curve: { index, duration }, location: { v: at }, message });
    }
  }
}

/**
 * Findings on a curve set as digitised (points in input order, not yet validated). With `part` carrying a
 * Foster network, the curves are also compared with the thermal model. An empty set has no findings.
 */
export function findCurveSetIssues(set: CurveSet, part?: FindingPart): Finding[] {
  const findings: Finding[] = [];
  const curves = pointFindings(set, findings);
  slopeFindings(curves, findings);
  crossingFindings(curves, findings);
  if (part !== undefined) thermalFindings(curves, set.refCaseTemp ?? DEFAULT_REF_CASE_TEMP, part, findings);
  return findings;
}
