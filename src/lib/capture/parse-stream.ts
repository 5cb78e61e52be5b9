// Why this file is not papaparse, the app's CSV reader everywhere else (src/lib/csv/text.ts): measured by
// `npm run bench` (scripts/bench/capture-papaparse.ts) on the benchmark's 57 MB, 2 M-sample capture, the same work
// on both sides (preamble skipped, three columns read with Number() into Float64Arrays, time checked increasing):
//   streamed from disk in 64 KB chunks: papaparse 1.53 s, this parser 0.43 s (papaparse takes 3.6× as long);
//   from a string held whole:           papaparse 3.93 s, this parser 1.00 s (3.9×);
// best of 3, 2 Dec 2026, on the shared 2-core build machine with other jobs running (absolute times vary by 2×
// between runs there; the ratio less).
// The capture target is ≤ 5 s from "upload finished" to verdicts (issue 6); papaparse alone would take a third of
// it, and it makes a string per cell and an array per row (about 8 M strings here) where this scanner makes none.
// The preview and the separator and header detection this parser starts from are papaparse's (./parse.ts).
// Long file: about 500 lines on purpose: the parser's state lives in one class so that its hot loop (`lines`)
// keeps everything in locals, and readNumber hands its end position back through a module variable; split
// across modules, both would turn into property reads and calls per cell.
//
// Reading a scope capture CSV into Float64Arrays as it streams in. Bytes are scanned in place: no string per
// line or cell, no object per row. Only the first 64 KB are kept whole (to detect the separator and the rows
// with the preview's rules), plus the one line a chunk boundary cuts. Decisions:
// - numbers are read digit by digit; a mantissa of up to 2^53 with a power of ten of at most 22 is one correctly
//   rounded division or multiplication (Clinger's fast path), so the result equals Number()'s; anything else
//   (17 digits, 1e-300) goes through Number();
// - only the three mapped columns are read: other cells may hold anything;
// - a blank line is skipped; a missing or non-numeric mapped cell, a time not strictly increasing, or more than
//   2 M samples is an error naming the row (1-based line of the file) and column;
// - the file must be UTF-8 (or ASCII) text: NUL bytes or a UTF-16 byte-order mark are refused.

import { columnLetter, csvIssue } from "@/lib/csv/issues";
import { type Delimiter, splitLine } from "@/lib/csv/text";
import { AppError } from "@/lib/errors";
import { count } from "@/lib/format";
import { type CaptureMapping, MAX_CAPTURE_SAMPLES, PREVIEW_BYTES, previewCaptureText } from "./parse";

export interface CaptureSamples {
  /** Times in s, strictly increasing. */
  t: Float64Array;
  /** Voltage in V. */
  v: Float64Array;
  /** Current in A. */
  i: Float64Array;
}

export interface ParsedCapture extends CaptureSamples {
  /** Bytes read. */
  bytes: number;
  /** The mapping with detected rows and separator filled in. */
  mapping: CaptureMapping & { skipRows: number; delimiter: Delimiter };
  /** 1-based line of the first sample. */
  firstRow: number;
}

export interface CaptureParser {
  push(chunk: Uint8Array | string): void;
  end(): ParsedCapture;
}

export interface ParseOptions {
  maxSamples?: number;
  /** The file's size in bytes, if known: the sample arrays are sized from it instead of growing. */
  sizeHint?: number;
}

const MAX_SAFE = 2 ** 53 - 1;
const POW10 = Float64Array.from({ length: 23 }, (_, k) => 10 ** k);
const MAX_LINE = 1 << 20;
const SPACE = 32;
const TAB = 9;
const QUOTE = 34;
const INITIAL_CAPACITY = 1 << 16;

function rejected(row: number | null, column: string | null, reason: string): AppError {
  const issue = csvIssue(row, column, reason);
  return new AppError("invalid:csv", `The capture was not accepted: ${issue.message}`, {
    details: { issues: [issue] },
  });
}

