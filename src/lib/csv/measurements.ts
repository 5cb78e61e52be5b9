// Measured pulses pasted by a technician from a spreadsheet or a scope's measurement table: one pulse per row,
// read into a preview where every row is shown, valid or not, with the problems of its own cells. Decisions:
// - separators, quotes, CRLF, blank rows and decimal commas are read as for uploads (text.ts, cell.ts); blank rows
//   are skipped, and a row keeps its source number (row 1 is the first pasted line);
// - the first non-blank row is a header unless its first non-empty cell starts with a number; without a header
//   the columns are V, I, width, shape, period, count in that order and further columns are ignored;
// - header names are compared in lower case without spaces or punctuation ("Pulse width" = "pulse_width"); a
//   voltage or current name may carry "max", "peak" or "pk" ("Vds max", "I_peak", "Ipk");
// - "T" is the repetition period, never the pulse width; "Id"/"ID" is the drain current unless another column
//   already is a current, then it is the label ("I_D" with a separator is always the current); "Pulse" is the
//   label, "Pulse [us]" (with a unit) the width;
// - a column mapping chosen by the user (column index → field, or "skip") overrides what the header says, as in
//   the capture's column step; without a header it overrides the V, I, width, shape, period, count order;
// - no column is dropped silently: a column with content that is read as nothing is listed in `columns.unread`
//   with a paste-level error (a "repeat period" column read as nothing turned a 50 ms train into a single pulse,
//   issue 12), until the user maps it or leaves it out ("skip"); skipped columns are listed in `columns.ignored`;
//   two columns for the same quantity are an error (reading the wrong one would pass a pulse);
// - a unit in the header scales bare numbers of its column, with one exponent ("80" in "[us]" is exactly 8e-5); a
//   value with its own unit ("48 V", "150 µs", "2 kHz") is read as written; bare times without a header unit are
//   seconds, bare frequencies hertz;
// - repetition: a period, or a frequency turned into period = 1/f (both given: they must agree within 1 %, and the
//   period is used); the count is a whole number ≥ 1, empty, "cont", "continuous", "inf" or "∞" meaning a
//   continuous train; without period or frequency a row is a single pulse (a count above 1 is then an error);
// - values that cannot be read are NaN in the row, which carries the reason in `errors`;
// - at most MAX_MEASUREMENT_ROWS pulse rows are read; beyond, a file-level error says which rows were left out.
// Long file: about 540 lines on purpose: the rules above are one reader, applied in turn to the header (the names table is a
// third of the file), the layout and each row; the cell readers (./measurement-cells.ts) and the save route's row
// schema (./measurement-row.ts) stand apart, and splitting the rest would put one rule's halves in two files.

import { z } from "zod";
import { count, q } from "@/lib/format";
import type { StoredShape } from "@/lib/projects/pulse-columns";
import type { Repeat } from "@/lib/soa/types";
import { type CellValue, readNumber } from "./cell";
import { splitHeader } from "./header";
import { type CsvIssue, columnLetter, createIssueList, csvIssue, type IssueList } from "./issues";
import {
  columnScale,
  exactly,
  MAX_LABEL_LENGTH,
  readCount,
  readFrequency,
  readTime,
  sane,
} from "./measurement-cells";
import { type Delimiter, readTable } from "./text";

export { type MeasurementInput, measurementRowSchema } from "./measurement-row";

/** Most pulse rows read from one paste. */
export const MAX_MEASUREMENT_ROWS = 1000;

/** Relative disagreement allowed between a period and 1/frequency given on the same row (display rounding). */
const PERIOD_AGREEMENT = 0.01;

export type MeasurementField =
  | "label"
  | "voltage"
  | "current"
  | "width"
  | "shape"
  | "period"
  | "frequency"
  | "count";

/** A column that was not read, and why. `header` is the header cell, or the column letter where none. */
export interface IgnoredColumn {
  index: number;
  header: string;
  note: string;
}

/** 0-based column index of each field found, and the columns left aside. */
export interface MeasurementColumns extends Partial<Record<MeasurementField, number>> {
  /** Columns not read: left out by the user's mapping, or unread and listed again in `unread`. */
  ignored: IgnoredColumn[];
  /** Columns with content that nothing reads and the user has not left out: saving waits for a choice. */
  unread?: IgnoredColumn[];
  /** Every column's header cell (or letter without a header), for the mapping step. */
  headers?: string[];
}

