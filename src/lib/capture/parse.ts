// Scope waveform CSVs: the column mapping a capture is read with, and the preview the browser's column picker
// shows from the first ~64 KB of the file. Pure: runs in the browser and on the server alike. Decisions:
// - lines are tokenised and the separator guessed by the app's one CSV reader (src/lib/csv/text.ts: papaparse; a
//   tab if half the first 50 non-blank lines hold one, else ";" by the same rule, else ","); with ";" or tab, a
//   decimal comma is read as a decimal point;
// - the data block is the longest run of lines with the same set of numeric columns (two or more), extended back
//   over lines numeric in at least those columns (instruments that print settings beside the first samples) and
//   over rows of the same width numeric in half of them or more (a damaged cell is reported, not skipped);
// - the header is the last non-blank line before the data when it names every data column with text;
// - columns are suggested by the unit in their header first ("Time (s)", "CH1 (V)", "I [mA]"), then by name
//   (time/t/x; CH1/V/voltage; CH2/I/current), then in order among the numeric columns; units give the scales;
// - line numbers count every physical line (CRLF, LF or CR ends; a byte-order mark is dropped), blank ones
//   included, the way an editor numbers them; rows in messages are 1-based.
import { z } from "zod";
import { splitHeader, unitScale } from "@/lib/csv/header";
import { type Delimiter, guessDelimiter, normaliseText, splitLine } from "@/lib/csv/text";

/** Most samples a capture may hold: 2 M (48 MB as Float64 t, v, i). */
export const MAX_CAPTURE_SAMPLES = 2_000_000;
/** Largest capture file accepted for upload: 200 MB. */
export const MAX_CAPTURE_BYTES = 200_000_000;
/** How much of the file's start the preview (and the server's detection) reads. */
export const PREVIEW_BYTES = 65_536;
const PREVIEW_ROWS = 10;

const columnIndex = z.number().int().min(0).max(999);
const scale = z.number().refine((x) => x !== 0, { message: "A scale of 0 would erase the channel" });

/**
 * How to read a capture: lines to skip before the header (or the first data row), whether a header follows, the
 * 0-based columns of time, voltage and current, and per channel value = raw·scale + offset (probe attenuation,
 * units: a time column in µs has timeScale 1e-6). Without `skipRows` the rows are detected as the preview does;
 * without `delimiter` the separator is.
 */
export const captureMappingSchema = z
  .object({
    skipRows: z.number().int().min(0).max(100_000).optional(),
    header: z.boolean().default(false),
    delimiter: z.enum([",", ";", "\t"]).optional(),
    time: columnIndex,
    voltage: columnIndex,
    current: columnIndex,
    timeScale: z.number().positive().default(1),
    vScale: scale.default(1),
    vOffset: z.number().default(0),
    iScale: scale.default(1),
    iOffset: z.number().default(0),
  })
  .refine((m) => new Set([m.time, m.voltage, m.current]).size === 3, {
    message: "Time, voltage and current need three different columns",
    path: ["current"],
  });

export type CaptureMapping = z.output<typeof captureMappingSchema>;
export type CaptureMappingInput = z.input<typeof captureMappingSchema>;

export type ColumnRole = "time" | "voltage" | "current";

export interface CaptureColumn {
  index: number;
  /** Header text as written, or "Column 3" without a header. */
  label: string;
  /** Unit from the header ("mA"), or null. */
  unit: string | null;
  /** What the column holds, as far as the header tells. */
  role: ColumnRole | null;
  /** Factor to SI from the unit (1e-3 for mA), 1 when unknown. */
  scale: number;
  /** Numeric in most previewed data rows (the others are listed in `problems` when the column is mapped). */
  numeric: boolean;
}

export interface CapturePreview {
  delimiter: Delimiter;
  decimalComma: boolean;
  /** The lines before the header (or the data), as written. */
  preamble: string[];
  /** 0-based line of the header, or null. */
  headerRow: number | null;
  /** 0-based line of the first data row, or null when none was found. */
  dataRow: number | null;
  columns: CaptureColumn[];
  /** The first data rows, cell by cell. */
  rows: string[][];
  /** A complete mapping when time, voltage and current columns were found; otherwise null (see problems). */
  mapping: CaptureMapping | null;
  problems: string[];
}