class StreamingCaptureParser implements CaptureParser {
  private readonly mapping: CaptureMapping;
  private readonly maxSamples: number;
  private readonly sizeHint: number;
  private head: Uint8Array[] = [];
  private headLength = 0;
  private started = false;
  private bytes = 0;
  // Settings, fixed once the head is read.
  private separator = 44;
  private decimalComma = false;
  private newline = 10;
  private cr = 13;
  private skip = 0;
  private headerLine = -1;
  private labels: string[] = [];
  private delimiter: Delimiter = ",";
  private skipRows = 0;
  private header = false;
  private readonly columns = new Int32Array(3);
  private readonly slots = new Int32Array(3);
  // State.
  private line = 0;
  private firstRow = 0;
  private carry = new Uint8Array(4096);
  private carryLength = 0;
  private t: Float64Array;
  private v: Float64Array;
  private i: Float64Array;
  private n = 0;
  private lastT = Number.NEGATIVE_INFINITY;

  constructor(mapping: CaptureMapping, options: ParseOptions) {
    this.mapping = mapping;
    this.maxSamples = options.maxSamples ?? MAX_CAPTURE_SAMPLES;
    this.sizeHint = options.sizeHint ?? 0;
    this.t = new Float64Array(0);
    this.v = new Float64Array(0);
    this.i = new Float64Array(0);
  }