/** The user's choice per column (0-based index as text, as JSON keys are): a field, or "skip" to leave it out. */
export type ColumnMapping = Readonly<Partial<Record<string, MeasurementField | "skip">>>;

export const MEASUREMENT_FIELDS = [
  "label",
  "voltage",
  "current",
  "width",
  "shape",
  "period",
  "frequency",
  "count",
] as const satisfies readonly MeasurementField[];

/** A column mapping as a request carries it. */
export const columnMappingSchema = z.record(
  z.string().regex(/^\d{1,3}$/, { error: "a column is a number from 0" }),
  z.enum([...MEASUREMENT_FIELDS, "skip"], { error: "a column holds one of the pulse's fields, or skip" }),
);

/** One pasted pulse in SI units. Unreadable numbers are NaN; `errors` then says why. */
export interface MeasurementRow {
  /** 1-based row of the pasted text. */
  row: number;
  label: string;
  kind: StoredShape;
  v: number;
  i: number;
  duration: number;
  repeat?: Repeat;
  errors: CsvIssue[];
}

export interface MeasurementPaste {
  rows: MeasurementRow[];
  /** Problems of the paste as a whole: unreadable text, a header without the needed columns, no rows, too many. */
  errors: CsvIssue[];
  hasHeader: boolean;
  columns: MeasurementColumns;
}

const NAMES: Readonly<Record<MeasurementField, readonly string[]>> = {
  label: ["label", "name", "tag", "pulsename", "pulseid", "acq", "acquisition"],
  voltage: ["v", "u", "vds", "uds", "vce", "voltage", "drainsourcevoltage", "collectoremittervoltage"],
  current: ["i", "current", "draincurrent", "ic", "collectorcurrent"],
  width: [
    "width",
    "pulsewidth",
    "duration",
    "pulseduration",
    "pulselength",
    "tp",
    "tpulse",
    "time",
    "pw",
    "ton",
    "ontime",
    "pulsetime",
  ],
  shape: ["shape", "pulseshape", "kind", "type", "form"],
  period: [
    "period",
    "t",
    "repperiod",
    "repetitionperiod",
    "repeatperiod",
    "pulseperiod",
    "trainperiod",
    "trep",
    "tperiod",
    "tcycle",
    "cycle",
    "cycletime",
    "interval",
    "pulseinterval",
    "spacing",
  ],
  frequency: [
    "f",
    "freq",
    "frequency",
    "reprate",
    "repetitionrate",
    "repeatrate",
    "pulserate",
    "repfreq",
    "repetitionfrequency",
    "repeatfrequency",
    "pulsefrequency",
    "prf",
    "prr",
    "frep",
  ],
  count: [
    "count",
    "n",
    "pulses",
    "npulses",
    "pulsecount",
    "numberofpulses",
    "repetitions",
    "repeats",
    "repeatcount",
    "cycles",
    "ncycles",
    "trainlength",
    "burst",
    "burstcount",
  ],
};

const HEADERLESS: readonly MeasurementField[] = ["voltage", "current", "width", "shape", "period", "count"];
const HEADERLESS_NAME: Readonly<Partial<Record<MeasurementField, string>>> = {
  voltage: "V",
  current: "I",
  width: "width",
  shape: "shape",
  period: "period",
  count: "count",
};
const REQUIRED = ["voltage", "current", "width"] as const;
const EXAMPLES: Readonly<Record<(typeof REQUIRED)[number], string>> = {
  voltage: "V, V_DS, Vds, U or voltage",
  current: "I, I_D, Id, I_peak or current",
  width: "width, duration, t_p or pulse width",
};

const SHAPES: Readonly<Record<string, StoredShape>> = {
  rect: "rect",
  rectangle: "rect",
  rectangular: "rect",
  square: "rect",
  tri: "triangle",
  triangle: "triangle",
  triangular: "triangle",
  ramp: "triangle",
};
const NUMERIC_START = /^[+-]?(?:\d|[.,]\d)/;

