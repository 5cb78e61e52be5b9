// Long form of a curve-set CSV: one row per point, a header naming the pulse-width, voltage and current columns
// ("width, V_DS [V], I_D [A]"). Rows with the same pulse width form one curve, in order of first appearance,
// even where they are not contiguous (a warning says so). Decisions:
// - a blank width cell repeats the last width given above it (a spreadsheet's merged or grouped cells);
// - a row with a width but no voltage and no current only sets that width for the rows below;
// - columns the header does not recognise are ignored, with a warning;
// - non-empty cells beyond the header's columns are an error: in a comma-separated file they are most often
//   decimal commas that split a number in two.
import type { Duration } from "@/lib/soa/types";
import { readNumber, readWidth } from "./cell";
import { type RawCurve, type ShapeRead, sameWidth } from "./curve-set-raw";
import { type Quantity, quantityOfName, splitHeader, unitScale } from "./header";
import { columnLetter, type IssueList } from "./issues";
import type { Table } from "./text";

interface Column {
  index: number;
  label: string;
  scale: number;
}

type Columns = Record<Quantity, Column>;

const EXAMPLE_HEADER: Readonly<Record<Quantity, string>> = {
  width: "pulse width",
  voltage: "V_DS [V]",
  current: "I_D [A]",
};

/** Whether a header row names at least one long-form column (by name, or by a unit such as "[V]"). */
export function isLongHeader(cells: readonly string[]): boolean {
  return cells.some((cell) => {
    if (cell === "") return false;
    const { name, unit } = splitHeader(cell);
    return quantityOfName(name) !== null || (unit !== null && unitScale(unit).ok);
  });
}

function readHeader(
  cells: readonly string[],
  row: number,
  errors: IssueList,
  warnings: IssueList,
): Columns | null {
  const found: Partial<Columns> = {};
  cells.forEach((cell, index) => {
    if (cell === "") return;
    const { name, unit } = splitHeader(cell);
    const named = quantityOfName(name);
    const scaled = unit === null ? null : unitScale(unit, named ?? undefined);
    if (scaled !== null && !scaled.ok) {
      if (named !== null) errors.add(row, cell, scaled.reason);
      else warnings.add(row, cell, "column ignored: not a pulse width, voltage or current");
      return;
    }
    const quantity = scaled?.quantity ?? named;
    if (quantity === null) {
      warnings.add(row, cell, "column ignored: not a pulse width, voltage or current");
      return;
    }
    const first = found[quantity];
    if (first !== undefined) {
      errors.add(row, cell, `a second ${quantity} column (the first is ${first.label}); keep one`);
      return;
    }
    found[quantity] = { index, label: cell, scale: scaled?.scale ?? 1 };
  });
  for (const quantity of ["width", "voltage", "current"] as const) {
    if (found[quantity] === undefined) {
      errors.add(
        row,
        null,
        `no ${quantity} column: name one in the header, for example '${EXAMPLE_HEADER[quantity]}'`,
      );
    }
  }
  return found.width && found.voltage && found.current ? (found as Columns) : null;
}

function extraCells(cells: readonly string[], width: number, row: number, errors: IssueList): boolean {
  const extra = cells.findIndex((cell, index) => index >= width && cell !== "");
  if (extra < 0) return false;
  errors.add(
    row,
    columnLetter(extra),
    `'${cells[extra]}' lies beyond the header's columns (decimal commas need ';' or tab as the separator)`,
  );
  return true;
}

type Width = { duration: Duration; label: string };

/** Curves by pulse width, in order of first appearance; warns once per curve whose rows are not together. */
class CurveBook {
  readonly curves: RawCurve[] = [];
  private previous: RawCurve | null = null;
  private readonly split = new Set<RawCurve>();

  constructor(
    private readonly columns: Columns,
    private readonly warnings: IssueList,
  ) {}

  curveFor(width: Width, row: number): RawCurve {
    let curve = this.curves.find((c) => sameWidth(c.duration, width.duration));
    if (curve === undefined) {
      const { width: w, voltage, current } = this.columns;
      const columns = { width: w.label, voltage: voltage.label, current: current.label };
      curve = { duration: width.duration, label: width.label, row, columns, points: [], rejected: 0 };
      this.curves.push(curve);
    } else if (curve !== this.previous && this.previous !== null && !this.split.has(curve)) {
      this.split.add(curve);
      const reason = `the rows for ${curve.label} are not together; they were read as one curve`;
      this.warnings.add(row, this.columns.width.label, reason);
    }
    this.previous = curve;
    return curve;
  }
}

/** Reads a long-form table whose header is at `headerIndex` (0-based). */
export function readLongForm(
  table: Table,
  headerIndex: number,
  errors: IssueList,
  warnings: IssueList,
): ShapeRead {
  const header = table.rows[headerIndex];
  const columns = readHeader(header, headerIndex + 1, errors, warnings);
  if (columns === null) return { curves: [], rows: 0 };
  const { width: w, voltage: vc, current: ic } = columns;
  const book = new CurveBook(columns, warnings);
  // Widths repeat on every row of a curve: read each distinct cell once.
  const widths = new Map<string, ReturnType<typeof readWidth>>();
  // The width that rows without one repeat; "unreadable" after a bad width cell, which was reported once.
  let last: Width | "unreadable" | null = null;
  let rows = 0;
  for (let k = headerIndex + 1; k < table.rows.length; k++) {
    const cells = table.rows[k];
    if (cells.length === 0) continue;
    const row = k + 1;
    rows++;
    if (extraCells(cells, header.length, row, errors)) continue;
    const [widthCell, vCell, iCell] = [w, vc, ic].map((column) => cells[column.index] ?? "");
    if (widthCell !== "") {
      const read = widths.get(widthCell) ?? readWidth(widthCell, w.scale, table.delimiter);
      widths.set(widthCell, read);
      if (!read.ok) errors.add(row, w.label, read.reason);
      last = read.ok ? { duration: read.value, label: widthCell } : "unreadable";
    }
    if (vCell === "" && iCell === "") continue;
    if (last === null)
      errors.add(row, w.label, "the cell is empty and no pulse width above it can be repeated");
    const v = readNumber(vCell, "voltage", vc.scale, table.delimiter);
    if (!v.ok) errors.add(row, vc.label, v.reason);
    const i = readNumber(iCell, "current", ic.scale, table.delimiter);
    if (!i.ok) errors.add(row, ic.label, i.reason);
    if (last === null || last === "unreadable") continue;
    const curve = book.curveFor(last, row);
    if (v.ok && i.ok) curve.points.push({ v: v.value, i: i.value, row });
    else curve.rejected++;
  }
  return { curves: book.curves, rows };
}