  push(chunk: Uint8Array | string): void {
    if (typeof chunk === "string") {
      for (const bytes of encodeSlices(chunk)) this.pushBytes(bytes);
    } else {
      // A plain Uint8Array view keeps the scanning loops monomorphic (Buffer is a subclass).
      this.pushBytes(new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength));
    }
  }

  private pushBytes(chunk: Uint8Array): void {
    if (chunk.length === 0) return;
    this.bytes += chunk.length;
    if (this.started) {
      this.scan(chunk);
      return;
    }
    this.head.push(chunk.slice());
    this.headLength += chunk.length;
    if (this.headLength >= PREVIEW_BYTES) this.start(false);
  }

  end(): ParsedCapture {
    if (!this.started) this.start(true);
    if (this.carryLength > 0) {
      this.appendCarry(Uint8Array.of(this.newline), 0, 1);
      this.lines(this.carry, 0, this.carryLength - 1);
      this.carryLength = 0;
    }
    if (this.n < 2) {
      throw rejected(null, null, `the file holds ${this.n} data rows; a capture needs at least two samples`);
    }
    const n = this.n;
    // Keep the arrays when they are nearly full; otherwise give the slack back.
    const trimmed = (a: Float64Array) => (a.length - n > n / 16 ? a.slice(0, n) : a.subarray(0, n));
    return {
      t: trimmed(this.t),
      v: trimmed(this.v),
      i: trimmed(this.i),
      bytes: this.bytes,
      mapping: { ...this.mapping, skipRows: this.skipRows, header: this.header, delimiter: this.delimiter },
      firstRow: this.firstRow,
    };
  }

  /** Reads the settings from the head of the file, then scans it. */
  private start(complete: boolean): void {
    const head = new Uint8Array(this.headLength);
    let offset = 0;
    for (const part of this.head) {
      head.set(part, offset);
      offset += part.length;
    }
    this.head = [];
    if ((head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff)) {
      throw rejected(null, null, "the file is UTF-16 text; export or save it as UTF-8 (or ASCII) CSV");
    }
    if (head.includes(0)) throw rejected(null, null, "the file holds NUL bytes, so it is not a text CSV");
    const bom = head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf ? 3 : 0;
    const body = head.subarray(bom);
    const m = this.mapping;
    const preview =
      m.skipRows === undefined || m.delimiter === undefined
        ? previewCaptureText(new TextDecoder().decode(body.subarray(0, PREVIEW_BYTES)), {
            complete: complete && body.length <= PREVIEW_BYTES,
          })
        : null;
    this.delimiter = m.delimiter ?? preview?.delimiter ?? ",";
    const detected = preview?.mapping;
    if (m.skipRows === undefined && !detected) {
      throw rejected(null, null, preview?.problems[0] ?? "no data rows were found");
    }
    this.skipRows = m.skipRows ?? detected?.skipRows ?? 0;
    this.header = m.skipRows === undefined ? (detected?.header ?? false) : m.header;
    this.headerLine = this.header ? this.skipRows : -1;
    this.skip = this.skipRows + (this.header ? 1 : 0);
    this.separator = this.delimiter.charCodeAt(0);
    this.decimalComma = this.delimiter !== ",";
    this.newline = body.includes(10) || !body.includes(13) ? 10 : 13;
    this.cr = this.newline === 10 ? 13 : -1;
    const order = [
      [m.time, 0],
      [m.voltage, 1],
      [m.current, 2],
    ].sort((a, b) => a[0] - b[0]);
    order.forEach(([column, slot], k) => {
      this.columns[k] = column;
      this.slots[k] = slot;
    });
    this.allocate(body);
    this.started = true;
    this.scan(body);
  }

  /** Sizes the arrays from the file size and the head's line length, so that a typical file never regrows. */
  private allocate(body: Uint8Array): void {
    let lines = 0;
    for (let k = 0; k < body.length; k++) if (body[k] === this.newline) lines++;
    let capacity = INITIAL_CAPACITY;
    if (this.sizeHint > 0 && lines > 0) {
      capacity = Math.ceil((this.sizeHint / (body.length / lines)) * 1.02) + 16;
    }
    capacity = Math.max(16, Math.min(capacity, this.maxSamples));
    this.t = new Float64Array(capacity);
    this.v = new Float64Array(capacity);
    this.i = new Float64Array(capacity);
  }

  private grow(): void {
    const capacity = Math.min(this.maxSamples, this.t.length * 2);
    const regrow = (a: Float64Array) => {
      const b = new Float64Array(capacity);
      b.set(a);
      return b;
    };
    this.t = regrow(this.t);
    this.v = regrow(this.v);
    this.i = regrow(this.i);
  }

  /** Scans the whole lines of a chunk; the cut line at its end waits in `carry` for the next chunk. */
  private scan(chunk: Uint8Array): void {
    const nl = this.newline;
    const last = chunk.lastIndexOf(nl);
    if (last < 0) {
      this.appendCarry(chunk, 0, chunk.length);
      return;
    }
    let from = 0;
    if (this.carryLength > 0) {
      const first = chunk.indexOf(nl);
      this.appendCarry(chunk, 0, first + 1);
      this.lines(this.carry, 0, this.carryLength - 1);
      this.carryLength = 0;
      from = first + 1;
    }
    this.lines(chunk, from, last);
    if (last + 1 < chunk.length) this.appendCarry(chunk, last + 1, chunk.length);
  }

  private appendCarry(chunk: Uint8Array, from: number, to: number): void {
    const needed = this.carryLength + to - from;
    if (needed > MAX_LINE) {
      throw rejected(
        this.line + 1,
        null,
        "the row is longer than 1 MB: this does not look like a waveform CSV",
      );
    }
    if (needed > this.carry.length) {
      const bigger = new Uint8Array(Math.max(needed, this.carry.length * 2));
      bigger.set(this.carry.subarray(0, this.carryLength));
      this.carry = bigger;
    }
    this.carry.set(chunk.subarray(from, to), this.carryLength);
    this.carryLength = needed;
  }

  /**
   * Reads the lines from `from` to the line end at `last` (buf[last] is a line end, so every scan stops there).
   * One loop with the hot state in locals: this runs once per sample.
   */
  private lines(buf: Uint8Array, from: number, last: number): void {
    const nl = this.newline;
    const cr = this.cr;
    const sep = this.separator;
    const comma = this.decimalComma;
    const { timeScale, vScale, vOffset, iScale, iOffset } = this.mapping;
    const columns = this.columns;
    const slots = this.slots;
    const max = this.maxSamples;
    let { t, v, i, n, lastT } = this;
    let p = from;
    while (p <= last) {
      const start = p;
      const lineIndex = this.line++;
      if (lineIndex < this.skip) {
        while (buf[p] !== nl) p++;
        if (lineIndex === this.headerLine) {
          this.labels = splitLine(new TextDecoder().decode(buf.subarray(start, p)), this.delimiter);
        }
        p++;
        continue;
      }
      let c = buf[p];
      while (c === SPACE || c === TAB || c === cr) c = buf[++p];
      if (c === nl) {
        p++;
        continue;
      }
      p = start;
      let column = 0;
      let ended = false;
      let rawT = 0;
      let rawV = 0;
      let rawI = 0;
      for (let k = 0; k < 3; k++) {
        const wanted = columns[k];
        while (column < wanted) {
          if (ended) throw this.missing(lineIndex, wanted);
          if (buf[p] === QUOTE) {
            p++;
            while (buf[p] !== nl && (buf[p] !== QUOTE || buf[p + 1] === QUOTE)) p += buf[p] === QUOTE ? 2 : 1;
          }
          while (buf[p] !== sep && buf[p] !== nl) p++;
          if (buf[p] === nl) ended = true;
          else p++;
          column++;
        }
        if (ended) throw this.missing(lineIndex, wanted);
        const value = readNumber(buf, p, sep, comma, cr);
        if (cursor < 0 || (buf[cursor] !== sep && buf[cursor] !== nl)) {
          throw this.notNumeric(buf, lineIndex, wanted, p);
        }
        p = cursor;
        const slot = slots[k];
        if (slot === 0) rawT = value;
        else if (slot === 1) rawV = value;
        else rawI = value;
        if (buf[p] === nl) ended = true;
        else p++;
        column++;
      }
      while (buf[p] !== nl) p++;
      p++;
      const time = rawT * timeScale;
      if (!(time > lastT)) throw this.notIncreasing(lineIndex, time, lastT);
      if (n === max) throw this.tooMany(lineIndex);
      if (n === t.length) {
        this.grow();
        ({ t, v, i } = this);
      }
      if (n === 0) this.firstRow = lineIndex + 1;
      t[n] = time;
      v[n] = rawV * vScale + vOffset;
      i[n] = rawI * iScale + iOffset;
      lastT = time;
      n++;
    }
    this.n = n;
    this.lastT = lastT;
  }

  private notIncreasing(lineIndex: number, time: number, previous: number): AppError {
    return rejected(
      lineIndex + 1,
      this.label(this.mapping.time),
      `time ${time} s does not increase after ${previous} s (times must strictly increase)`,
    );
  }

  private tooMany(lineIndex: number): AppError {
    return rejected(
      lineIndex + 1,
      null,
      `the capture has more than ${count(this.maxSamples)} samples; record fewer points or ` +
        "decimate it on the scope",
    );
  }

  private label(column: number): string {
    const name = this.labels[column];
    return name ? name : columnLetter(column);
  }

  private missing(lineIndex: number, column: number): AppError {
    return rejected(lineIndex + 1, this.label(column), "the row has no such column");
  }

  private notNumeric(buf: Uint8Array, lineIndex: number, column: number, from: number): AppError {
    let to = from;
    while (to < buf.length && buf[to] !== this.separator && buf[to] !== this.newline && to - from < 40) to++;
    const cell = new TextDecoder().decode(buf.subarray(from, to)).trim();
    return rejected(
      lineIndex + 1,
      this.label(column),
      cell === "" ? "the cell is empty" : `'${cell}' is not a number`,
    );
  }
}