interface Column {
  index: number;
  /** How messages name the column: the header cell, or the field's name without a header. */
  name: string;
  scale: number;
}

type Layout = Partial<Record<MeasurementField, Column>>;

function key(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]/g, "");
}

/** The field a header name stands for, "id" where it may be the label or the drain current, or null. */
function fieldOfName(name: string, unit: string | null): MeasurementField | "id" | null {
  if (/^i[\s_.-]+d\b/i.test(name)) return "current";
  const plain = key(name);
  if (plain === "id") return unit === null ? "id" : "current";
  if (plain === "pulse") return unit === null ? "label" : "width";
  for (const field of Object.keys(NAMES) as MeasurementField[])
    if (NAMES[field].includes(plain)) return field;
  const bare = plain.replace(/^(?:max|peak|pk)(?=.)/, "").replace(/(?<=.)(?:max|peak|pk)$/, "");
  if (bare === "id" || NAMES.current.includes(bare)) return "current";
  if (NAMES.voltage.includes(bare)) return "voltage";
  return null;
}

/** Words in a header that suggest a column holds repetition (a period, frequency or count of pulses). */
const REPETITION_HINT = /rep|period|freq|rate|count|cycle|train|burst|interval|spacing|hz|pulses|number/i;

function readHeader(cells: readonly string[], row: number, errors: IssueList, mapping: ColumnMapping) {
  const layout: Layout = {};
  const ignored: IgnoredColumn[] = [];
  const unnamed: number[] = [];
  const units = new Map<number, string | null>();
  let undecided: number | null = null;
  const take = (field: MeasurementField, index: number) => {
    const earlier = layout[field];
    if (earlier !== undefined) {
      errors.add(
        row,
        cells[index],
        `a second ${field} column besides '${earlier.name}'; remove or rename one of them`,
      );
    } else layout[field] = { index, name: cells[index], scale: 1 };
  };
  cells.forEach((cell, index) => {
    if (cell === "" && mapping[String(index)] === undefined) {
      unnamed.push(index);
      return;
    }
    const { name, unit } = splitHeader(cell);
    units.set(index, unit);
    const chosen = mapping[String(index)];
    if (chosen === "skip") {
      ignored.push({ index, header: cell, note: "left out" });
      return;
    }
    const field = chosen ?? fieldOfName(name, unit);
    if (field === null) ignored.push({ index, header: cell, note: "not a column Pulsefence reads" });
    else if (field === "id" && undecided === null) undecided = index;
    else take(field === "id" ? "current" : field, index);
  });
  if (undecided !== null) {
    if (layout.current === undefined) take("current", undecided);
    else if (layout.label === undefined) take("label", undecided);
    else ignored.push({ index: undecided, header: cells[undecided], note: "label and current are taken" });
  }
  for (const [field, column] of Object.entries(layout) as [MeasurementField, Column][]) {
    const scale = columnScale(field, units.get(column.index) ?? null);
    if (scale.ok) column.scale = scale.value;
    else errors.add(row, column.name, scale.reason);
  }
  for (const field of REQUIRED) {
    if (layout[field] !== undefined) continue;
    const period =
      field === "width" && layout.period !== undefined
        ? `; '${layout.period.name}' is read as the repetition period`
        : "";
    errors.add(row, null, `no ${field} column: name one ${EXAMPLES[field]}${period}`);
  }
  return { layout, ignored, unnamed };
}

