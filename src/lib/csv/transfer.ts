// Reading a part's transfer characteristics from CSV, typed or uploaded alike (METHODS.md §12): one point per row,
// three columns in this order, the junction temperature (°C), V_GS and I_D, as digitised from the datasheet's
// typical transfer characteristic figure. Decisions:
// - a header row is optional; a unit in it scales the V_GS and I_D columns as for curve sets ("I_D [mA]");
// - separators, decimal commas and cell rules as for curve sets (text.ts, cell.ts); V_GS and I_D finite and > 0;
// - the rows of one temperature form one curve, in the order given (the findings say when that order is not
//   ascending); the curves are returned cooler first. More than two temperatures is an error.
import { parseQuantity } from "@/lib/soa/units";
import { decimalPoint, readNumber } from "./cell";
import { splitHeader, unitScale } from "./header";
import { type CsvIssue, createIssueList, csvIssue } from "./issues";
import { readTable } from "./text";

/** One point as read, with its spreadsheet row for findings and the preview. */
export interface TransferPoint {
  row: number;
  temp: number;
  vgs: number;
  id: number;
}

export interface TransferCurveRead {
  temp: number;
  points: TransferPoint[];
}

export type TransferCsvResult =
  | { ok: true; curves: TransferCurveRead[]; names: [string, string, string] }
  | { ok: false; errors: CsvIssue[] };

const BARE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Largest transfer table accepted: 256 KiB (a datasheet figure holds a few dozen points). */
export const MAX_TRANSFER_BYTES = 256 * 1024;

export function parseTransferCsv(text: string): TransferCsvResult {
  const read = readTable(text, MAX_TRANSFER_BYTES);
  if (!read.ok) return { ok: false, errors: read.issues.list() };
  const { rows, delimiter } = read.table;
  const errors = createIssueList();
  const first = rows.findIndex((r) => r.length > 0 && r.some((c) => c !== ""));
  if (first < 0) return { ok: false, errors: [csvIssue(null, null, "there are no rows")] };
  const hasHeader = !BARE.test(decimalPoint(rows[first][0] ?? "", delimiter) ?? "");
  const names: [string, string, string] = ["T_j", "V_GS", "I_D"];
  const scales = [1, 1, 1];
  if (hasHeader) {
    rows[first].slice(0, 3).forEach((cell, c) => {
      if (cell) names[c] = cell;
      const { unit } = splitHeader(cell ?? "");
      if (c === 0 || !unit) return;
      const scale = unitScale(unit, c === 1 ? "voltage" : "current");
      if (scale.ok) scales[c] = scale.scale;
      else errors.add(first + 1, names[c], scale.reason);
    });
  }
  const byTemp = new Map<number, TransferPoint[]>();
  for (let k = hasHeader ? first + 1 : first; k < rows.length; k++) {
    const row = rows[k];
    if (row.length === 0 || row.every((c) => c === "")) continue;
    const rowNumber = k + 1;
    const temp = readTemperature(row[0] ?? "", delimiter);
    if (!temp.ok) errors.add(rowNumber, names[0], temp.reason);
    const vgs = readNumber(row[1] ?? "", "voltage", scales[1], delimiter);
    if (!vgs.ok) errors.add(rowNumber, names[1], vgs.reason);
    const id = readNumber(row[2] ?? "", "current", scales[2], delimiter);
    if (!id.ok) errors.add(rowNumber, names[2], id.reason);
    if (row.slice(3).some((c) => c !== "")) errors.add(rowNumber, null, "only three columns: T_j, V_GS, I_D");
    if (!temp.ok || !vgs.ok || !id.ok) continue;
    const list = byTemp.get(temp.value) ?? [];
    list.push({ row: rowNumber, temp: temp.value, vgs: vgs.value, id: id.value });
    byTemp.set(temp.value, list);
  }
  if (byTemp.size > 2) {
    errors.add(
      null,
      names[0],
      `${byTemp.size} temperatures (${[...byTemp.keys()].join(", ")} °C); give exactly two curves`,
    );
  }
  if (errors.count > 0) return { ok: false, errors: errors.list() };
  if (byTemp.size === 0) return { ok: false, errors: [csvIssue(null, null, "there are no points")] };
  const curves = [...byTemp.entries()]
    .map(([temp, points]) => ({ temp, points }))
    .sort((a, b) => a.temp - b.temp);
  return { ok: true, curves, names };
}

function readTemperature(
  cell: string,
  delimiter: "," | ";" | "\t",
): { ok: true; value: number } | { ok: false; reason: string } {
  if (cell === "") return { ok: false, reason: "the cell is empty" };
  const text = decimalPoint(cell, delimiter);
  if (text === null) return { ok: false, reason: `'${cell}' is not a number (use '.' for decimals)` };
  const value = BARE.test(text)
    ? Number(text)
    : (() => {
        const parsed = parseQuantity(text, "°C");
        return parsed.ok ? (parsed.value as number) : Number.NaN;
      })();
  if (!Number.isFinite(value)) return { ok: false, reason: `'${cell}' is not a temperature in °C` };
  if (value < -273.15 || value > 1000)
    return { ok: false, reason: `'${cell}' is outside −273 °C to 1000 °C` };
  return { ok: true, value };
}