// Where readNumber stopped: after the number and its trailing spaces or quote, or −1 when there was none.
let cursor = 0;

/**
 * Reads a number at p: spaces, an optional quote, sign, digits with "." (or "," when `comma`), exponent. Sets
 * `cursor`; a mantissa ≤ 2^53 with a power of ten ≤ 22 is exact by one correctly rounded operation, others go
 * through Number().
 */
function readNumber(buf: Uint8Array, start: number, sep: number, comma: boolean, cr: number): number {
  let p = start;
  let c = buf[p];
  while (c === SPACE || c === QUOTE || (c === TAB && sep !== TAB)) c = buf[++p];
  let negative = false;
  if (c === 45) {
    negative = true;
    c = buf[++p];
  } else if (c === 43) c = buf[++p];
  const unsigned = p;
  let mantissa = 0;
  let digits = 0;
  let exponent = 0;
  while (c >= 48 && c <= 57) {
    mantissa = mantissa * 10 + (c - 48);
    digits++;
    c = buf[++p];
  }
  if (c === 46 || (c === 44 && comma)) {
    c = buf[++p];
    while (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      exponent--;
      c = buf[++p];
    }
  }
  if (digits === 0) {
    cursor = -1;
    return 0;
  }
  if (c === 101 || c === 69) {
    c = buf[++p];
    let minus = false;
    if (c === 45) {
      minus = true;
      c = buf[++p];
    } else if (c === 43) c = buf[++p];
    if (!(c >= 48 && c <= 57)) {
      cursor = -1;
      return 0;
    }
    let e = 0;
    while (c >= 48 && c <= 57) {
      if (e < 1e6) e = e * 10 + (c - 48);
      c = buf[++p];
    }
    exponent += minus ? -e : e;
  }
  let value: number;
  if (mantissa === 0) value = 0;
  else if (mantissa <= MAX_SAFE && exponent >= -22 && exponent <= 22) {
    value = exponent < 0 ? mantissa / POW10[-exponent] : mantissa * POW10[exponent];
  } else {
    value = slowNumber(buf, unsigned, p);
    if (!Number.isFinite(value)) {
      cursor = -1;
      return 0;
    }
  }
  while (c === SPACE || c === QUOTE || c === cr || (c === TAB && sep !== TAB)) c = buf[++p];
  cursor = p;
  return negative ? -value : value;
}