function readRow(
  cells: readonly string[],
  row: number,
  position: number,
  layout: Layout,
  delimiter: Delimiter,
): MeasurementRow {
  const errors: CsvIssue[] = [];
  const cellOf = (column: Column | undefined) => (column === undefined ? "" : (cells[column.index] ?? ""));
  const value = (column: Column | undefined, read: CellValue<number>): number => {
    if (read.ok) return read.value;
    errors.push(csvIssue(row, column?.name ?? null, read.reason));
    return Number.NaN;
  };
  const { voltage, current, width, period, frequency, count } = layout;
  const amount = (column: Column | undefined, quantity: "voltage" | "current") => {
    const cell = cellOf(column);
    const scale = column?.scale ?? 1;
    const read = exactly(readNumber(cell, quantity, scale, delimiter), cell, scale, delimiter);
    return value(column, sane(read, cell, quantity));
  };
  const v = amount(voltage, "voltage");
  const i = amount(current, "current");
  const duration = value(
    width,
    sane(readTime(cellOf(width), width?.scale ?? 1, delimiter), cellOf(width), "time"),
  );

  const label = cellOf(layout.label) || `P${position}`;
  if (label.length > MAX_LABEL_LENGTH) {
    errors.push(
      csvIssue(
        row,
        layout.label!.name,
        `the label has ${label.length} characters; the limit is ${MAX_LABEL_LENGTH}`,
      ),
    );
  }

  let kind: StoredShape = "rect";
  const shapeCell = cellOf(layout.shape);
  if (shapeCell !== "") {
    const shape = SHAPES[shapeCell.toLowerCase()];
    if (shape === undefined) {
      errors.push(
        csvIssue(row, layout.shape!.name, `'${shapeCell}' is not a pulse shape (write rect or triangle)`),
      );
    } else kind = shape;
  }

  const periodCell = cellOf(period);
  const frequencyCell = cellOf(frequency);
  let repeatPeriod: number | null = null;
  let source: Column | undefined;
  if (periodCell !== "") {
    repeatPeriod = value(period, sane(readTime(periodCell, period!.scale, delimiter), periodCell, "time"));
    source = period;
  }
  if (frequencyCell !== "") {
    const f = value(
      frequency,
      sane(readFrequency(frequencyCell, frequency!.scale, delimiter), frequencyCell, "frequency"),
    );
    if (repeatPeriod === null) {
      repeatPeriod = 1 / f;
      source = frequency;
    } else if (Math.abs(repeatPeriod - 1 / f) > PERIOD_AGREEMENT * repeatPeriod) {
      errors.push(
        csvIssue(
          row,
          frequency!.name,
          `'${frequencyCell}' means a period of ${q(1 / f, "s")}, which disagrees with ` +
            `'${periodCell}' in ${period!.name}; keep one of them`,
        ),
      );
    }
  }
  if (
    repeatPeriod !== null &&
    Number.isFinite(repeatPeriod) &&
    Number.isFinite(duration) &&
    !(repeatPeriod > duration)
  ) {
    errors.push(
      csvIssue(
        row,
        source!.name,
        `the period (${q(repeatPeriod, "s")}) must be longer than the pulse (${q(duration, "s")})`,
      ),
    );
  }

  const counted = readCount(cellOf(count));
  let repeat: Repeat | undefined;
  if (!counted.ok) errors.push(csvIssue(row, count!.name, counted.reason));
  else if (repeatPeriod !== null) {
    repeat =
      typeof counted.value === "number"
        ? { period: repeatPeriod, count: counted.value }
        : { period: repeatPeriod };
  } else if (counted.value === "continuous" || (counted.value !== null && counted.value > 1)) {
    const what = counted.value === "continuous" ? "a continuous train needs" : `${counted.value} pulses need`;
    errors.push(csvIssue(row, count!.name, `${what} a period or a frequency to repeat at`));
  }

  return { row, label, kind, v, i, duration, ...(repeat === undefined ? {} : { repeat }), errors };
}

function startsWithNumber(cells: readonly string[]): boolean {
  return NUMERIC_START.test(cells.find((cell) => cell !== "") ?? "");
}

