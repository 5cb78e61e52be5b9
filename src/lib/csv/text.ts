// The app's one CSV reader: every upload (curve sets, measurements, Z_th, transfer curves), the capture preview and
// the rows pasted into the thermal model editor are tokenised here, by papaparse, with one separator rule. Only the
// capture stream parser (src/lib/capture/parse-stream.ts) scans bytes itself, for speed it measures in its header.
// Turning an uploaded, already decoded CSV into a table of trimmed cells. Decisions:
// - the size limit is checked on the UTF-8 byte length, as stored, not on the string length;
// - text only: a NUL anywhere, or more than 1 % control or undecodable (U+FFFD) characters in the first 64 Ki
//   characters, means the file is binary (a workbook, an image) and is rejected before tokenising;
// - a byte-order mark is dropped and CRLF or CR line ends become LF;
// - the separator is a tab if at least half of the first 50 non-blank lines hold one, else a semicolon by the same
//   rule, else a comma (files with decimal commas use ";" or tab, so a comma-separated file has no decimal commas);
//   `guessDelimiter` is that rule, for whole texts and for lists of lines alike;
// - cells are tokenised by papaparse (quotes, embedded separators), then trimmed; row k of the table is row k + 1
//   in a spreadsheet, blank rows included.
import Papa from "papaparse";
import { createIssueList, type IssueList } from "./issues";
import { MAX_CSV_BYTES, overLimit } from "./limits";

export type Delimiter = "," | ";" | "\t";

const BINARY_SCAN = 65_536;
const DETECT_LINES = 50;

/** UTF-8 length of a string in bytes, without allocating (a lone surrogate counts as U+FFFD, 3 bytes). */
export function utf8ByteLength(text: string): number {
  let bytes = 0;
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && k + 1 < text.length) {
      const next = text.charCodeAt(k + 1);
      if (next >= 0xdc00 && next <= 0xdfff) {
        bytes += 4;
        k++;
      } else bytes += 3;
    } else bytes += 3;
  }
  return bytes;
}

function isSuspect(code: number): boolean {
  const control = code < 0x20 && code !== 0x09 && code !== 0x0a && code !== 0x0d && code !== 0x0c;
  return control || code === 0x7f || code === 0xfffd;
}

/** Why the text cannot be a CSV upload (too large, binary), or null when it can. */
export function textProblem(text: string, maxBytes = MAX_CSV_BYTES): string | null {
  const bytes = utf8ByteLength(text);
  if (bytes > maxBytes) return `the file is ${overLimit(bytes, maxBytes)}`;
  if (text.includes("\0")) {
    return "the file contains NUL bytes, so it is not text (a workbook or an image?); save it as CSV and upload that";
  }
  const scanned = Math.min(text.length, BINARY_SCAN);
  let suspect = 0;
  for (let k = 0; k < scanned; k++) if (isSuspect(text.charCodeAt(k))) suspect++;
  if (suspect > Math.max(8, scanned / 100)) {
    return `the file does not look like text (${suspect} control or undecodable characters); save it as CSV in UTF-8`;
  }
  return null;
}

/** Drops a leading byte-order mark and makes every line end a LF. */
export function normaliseText(text: string): string {
  return text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
}

/**
 * The separator of some lines, the app's one rule: a tab if at least half of the first 50 non-blank lines hold
 * one, else a semicolon by the same rule, else a comma.
 */
export function guessDelimiter(lines: readonly string[]): Delimiter {
  const sample: string[] = [];
  for (const line of lines) {
    if (sample.length === DETECT_LINES) break;
    if (line.trim() !== "") sample.push(line);
  }
  const share = (mark: string) =>
    sample.filter((line) => line.includes(mark)).length / Math.max(1, sample.length);
  if (share("\t") >= 0.5) return "\t";
  if (share(";") >= 0.5) return ";";
  return ",";
}

/** The separator of a normalised text (see `guessDelimiter`). */
export function detectDelimiter(text: string): Delimiter {
  return guessDelimiter(text.split("\n", DETECT_LINES * 20));
}

/**
 * The trimmed cells of one line (no line end in it), tokenised like a whole file: double quotes group a cell
 * ("a,b") and "" inside them is a quote. An unclosed quote runs to the end of the line. A blank line has no cells. (Without a quote in the line papaparse splits it in its fast mode.)
 */
export function splitLine(line: string, delimiter: Delimiter): string[] {
  if (line.trim() === "") return [];
  const parsed = Papa.parse<string[]>(line, { delimiter, newline: "\n", header: false });
  return (parsed.data[0] ?? []).map((cell) => cell.trim());
}

export interface Table {
  /** Trimmed cells; rows[k] is spreadsheet row k + 1. A blank row is an empty array. */
  rows: string[][];
  delimiter: Delimiter;
}

export type TableResult = { ok: true; table: Table } | { ok: false; issues: IssueList };

/** Checks, normalises and tokenises an uploaded text. Unclosed quotes are reported by row. */
export function readTable(text: string, maxBytes = MAX_CSV_BYTES): TableResult {
  const issues = createIssueList();
  const problem = textProblem(text, maxBytes);
  if (problem !== null) {
    issues.add(null, null, problem);
    return { ok: false, issues };
  }
  const clean = normaliseText(text);
  const delimiter = detectDelimiter(clean);
  const parsed = Papa.parse<string[]>(clean, {
    delimiter,
    newline: "\n",
    header: false,
    skipEmptyLines: false,
  });
  for (const error of parsed.errors) {
    if (error.type === "Quotes") {
      issues.add((error.row ?? 0) + 1, null, 'a quoted cell is not closed (a " is missing)');
    }
  }
  if (issues.count > 0) return { ok: false, issues };
  const rows = parsed.data.map((row) => {
    const cells = row.map((cell) => cell.trim());
    return cells.every((cell) => cell === "") ? [] : cells;
  });
  return { ok: true, table: { rows, delimiter } };
}