/** Number() of bytes from..to, a decimal comma read as a point. */
function slowNumber(buf: Uint8Array, from: number, to: number): number {
  let text = "";
  for (let k = from; k < to; k++) text += buf[k] === 44 ? "." : String.fromCharCode(buf[k]);
  return Number(text);
}

const SLICE = 1 << 20;

/** UTF-8 bytes of a string, 1 Mi characters at a time through one reused buffer. */
function* encodeSlices(text: string): Generator<Uint8Array> {
  const encoder = new TextEncoder();
  const buffer = new Uint8Array(3 * SLICE);
  for (let from = 0; from < text.length; ) {
    let to = Math.min(text.length, from + SLICE);
    const last = text.charCodeAt(to - 1);
    if (to < text.length && last >= 0xd800 && last <= 0xdbff) to--;
    const { written } = encoder.encodeInto(text.slice(from, to), buffer);
    yield buffer.subarray(0, written);
    from = to;
  }
}

/** A parser to push chunks into (bytes as they arrive, or text), then `end()`. */
export function createCaptureParser(mapping: CaptureMapping, options: ParseOptions = {}): CaptureParser {
  return new StreamingCaptureParser(mapping, options);
}

/** Parses a whole capture held as text. */
export function parseCaptureText(
  text: string,
  mapping: CaptureMapping,
  options: ParseOptions = {},
): ParsedCapture {
  const parser = createCaptureParser(mapping, { sizeHint: text.length, ...options });
  parser.push(text);
  return parser.end();
}

/**
 * Parses a capture from a stream of chunks (a Node Readable from storage, a web ReadableStream's reader), each
 * chunk handed to `onChunk` first (to hash the file on the way).
 */
export async function parseCaptureStream(
  source: AsyncIterable<Uint8Array | string>,
  mapping: CaptureMapping,
  options: ParseOptions & { onChunk?: (chunk: Uint8Array | string) => void } = {},
): Promise<ParsedCapture> {
  const parser = createCaptureParser(mapping, options);
  for await (const chunk of source) {
    options.onChunk?.(chunk);
    parser.push(chunk);
  }
  return parser.end();
}
