// Reading a thermal impedance curve Z_th(t) from CSV: two columns, time and Z_th (junction to case, single pulse),
// as digitised from a datasheet's transient thermal impedance figure. Decisions:
// - a header row is optional; a time unit in it ("t [ms]", "time (us)") scales the first column, else seconds;
//   the second column is K/W ("Zth [K/W]");
// - separators and decimal commas as for curve sets (text.ts, cell.ts); every value finite and > 0;
// - points are sorted by t; two points at the same t are an error; at least 4 points are needed to fit.
import type { ZthPoint } from "@/lib/soa/fit-foster";
import { decimalPoint } from "./cell";
import { splitHeader, unitScale } from "./header";
import { type CsvIssue, createIssueList, csvIssue } from "./issues";
import { readTable } from "./text";

export type ZthCsvResult = { ok: true; points: ZthPoint[] } | { ok: false; errors: CsvIssue[] };

const BARE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

export function parseZthCsv(text: string): ZthCsvResult {
  const read = readTable(text);
  if (!read.ok) return { ok: false, errors: read.issues.list() };
  const { rows, delimiter } = read.table;
  const errors = createIssueList();
  const first = rows.findIndex((r) => r.length > 0);
  if (first < 0) return { ok: false, errors: [csvIssue(null, null, "the file is empty")] };
  const hasHeader = !BARE.test(decimalPoint(rows[first][0] ?? "", delimiter) ?? "");
  let timeScale = 1;
  const names = ["t", "Z_th"];
  if (hasHeader) {
    const [tCell, zCell] = rows[first];
    const t = splitHeader(tCell ?? "");
    names[0] = tCell || "A";
    names[1] = zCell || "B";
    if (t.unit) {
      const scale = unitScale(t.unit, "width");
      if (scale.ok) timeScale = scale.scale;
      else errors.add(first + 1, names[0], scale.reason);
    }
  }
  const points: ZthPoint[] = [];
  for (let k = hasHeader ? first + 1 : first; k < rows.length; k++) {
    const row = rows[k];
    if (row.length === 0) continue;
    const values = [0, 1].map((c) => {
      const cell = row[c] ?? "";
      const textValue = decimalPoint(cell, delimiter);
      const value = textValue !== null && BARE.test(textValue) ? Number(textValue) : Number.NaN;
      if (!(Number.isFinite(value) && value > 0)) {
        errors.add(
          k + 1,
          names[c],
          cell === "" ? "the cell is empty" : `'${cell}' is not a number greater than 0`,
        );
      }
      return value;
    });
    points.push([values[0] * timeScale, values[1]]);
  }
  points.sort((a, b) => a[0] - b[0]);
  for (let k = 1; k < points.length; k++) {
    if (points[k][0] === points[k - 1][0]) errors.add(null, names[0], `two points at t = ${points[k][0]} s`);
  }
  if (errors.count === 0 && points.length < 4)
    errors.add(null, null, "at least 4 points are needed to fit a thermal model");
  if (errors.count > 0) return { ok: false, errors: errors.list() };
  return { ok: true, points };
}
