// Paired columns of a curve-set CSV, as generic plot digitisers export them: row 1 names each curve ("10us",
// "100 µs", "1ms", "DC") above an X/Y column pair (the name in the pair's first cell; the second may be empty or
// repeat it), an optional second header row names the axes ("X,Y,X,Y" or "V_DS [V],I_D [mA],…"), and the points
// follow, X = voltage and Y = current, each curve as long as it is (trailing cells empty). Decisions:
// - an axis row with units scales its column; one naming current before voltage swaps the pair;
// - a pair with both cells empty is skipped (the curve has ended); a pair with one empty cell is an error;
// - values under a pair without a curve name are an error, reported once per pair;
// - a curve name without a time unit ("10") is refused: nobody can tell whether it means µs or ms.
import { readNumber, readWidth } from "./cell";
import type { RawCurve, ShapeRead } from "./curve-set-raw";
import { type Quantity, quantityOfName, splitHeader, unitScale } from "./header";
import { columnLetter, type IssueList } from "./issues";
import type { Delimiter, Table } from "./text";

interface Axis {
  index: number;
  label: string;
  scale: number;
}

interface Pair {
  curve: RawCurve;
  voltage: Axis;
  current: Axis;
}

const NUMERIC = /^[+-]?(?:\d|[.,]\d)/;

/**
 * Whether a header row names a curve ("10us", "DC") above the first column of some pair (A, C, E, …) and holds
 * no number above a second column (which a first data row of a table without header would).
 */
export function isPairedHeader(cells: readonly string[], delimiter: Delimiter): boolean {
  const isName = (cell: string) => readWidth(cell, 1, delimiter, true).ok;
  const named = cells.some((cell, index) => index % 2 === 0 && isName(cell));
  return named && !cells.some((cell, index) => index % 2 === 1 && NUMERIC.test(cell) && !isName(cell));
}

function nextFilled(table: Table, from: number): number {
  let k = from;
  while (k < table.rows.length && table.rows[k].length === 0) k++;
  return k;
}

function isAxisRow(cells: readonly string[] | undefined): boolean {
  return cells !== undefined && cells.length > 0 && !cells.some((cell) => NUMERIC.test(cell));
}

interface AxisCell {
  quantity: Quantity | null;
  scale: number;
}

function readAxisCell(cell: string, row: number, letter: string, errors: IssueList): AxisCell | null {
  if (cell === "") return { quantity: null, scale: 1 };
  const { name, unit } = splitHeader(cell);
  const named = quantityOfName(name, true);
  if (unit === null) return { quantity: named, scale: 1 };
  const scaled = unitScale(unit, named ?? undefined);
  if (!scaled.ok) {
    errors.add(row, `${letter} (${cell})`, scaled.reason);
    return null;
  }
  return { quantity: scaled.quantity, scale: scaled.scale };
}

type Axes = Record<"voltage" | "current", Omit<Axis, "label">>;

/** Which of the pair's columns holds voltage and current, and their scales; null after an error. */
function readAxes(
  axisRow: readonly string[] | null,
  xi: number,
  row: number,
  errors: IssueList,
): Axes | null {
  const x = readAxisCell(axisRow?.[xi] ?? "", row, columnLetter(xi), errors);
  const y = readAxisCell(axisRow?.[xi + 1] ?? "", row, columnLetter(xi + 1), errors);
  if (x === null || y === null) return null;
  if (x.quantity === "width" || y.quantity === "width") {
    errors.add(row, columnLetter(xi), "the axes of a pair are voltage and current, not pulse width");
    return null;
  }
  if (x.quantity !== null && x.quantity === y.quantity) {
    errors.add(row, columnLetter(xi), `both columns of the pair are named as ${x.quantity}`);
    return null;
  }
  const swap = x.quantity === "current" || y.quantity === "voltage";
  return swap
    ? { voltage: { index: xi + 1, scale: y.scale }, current: { index: xi, scale: x.scale } }
    : { voltage: { index: xi, scale: x.scale }, current: { index: xi + 1, scale: y.scale } };
}

function axisLabel(
  index: number,
  curve: string,
  axisRow: readonly string[] | null,
  fallback: string,
): string {
  const axis = axisRow?.[index] ?? "";
  return `${columnLetter(index)} (${curve}, ${axis === "" ? fallback : axis})`;
}

