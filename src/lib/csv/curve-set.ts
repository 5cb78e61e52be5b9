// Reading an uploaded SOA figure (a curve set) from CSV text into curves in SI units, ready for the engine's
// quality findings and for storage (PRODUCT.md, library step 1; METHODS.md §1). Two shapes are recognised from the
// first non-blank row: a long table (one row per point; see curve-set-long.ts) and a digitiser's paired columns
// (one X/Y pair per curve; see curve-set-paired.ts). Text handling (size, binary, separator, decimal commas) is in
// text.ts and cell.ts. Decisions:
// - every problem is collected (up to 50) with its spreadsheet row, its column and the reason; nothing is
//   returned as curves when anything is rejected;
// - a curve needs at least 2 points: one point is not a line, and the engine reads curves as log-log segments;
// - two points of one curve at the same voltage are an error (METHODS.md §1), as are two curves with one width;
// - points are sorted by voltage; the order as digitised is kept (`rawOrderIndex`), and a warning names the first
//   point out of order, so that the findings can still say "points not increasing".
import { q } from "@/lib/format";
import type { Curve, CurveSet, Duration } from "@/lib/soa/types";
import { isLongHeader, readLongForm } from "./curve-set-long";
import { isPairedHeader, readPairedForm } from "./curve-set-paired";
import { type RawCurve, sameWidth } from "./curve-set-raw";
import { type CsvIssue, createIssueList, type IssueList } from "./issues";
import { MAX_CSV_BYTES } from "./limits";
import { readTable } from "./text";

export { curvesToLongCsv, formatWidth } from "./curve-set-export";
export { curveCsvHelp } from "./curve-set-help";
export type { CsvIssue } from "./issues";

export type CurveSetShape = "long" | "paired";

/** One parsed curve. `points` are sorted by V; the other arrays run parallel to them. */
export interface ParsedCurve extends Curve {
  duration: Duration;
  points: [number, number][];
  /** The pulse width as written in the file ("100 µs"). */
  label: string;
  /** For each sorted point, its 0-based position within the curve in file order. */
  rawOrderIndex: number[];
  /** For each sorted point, the spreadsheet row it came from. */
  sourceRows: number[];
}

export type CurveSetCsvResult =
  | { ok: true; curves: ParsedCurve[]; shape: CurveSetShape; rows: number; warnings: CsvIssue[] }
  | { ok: false; errors: CsvIssue[] };

export interface CurveSetCsvOptions {
  /** Size limit in bytes of UTF-8 (default MAX_CSV_BYTES, 5 MB). */
  maxBytes?: number;
}

function checkWidths(curves: readonly RawCurve[], errors: IssueList): void {
  curves.forEach((curve, k) => {
    const earlier = curves.slice(0, k).find((other) => sameWidth(other.duration, curve.duration));
    if (earlier !== undefined) {
      const reason = `'${curve.label}' is the same pulse width as '${earlier.label}' (column ${earlier.columns.width})`;
      errors.add(curve.row, curve.columns.width, reason);
    }
  });
}

function checkCount(curve: RawCurve, errors: IssueList): boolean {
  const written = curve.points.length + curve.rejected;
  if (written >= 2) return true;
  const row = curve.points[0]?.row ?? curve.row;
  const has = written === 0 ? "has no points" : "has only 1 point";
  errors.add(row, curve.columns.width, `the ${curve.label} curve ${has}; a curve needs at least 2`);
  return false;
}

/** Sorts a curve's points by V (stable), reports repeated voltages, warns about the first point out of order. */
function finishCurve(curve: RawCurve, errors: IssueList, warnings: IssueList): ParsedCurve {
  const order = curve.points.map((_, k) => k).sort((a, b) => curve.points[a].v - curve.points[b].v);
  for (let k = 1; k < order.length; k++) {
    const [a, b] = [curve.points[order[k - 1]], curve.points[order[k]]];
    if (a.v === b.v) {
      const [first, second] = a.row < b.row ? [a, b] : [b, a];
      const reason = `voltage ${q(a.v, "V", 6)} appears twice on the ${curve.label} curve (rows ${first.row} and ${second.row})`;
      errors.add(second.row, curve.columns.voltage, reason);
    }
  }
  const outOfOrder = curve.points.findIndex((p, k) => k > 0 && p.v < curve.points[k - 1].v);
  if (outOfOrder > 0) {
    const [before, after] = [curve.points[outOfOrder - 1], curve.points[outOfOrder]];
    const reason = `the ${curve.label} curve's voltages do not rise (row ${after.row} is below row ${before.row}); the points were sorted`;
    warnings.add(after.row, curve.columns.voltage, reason);
  }
  return {
    duration: curve.duration,
    label: curve.label,
    points: order.map((k) => [curve.points[k].v, curve.points[k].i]),
    rawOrderIndex: order,
    sourceRows: order.map((k) => curve.points[k].row),
  };
}

type Shape = { shape: CurveSetShape; curves: RawCurve[]; rows: number } | null;

function readShape(text: string, maxBytes: number, errors: IssueList, warnings: IssueList): Shape {
  const read = readTable(text, maxBytes);
  if (!read.ok) {
    for (const issue of read.issues.list()) errors.add(issue.row, issue.column, issue.reason);
    return null;
  }
  const { table } = read;
  const headerIndex = table.rows.findIndex((cells) => cells.length > 0);
  if (headerIndex < 0) {
    errors.add(null, null, "the file is empty");
    return null;
  }
  const header = table.rows[headerIndex];
  if (isLongHeader(header)) return { shape: "long", ...readLongForm(table, headerIndex, errors, warnings) };
  if (isPairedHeader(header, table.delimiter))
    return { shape: "paired", ...readPairedForm(table, headerIndex, errors) };
  const reason =
    "the first row names neither the columns of a table (pulse width, V_DS [V], I_D [A]) nor curves above X/Y " +
    "column pairs (10us in column A, 1ms in column C, …)";
  errors.add(headerIndex + 1, null, reason);
  return null;
}

/** Parses a curve-set CSV (decoded text) into curves in s, V and A, or every problem found (see the header). */
export function parseCurveSetCsv(text: string, options: CurveSetCsvOptions = {}): CurveSetCsvResult {
  const errors = createIssueList();
  const warnings = createIssueList();
  const read = readShape(text, options.maxBytes ?? MAX_CSV_BYTES, errors, warnings);
  if (read !== null && read.curves.length === 0 && errors.count === 0) {
    errors.add(null, null, "no curves found: the file has a header but no points under it");
  }
  const curves: ParsedCurve[] = [];
  if (read !== null) {
    checkWidths(read.curves, errors);
    for (const curve of read.curves) {
      if (checkCount(curve, errors)) curves.push(finishCurve(curve, errors, warnings));
    }
  }
  if (read === null || errors.count > 0) return { ok: false, errors: errors.list() };
  return { ok: true, curves, shape: read.shape, rows: read.rows, warnings: warnings.list() };
}

/** The curve set with every curve's points in the order digitised, as the engine's quality findings want it. */
export function digitisedCurveSet(curves: readonly ParsedCurve[]): CurveSet {
  return {
    curves: curves.map((curve) => {
      const points: [number, number][] = new Array(curve.points.length);
      curve.rawOrderIndex.forEach((position, k) => {
        points[position] = curve.points[k];
      });
      return { duration: curve.duration, points };
    }),
  };
}
