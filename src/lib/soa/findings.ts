// Quality findings on a digitised curve set (PRODUCT.md, library step), shown on the chart so that digitising
// mistakes are caught before anyone relies on them. Findings are data, never exceptions:
// - invalid-point: V or I not finite or not > 0 (left out of every other finding);
// - empty-curve: a curve without points;
// - not-increasing: V does not rise strictly from one point to the next, in the order digitised;
// - steeper-than-resistor: a segment rising faster than a resistor line, log-log slope > +1.05 (an R_DS(on)
//   line has slope +1; anything steeper is a digitising slip) — common practice, no source;
// - longer-above-shorter: a longer pulse's curve above a shorter one's by more than CROSSING_TOLERANCE (a longer
//   pulse is never allowed more current), compared log-log at the union of both curves' digitised voltages on
//   their common V range, reported once per pair at the voltage of the largest excess; DC counts as the longest.
//   Curves that share the R_DS(on) line or the package limit are digitised twice from one line, so they differ
//   there by the digitising noise (1–4 % on real figures): only an excess beyond that is a finding;
// - thermal-mismatch: with a Foster network, the curve's constant-power level P_k = max V·I differs from
//   (Tj,max − T_ref)/Z_th(t_k) (R_th for DC) by more than 20 % of the latter;
// - rating-mismatch: the Foster network's ΣR_i differs from the rated R_th(j-c) by more than 10 % of the rating.
// Every finding carries its size (how far beyond its tolerance) and a key that stays the same when the same
// finding is found again, so that an acceptance can be matched to it.
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
  | "thermal-mismatch"
  | "rating-mismatch";

/** Kinds that need the points in the order digitised; the others can be found again from the stored curves. */
export const ORDER_FINDING_KINDS: readonly FindingKind[] = ["invalid-point", "empty-curve", "not-increasing"];

export interface Finding {
  kind: FindingKind;
  /** Stable identity: the same finding found again on the same data has the same key. */
  key: string;
  /** The curve at fault: its position in the input and its pulse width; absent for a part-level finding. */
  curve?: { index: number; duration: Duration };
  /** A voltage on the curve, or the position of a point in the input order; absent for a part-level finding. */
  location?: { v: number } | { index: number };
  /** How large the finding is, in words with its unit ("+64 %", "slope 1.29"). */
  size: string;
  message: string;
}

/** The part's data the thermal findings need; without a Foster network they are skipped. */
export interface FindingPart {
  tjMax: number;
  foster?: readonly FosterTerm[];
  /** The rated junction-to-case thermal resistance, K/W. */
  rthJc?: number | null;
}

/** Log-log slope above which a segment is steeper than a resistor line (slope 1) plus digitising slack. */
export const RESISTOR_SLOPE_LIMIT = 1.05;
/** Relative disagreement between a curve's power level and the thermal model that makes a finding. */
export const THERMAL_MISMATCH_LIMIT = 0.2;
/** A longer curve counts as above a shorter one beyond this relative excess: digitising noise on a line two
 * curves share stays within 1–4 % on real figures (issue 12), a real crossing is tens of percent. */
export const CROSSING_TOLERANCE = 0.05;
/** Relative disagreement between the Foster network's ΣR_i and the rated R_th(j-c) that makes a finding. */
export const RATING_MISMATCH_LIMIT = 0.1;

interface Cleaned {
  index: number;
  duration: Duration;
  /** Valid points sorted by V, one per voltage (the first digitised). */
  sorted: CurvePoint[];
}

const width = (d: Duration): string => (d === "DC" ? "DC" : formatQuantity(d, "s"));
const volts = (v: number): string => formatQuantity(v, "V");
const amps = (i: number): string => formatQuantity(i, "A");
const percent = (ratio: number): string => `${ratio > 0 ? "+" : ""}${Math.round(ratio * 100)} %`;

function keyOf(kind: FindingKind, curve?: { duration: Duration }, where?: string): string {
  const width = curve === undefined ? "part" : curve.duration === "DC" ? "DC" : curve.duration.toPrecision(4);
  return [kind, width, where ?? ""].join("|");
}

function isValidDuration(d: Duration): boolean {
  return d === "DC" || (Number.isFinite(d) && d > 0);
}