interface Headers {
  names: readonly string[];
  row: number;
  axes: readonly string[] | null;
  axesRow: number;
  delimiter: Delimiter;
}

/** Reports a curve name over the Y column: misplaced, or a second curve squeezed into one pair. */
function checkPartner(headers: Headers, xi: number, errors: IssueList): boolean {
  const name = headers.names[xi] ?? "";
  const partner = headers.names[xi + 1] ?? "";
  if (partner === "" || partner === name) return true;
  const isName = readWidth(partner, 1, headers.delimiter, true).ok;
  if (name === "" || isName) {
    const where = `stands above the Y column of a pair; each curve takes two columns, named above the first (${columnLetter(xi)})`;
    errors.add(headers.row, columnLetter(xi + 1), `curve name '${partner}' ${where}`);
    return false;
  }
  return true;
}

function readPair(headers: Headers, xi: number, errors: IssueList): Pair | null {
  const name = headers.names[xi] ?? "";
  const partnerOk = checkPartner(headers, xi, errors);
  if (name === "") return null;
  const width = readWidth(name, 1, headers.delimiter, true);
  if (!width.ok) errors.add(headers.row, columnLetter(xi), width.reason);
  const axes = readAxes(headers.axes, xi, headers.axesRow, errors);
  if (!width.ok || axes === null || !partnerOk) return null;
  const voltage = { ...axes.voltage, label: axisLabel(axes.voltage.index, name, headers.axes, "X") };
  const current = { ...axes.current, label: axisLabel(axes.current.index, name, headers.axes, "Y") };
  const curve: RawCurve = {
    duration: width.value,
    label: name,
    row: headers.row,
    columns: { width: columnLetter(xi), voltage: voltage.label, current: current.label },
    points: [],
    rejected: 0,
  };
  return { curve, voltage, current };
}

function readCells(
  cells: readonly string[],
  row: number,
  pair: Pair,
  delimiter: Delimiter,
  errors: IssueList,
): void {
  const vCell = cells[pair.voltage.index] ?? "";
  const iCell = cells[pair.current.index] ?? "";
  if (vCell === "" && iCell === "") return;
  const v = readNumber(vCell, "voltage", pair.voltage.scale, delimiter);
  if (!v.ok) errors.add(row, pair.voltage.label, v.reason);
  const i = readNumber(iCell, "current", pair.current.scale, delimiter);
  if (!i.ok) errors.add(row, pair.current.label, i.reason);
  if (v.ok && i.ok) pair.curve.points.push({ v: v.value, i: i.value, row });
  else pair.curve.rejected++;
}

/** Reads a paired-column table whose first header row is at `headerIndex` (0-based). */
export function readPairedForm(table: Table, headerIndex: number, errors: IssueList): ShapeRead {
  const second = nextFilled(table, headerIndex + 1);
  const axisRow = isAxisRow(table.rows[second]) ? table.rows[second] : null;
  const first = axisRow === null ? second : second + 1;
  const columns = table.rows.reduce((widest, cells) => Math.max(widest, cells.length), 0);
  const headers: Headers = {
    names: table.rows[headerIndex],
    row: headerIndex + 1,
    axes: axisRow,
    axesRow: second + 1,
    delimiter: table.delimiter,
  };
  const pairs: (Pair | null)[] = [];
  for (let xi = 0; xi < columns; xi += 2) pairs.push(readPair(headers, xi, errors));
  const orphans = new Set<number>();
  let rows = 0;
  for (let k = first; k < table.rows.length; k++) {
    const cells = table.rows[k];
    if (cells.length === 0) continue;
    rows++;
    pairs.forEach((pair, p) => {
      if (pair !== null) {
        readCells(cells, k + 1, pair, table.delimiter, errors);
        return;
      }
      const filled = [2 * p, 2 * p + 1].find((index) => (cells[index] ?? "") !== "");
      const named = [2 * p, 2 * p + 1].some((index) => (headers.names[index] ?? "") !== "");
      if (filled !== undefined && !named && !orphans.has(p)) {
        orphans.add(p);
        errors.add(
          k + 1,
          columnLetter(filled),
          `values under no curve name: name the curve in row ${headerIndex + 1}`,
        );
      }
    });
  }
  const curves = pairs.filter((pair): pair is Pair => pair !== null).map((pair) => pair.curve);
  return { curves, rows };
}
