// What the two shape readers of a curve-set CSV hand to the checks that finish it: curves in file order, points in
// file order, each point with the spreadsheet row it came from.
import { WIDTH_TOLERANCE } from "@/lib/soa/allowed-current";
import type { Duration } from "@/lib/soa/types";

export interface RawPoint {
  v: number;
  i: number;
  /** 1-based spreadsheet row. */
  row: number;
}

export interface RawCurve {
  duration: Duration;
  /** The pulse width as written in the file ("100 µs", "DC"). */
  label: string;
  /** Row and column where the curve is named: its first data row (long form) or the header (paired). */
  row: number;
  /** Column labels for messages about the curve's width, voltages and currents. */
  columns: { width: string; voltage: string; current: string };
  points: RawPoint[];
  /** Rows of this curve whose voltage or current was rejected (already reported). */
  rejected: number;
}

/** What a shape reader returns. */
export interface ShapeRead {
  curves: RawCurve[];
  /** Data rows read (blank rows and headers not counted). */
  rows: number;
}

/** Whether two pulse widths are the same, to the engine's relative tolerance (METHODS.md §3). */
export function sameWidth(a: Duration, b: Duration): boolean {
  if (a === "DC" || b === "DC") return a === b;
  return Math.abs(a - b) <= WIDTH_TOLERANCE * Math.max(a, b);
}
