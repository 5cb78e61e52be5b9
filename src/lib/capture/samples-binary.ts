// A capture's samples as a compact binary object, so that a later check reloads them without parsing the CSV
// again: a 16-byte header ("PFCS", version, sample count, 0) and then t, v and i as little-endian Float64, each a
// contiguous block: decoding is a bounds check and three typed-array views.
import type { CaptureSamples } from "./parse-stream";

const MAGIC = 0x53434650; // "PFCS" read as a little-endian uint32
const VERSION = 1;
const HEADER_BYTES = 16;
const LITTLE_ENDIAN = new Uint8Array(Float64Array.of(1).buffer)[7] === 0x3f;

function header(n: number): Uint8Array {
  const bytes = new Uint8Array(HEADER_BYTES);
  const view = new DataView(bytes.buffer);
  view.setUint32(0, MAGIC, true);
  view.setUint32(4, VERSION, true);
  view.setUint32(8, n, true);
  return bytes;
}

/**
 * The binary object as four pieces, header, t, v and i, the last three sharing the samples' memory: 48 MB for
 * 2 M samples are sent to storage without being copied. On a big-endian machine, one piece (copied).
 */
export function encodeSamplesParts(samples: CaptureSamples): Uint8Array[] {
  const n = samples.t.length;
  if (samples.v.length !== n || samples.i.length !== n) {
    throw new RangeError("t, v and i must have the same number of samples");
  }
  const series = [samples.t, samples.v, samples.i];
  if (LITTLE_ENDIAN)
    return [header(n), ...series.map((s) => new Uint8Array(s.buffer, s.byteOffset, s.byteLength))];
  const bytes = new Uint8Array(HEADER_BYTES + 24 * n);
  bytes.set(header(n));
  const view = new DataView(bytes.buffer);
  series.forEach((s, k) => {
    for (let j = 0; j < n; j++) view.setFloat64(HEADER_BYTES + 8 * (n * k + j), s[j], true);
  });
  return [bytes];
}

/** The samples as one binary object: header, then t, v and i as little-endian Float64. */
export function encodeSamples(samples: CaptureSamples): Uint8Array {
  const parts = encodeSamplesParts(samples);
  if (parts.length === 1) return parts[0];
  const bytes = new Uint8Array(parts.reduce((sum, part) => sum + part.byteLength, 0));
  let offset = 0;
  for (const part of parts) {
    bytes.set(part, offset);
    offset += part.byteLength;
  }
  return bytes;
}

/**
 * Reads a samples object from a stream of chunks into one buffer sized from its header: a download costs one
 * copy of the samples, no more. Errors as `decodeSamples`.
 */
export async function decodeSamplesStream(source: AsyncIterable<Uint8Array>): Promise<CaptureSamples> {
  let bytes: Uint8Array | null = null;
  let head = new Uint8Array(0);
  let filled = 0;
  for await (const chunk of source) {
    if (bytes === null) {
      const joined = new Uint8Array(head.length + chunk.length);
      joined.set(head);
      joined.set(chunk, head.length);
      head = joined;
      if (head.length < HEADER_BYTES) continue;
      bytes = new Uint8Array(Math.max(HEADER_BYTES + 24 * sampleCount(head), head.length));
      bytes.set(head);
      filled = head.length;
      continue;
    }
    if (filled + chunk.length > bytes.length)
      throw new RangeError("capture samples object longer than its header says");
    bytes.set(chunk, filled);
    filled += chunk.length;
  }
  return decodeSamples((bytes ?? head).subarray(0, bytes === null ? head.length : filled));
}

/** The sample count of a samples object's header; RangeError when it is not one. */
function sampleCount(bytes: Uint8Array): number {
  if (bytes.byteLength < HEADER_BYTES) throw new RangeError("not a capture samples object (too short)");
  const view = new DataView(bytes.buffer, bytes.byteOffset, HEADER_BYTES);
  if (view.getUint32(0, true) !== MAGIC) throw new RangeError("not a capture samples object");
  if (view.getUint32(4, true) !== VERSION) throw new RangeError("unknown capture samples version");
  return view.getUint32(8, true);
}

/** Samples from `encodeSamples`' bytes; anything else → RangeError. Shares the bytes' memory when aligned. */
export function decodeSamples(bytes: Uint8Array): CaptureSamples {
  const n = sampleCount(bytes);
  if (bytes.byteLength !== HEADER_BYTES + 24 * n) {
    throw new RangeError(`capture samples object of ${bytes.byteLength} bytes does not hold ${n} samples`);
  }
  const aligned = bytes.byteOffset % 8 === 0 ? bytes : bytes.slice();
  const series = (k: number) => {
    const offset = aligned.byteOffset + HEADER_BYTES + 8 * n * k;
    if (LITTLE_ENDIAN) return new Float64Array(aligned.buffer, offset, n);
    const out = new Float64Array(n);
    const data = new DataView(aligned.buffer, offset, 8 * n);
    for (let j = 0; j < n; j++) out[j] = data.getFloat64(8 * j, true);
    return out;
  };
  return { t: series(0), v: series(1), i: series(2) };
}