const NUMBER_POINT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const NUMBER_ANY = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?$/;

/** A cell the capture reader takes as a number: decimal point, or a decimal comma unless "," separates. */
export function isNumericCell(cell: string, delimiter: Delimiter): boolean {
  return (delimiter === "," ? NUMBER_POINT : NUMBER_ANY).test(cell);
}

/** The lines of a text (any line ends, byte-order mark dropped); an unfinished last line is dropped unless complete. */
export function captureLines(text: string, complete: boolean): string[] {
  const lines = normaliseText(text).split("\n");
  if (lines.at(-1) === "" || !complete) lines.pop();
  return lines;
}

interface LineInfo {
  cells: string[];
  blank: boolean;
  /** 0-based indexes of the numeric cells. */
  numeric: number[];
}

function describeLines(lines: string[], delimiter: Delimiter): LineInfo[] {
  return lines.map((line) => {
    const blank = line.trim() === "";
    const cells = blank ? [] : splitLine(line, delimiter);
    const numeric: number[] = [];
    cells.forEach((cell, k) => {
      if (isNumericCell(cell, delimiter)) numeric.push(k);
    });
    return { cells, blank, numeric };
  });
}

/** First line of the data block and the numeric columns it shares, or null. */
function findDataBlock(info: LineInfo[]): { start: number; columns: number[] } | null {
  interface Run {
    start: number;
    length: number;
    key: string;
  }
  let best: Run | undefined;
  let run: Run | undefined;
  for (let k = 0; k < info.length; k++) {
    const line = info[k];
    if (line.blank) continue;
    const key = line.numeric.length >= 2 ? line.numeric.join(",") : null;
    if (key !== null && run !== undefined && run.key === key) run.length++;
    else run = key === null ? undefined : { start: k, length: 1, key };
    if (run !== undefined && (best === undefined || run.length > best.length)) best = { ...run };
  }
  if (best === undefined) return null;
  const columns = best.key.split(",").map(Number);
  const width = info[best.start].cells.length;
  let start = best.start;
  for (let k = start - 1; k >= 0; k--) {
    if (info[k].blank) continue;
    const numeric = new Set(info[k].numeric);
    const shared = columns.filter((c) => numeric.has(c)).length;
    const alike =
      shared === columns.length || (info[k].cells.length === width && 2 * shared >= columns.length);
    if (!alike) break;
    start = k;
  }
  return { start, columns };
}

const TIME_NAMES = new Set(["t", "x", "s", "sec", "seconds", "time", "timestamp", "zeit", "temps"]);
const VOLTAGE_NAME = /^(?:v|u|voltage|spannung|vds|vce|uds|vdrain|ch1|channel1|chan1|c1)$/;
const CURRENT_NAME = /^(?:i|current|strom|id|ic|ids|idrain|ch2|channel2|chan2|c2)$/;

function roleOfName(name: string): ColumnRole | null {
  const key = name.toLowerCase().replace(/[\s_.\-:]/g, "");
  if (TIME_NAMES.has(key) || key.startsWith("time")) return "time";
  if (VOLTAGE_NAME.test(key) || key.startsWith("voltage")) return "voltage";
  if (CURRENT_NAME.test(key) || key.startsWith("current")) return "current";
  return null;
}

const ROLE_OF_QUANTITY = { width: "time", voltage: "voltage", current: "current" } as const;

function describeColumn(index: number, header: string | undefined, numeric: boolean, problems: string[]) {
  const label = header === undefined || header === "" ? `Column ${index + 1}` : header;
  const split = header === undefined ? { name: "", unit: null } : splitHeader(header);
  let role: ColumnRole | null = null;
  let factor = 1;
  if (split.unit !== null) {
    const read = unitScale(split.unit);
    if (read.ok) {
      role = ROLE_OF_QUANTITY[read.quantity];
      factor = read.scale;
    } else if (numeric) problems.push(`${label}: ${read.reason}; scale 1 assumed`);
  }
  role ??= roleOfName(split.name);
  return { index, label, unit: split.unit, role, scale: factor, numeric } satisfies CaptureColumn;
}

/**
 * The first column of each role by header, then the remaining numeric columns in order (unlabelled ones first: a
 * shunt channel labelled "CH2 (V)" still ends up as the current when nothing else is left).
 */