function pointFindings(set: CurveSet, findings: Finding[]): Cleaned[] {
  return set.curves.map(({ duration, points }, index) => {
    const curve = { index, duration };
    if (points.length === 0) {
      findings.push({
        kind: "empty-curve",
        key: keyOf("empty-curve", curve),
        curve,
        location: { index: 0 },
        size: "0 points",
        message: "the curve has no points",
      });
    }
    const valid: CurvePoint[] = [];
    let previous: { v: number; at: number } | null = null;
    points.forEach(([v, i], at) => {
      if (!(Number.isFinite(v) && v > 0 && Number.isFinite(i) && i > 0)) {
        const message = `point ${at} is [${v}, ${i}]: voltage and current must be finite and greater than 0`;
        findings.push({
          kind: "invalid-point",
          key: keyOf("invalid-point", curve, `#${at}`),
          curve,
          location: { index: at },
          size: "1 point",
          message,
        });
        return;
      }
      if (previous !== null && v <= previous.v) {
        const how = v === previous.v ? "repeats" : "is below";
        const message =
          `point ${at} at ${volts(v)} ${how} point ${previous.at} at ${volts(previous.v)}: ` +
          "points must be digitised with rising voltage";
        findings.push({
          kind: "not-increasing",
          key: keyOf("not-increasing", curve, `#${at}`),
          curve,
          location: { index: at },
          size: formatQuantity(previous.v - v, "V"),
          message,
        });
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
          key: keyOf("steeper-than-resistor", { duration }, v0.toPrecision(4)),
          curve: { index, duration },
          location: { v: v0 },
          size: `slope ${slope.toFixed(2)}`,
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
        if (ratio > 1 + CROSSING_TOLERANCE && (worst === null || ratio > worst.ratio)) {
          worst = { v, ratio, iShort, iLong };
        }
      }
      if (worst !== null) {
        const message =
          `the ${width(longer.duration)} curve lies above the ${width(shorter.duration)} curve ` +
          `at ${volts(worst.v)} (${amps(worst.iLong)} against ${amps(worst.iShort)}, ${percent(worst.ratio - 1)}, ` +
          `beyond the ${Math.round(CROSSING_TOLERANCE * 100)} % allowed for digitising): ` +
          "a longer pulse cannot be allowed more current";
        findings.push({
          kind: "longer-above-shorter",
          key: keyOf("longer-above-shorter", longer, width(shorter.duration)),
          curve: { index: longer.index, duration: longer.duration },
          location: { v: worst.v },
          size: percent(worst.ratio - 1),
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
      findings.push({
        kind: "thermal-mismatch",
        key: keyOf("thermal-mismatch", { duration }),
        curve: { index, duration },
        location: { v: at },
        size: percent(deviation),
        message,
      });
    }
  }
}

/** The thermal model against the rated R_th(j-c): both describe the same junction-to-case path. */
function ratingFindings(part: FindingPart, findings: Finding[]): void {
  const network = part.foster;
  const rated = part.rthJc;
  if (network === undefined || network.length === 0 || rated === undefined || rated === null || !(rated > 0))
    return;
  const sum = rth(network);
  const deviation = (sum - rated) / rated;
  if (!(Math.abs(deviation) > RATING_MISMATCH_LIMIT)) return;
  const kw = (r: number) => formatQuantity(r, "K/W");
  findings.push({
    kind: "rating-mismatch",
    key: keyOf("rating-mismatch"),
    size: percent(deviation),
    message:
      `the thermal model's ΣR_i = ${kw(sum)} differs from the rated R_th(j-c) ${kw(rated)} by ` +
      `${percent(deviation)} (more than ${Math.round(RATING_MISMATCH_LIMIT * 100)} %): one of them is not this part's`,
  });
}

/**
 * Findings on a curve set as digitised (points in input order, not yet validated). With `part` carrying a
 * Foster network, the curves are also compared with the thermal model, and the model with the rated R_th(j-c).
 * An empty set has no findings of its own.
 */
export function findCurveSetIssues(set: CurveSet, part?: FindingPart): Finding[] {
  const findings: Finding[] = [];
  const curves = pointFindings(set, findings);
  slopeFindings(curves, findings);
  crossingFindings(curves, findings);
  if (part !== undefined) {
    thermalFindings(curves, set.refCaseTemp ?? DEFAULT_REF_CASE_TEMP, part, findings);
    ratingFindings(part, findings);
  }
  return findings;
}