/** Reads pasted pulse rows into a preview (see the rules at the top of this file). Never throws. */
export function parseMeasurementPaste(text: string, mapping: ColumnMapping = {}): MeasurementPaste {
  const empty = (errors: CsvIssue[], hasHeader = false): MeasurementPaste => ({
    rows: [],
    errors,
    hasHeader,
    columns: { ignored: [] },
  });
  const read = readTable(text);
  if (!read.ok) return empty(read.issues.list());
  const { rows: table, delimiter } = read.table;
  const first = table.findIndex((cells) => cells.length > 0);
  if (first < 0) return empty([csvIssue(null, null, "nothing was pasted")]);
  const widest = table.reduce((most, cells) => Math.max(most, cells.length), 0);
  if (widest <= 1) {
    return empty([
      csvIssue(null, null, "only one column was found: separate the columns by tabs, commas or semicolons"),
    ]);
  }

  const errors = createIssueList();
  const hasHeader = !startsWithNumber(table[first]);
  let layout: Layout;
  let ignored: IgnoredColumn[];
  let unnamed: number[];
  const headers = Array.from({ length: widest }, (_, index) =>
    hasHeader && (table[first][index] ?? "") !== "" ? table[first][index] : columnLetter(index),
  );
  if (hasHeader) {
    ({ layout, ignored, unnamed } = readHeader(table[first], first + 1, errors, mapping));
  } else {
    ({ layout, ignored } = headerlessLayout(mapping, widest, errors));
    unnamed = [];
  }
  const known = new Set([
    ...Object.values(layout).map((column) => column.index),
    ...ignored.map((column) => column.index),
  ]);
  for (let index = hasHeader ? table[first].length : 0; index < widest; index++) {
    if (!known.has(index) && !unnamed.includes(index)) unnamed.push(index);
  }
  if (errors.count > 0) {
    return { ...empty(errors.list(), hasHeader), columns: columnsOf(layout, ignored, [], headers) };
  }

  const rows: MeasurementRow[] = [];
  const filled = new Set<number>();
  let left = 0;
  for (let k = hasHeader ? first + 1 : first; k < table.length; k++) {
    const cells = table[k];
    if (cells.length === 0) continue;
    if (rows.length === MAX_MEASUREMENT_ROWS) {
      left++;
      continue;
    }
    for (const index of unnamed) if ((cells[index] ?? "") !== "") filled.add(index);
    rows.push(readRow(cells, k + 1, rows.length + 1, layout, delimiter));
  }
  for (const index of unnamed.filter((u) => filled.has(u)).sort((a, b) => a - b)) {
    const note = hasHeader
      ? "no header names this column"
      : "without a header only V, I, width, shape, period and count are read";
    ignored.push({ index, header: columnLetter(index), note });
  }
  const unread = ignored.filter((column) => column.note !== "left out");
  for (const column of unread) {
    const repetition = REPETITION_HINT.test(column.header)
      ? ": it looks like repetition, and reading the pulses without it would check a train as a single pulse"
      : "";
    errors.add(
      null,
      column.header,
      `the column is not read${repetition}; choose what it holds under Columns, or leave it out`,
    );
  }
  if (rows.length === 0) errors.add(null, null, "no pulse rows below the header");
  if (left > 0) {
    const last = rows[rows.length - 1].row;
    errors.add(
      null,
      null,
      `${left} more pulse ${left === 1 ? "row" : "rows"} after row ${last} were left out: ` +
        `at most ${count(MAX_MEASUREMENT_ROWS)} are read from one paste`,
    );
  }
  return { rows, errors: errors.list(), hasHeader, columns: columnsOf(layout, ignored, unread, headers) };
}

/** Without a header: V, I, width, shape, period, count in that order, with the user's mapping over it. */
function headerlessLayout(mapping: ColumnMapping, widest: number, errors: IssueList) {
  const layout: Layout = {};
  const ignored: IgnoredColumn[] = [];
  const chosen = new Map<number, MeasurementField | "skip">();
  for (let index = 0; index < widest; index++) {
    const choice = mapping[String(index)] ?? HEADERLESS[index];
    if (choice !== undefined) chosen.set(index, choice);
  }
  for (const [index, choice] of chosen) {
    if (choice === "skip") {
      ignored.push({ index, header: columnLetter(index), note: "left out" });
    } else if (layout[choice] !== undefined) {
      errors.add(null, columnLetter(index), `a second ${choice} column besides ${layout[choice]!.name}`);
    } else {
      layout[choice] = { index, name: HEADERLESS_NAME[choice] ?? choice, scale: 1 };
    }
  }
  return { layout, ignored };
}

function columnsOf(
  layout: Layout,
  ignored: IgnoredColumn[],
  unread: IgnoredColumn[],
  headers: string[],
): MeasurementColumns {
  const columns: MeasurementColumns = {
    ignored: [...ignored].sort((a, b) => a.index - b.index),
    unread: [...unread].sort((a, b) => a.index - b.index),
    headers,
  };
  for (const [field, column] of Object.entries(layout) as [MeasurementField, Column][]) {
    columns[field] = column.index;
  }
  return columns;
}