function assignRoles(columns: CaptureColumn[]): Record<ColumnRole, CaptureColumn> | null {
  const usable = columns.filter((c) => c.numeric);
  const chosen: Partial<Record<ColumnRole, CaptureColumn>> = {};
  const taken = new Set<number>();
  for (const role of ["time", "voltage", "current"] as const) {
    const column = usable.find((c) => c.role === role && !taken.has(c.index));
    if (column) {
      chosen[role] = column;
      taken.add(column.index);
    }
  }
  for (const role of ["time", "voltage", "current"] as const) {
    if (chosen[role]) continue;
    const free = usable.filter((c) => !taken.has(c.index));
    const column = free.find((c) => c.role === null) ?? free[0];
    if (!column) return null;
    chosen[role] = column;
    taken.add(column.index);
  }
  return chosen as Record<ColumnRole, CaptureColumn>;
}

/**
 * What the column picker shows for the start of a capture file: separator, preamble, header, columns, the first
 * data rows and a suggested mapping. `complete` says the text is the whole file (else its last, possibly cut,
 * line is dropped).
 */
export function previewCaptureText(headText: string, options: { complete?: boolean } = {}): CapturePreview {
  const lines = captureLines(headText, options.complete ?? false);
  const delimiter = guessDelimiter(lines);
  const info = describeLines(lines, delimiter);
  const problems: string[] = [];
  const block = findDataBlock(info);
  if (block === null) {
    problems.push("No rows with two or more numbers were found: is this a waveform CSV?");
    return {
      delimiter,
      decimalComma: false,
      preamble: lines,
      headerRow: null,
      dataRow: null,
      columns: [],
      rows: [],
      mapping: null,
      problems,
    };
  }
  let headerRow: number | null = null;
  for (let k = block.start - 1; k >= 0; k--) {
    if (info[k].blank) continue;
    const cells = info[k].cells;
    const names = block.columns.every((c) => cells[c] !== undefined && cells[c] !== "");
    if (names && block.columns.every((c) => !isNumericCell(cells[c], delimiter))) headerRow = k;
    break;
  }
  const dataLines: number[] = [];
  for (let k = block.start; k < info.length && dataLines.length < PREVIEW_ROWS; k++) {
    if (!info[k].blank) dataLines.push(k);
  }
  const rows = dataLines.map((k) => info[k].cells);
  const width = Math.max(...rows.map((r) => r.length), headerRow === null ? 0 : info[headerRow].cells.length);
  const header = headerRow === null ? [] : info[headerRow].cells;
  const columns = Array.from({ length: width }, (_, index) => {
    const count = rows.filter((r) => r[index] !== undefined && isNumericCell(r[index], delimiter)).length;
    return describeColumn(index, header[index], 2 * count > rows.length, problems);
  });
  const decimalComma =
    delimiter !== "," &&
    rows.some((r) => r.some((cell) => cell.includes(",") && isNumericCell(cell, delimiter)));
  const roles = assignRoles(columns);
  if (roles === null) problems.push("Three numeric columns (time, voltage, current) were not found.");
  for (const column of roles === null ? [] : [roles.time, roles.voltage, roles.current]) {
    dataLines.forEach((line, k) => {
      const cell = rows[k][column.index] ?? "";
      if (!isNumericCell(cell, delimiter)) {
        problems.push(
          `Row ${line + 1}, ${column.label}: ${cell === "" ? "empty" : `'${cell}' is not a number`}`,
        );
      }
    });
  }
  const skipRows = headerRow ?? block.start;
  return {
    delimiter,
    decimalComma,
    preamble: lines.slice(0, skipRows),
    headerRow,
    dataRow: block.start,
    columns,
    rows,
    mapping:
      roles === null
        ? null
        : {
            skipRows,
            header: headerRow !== null,
            delimiter,
            time: roles.time.index,
            voltage: roles.voltage.index,
            current: roles.current.index,
            timeScale: roles.time.role === "time" ? roles.time.scale : 1,
            vScale: roles.voltage.role === "voltage" ? roles.voltage.scale : 1,
            vOffset: 0,
            iScale: roles.current.role === "current" ? roles.current.scale : 1,
            iOffset: 0,
          },
    problems,
  };
}
