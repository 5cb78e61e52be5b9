// Why the capture stream keeps its own byte scanner: the same capture file read into Float64Arrays by papaparse (the
// app's CSV reader for everything else) and by the stream parser (src/lib/capture/parse-stream.ts), both from a
// string held whole and both streamed from disk. The papaparse side does the same work as the scanner: skips the
// preamble and header, reads the three mapped cells with Number(), refuses a non-number or a time that does not
// increase. Times and the ratio are printed, never asserted. Called by scripts/bench/capture.ts with its file.
import { createReadStream, readFileSync } from "node:fs";
import Papa from "papaparse";
import type { CaptureMapping } from "../../src/lib/capture/parse";
import { parseCaptureStream, parseCaptureText } from "../../src/lib/capture/parse-stream";

const RUNS = 3;

/** Collects the mapped columns of papaparse's rows into Float64Arrays as the stream parser does. */
function collector(mapping: CaptureMapping, firstRow: number, capacity: number) {
  const t = new Float64Array(capacity);
  const v = new Float64Array(capacity);
  const i = new Float64Array(capacity);
  let line = 0;
  let n = 0;
  let lastT = Number.NEGATIVE_INFINITY;
  return {
    row(cells: string[]) {
      const index = line++;
      if (index < firstRow - 1 || (cells.length === 1 && cells[0].trim() === "")) return;
      const time = Number(cells[mapping.time]) * mapping.timeScale;
      const volts = Number(cells[mapping.voltage]) * mapping.vScale + mapping.vOffset;
      const amps = Number(cells[mapping.current]) * mapping.iScale + mapping.iOffset;
      if (!Number.isFinite(time + volts + amps)) throw new Error(`row ${index + 1}: not a number`);
      if (!(time > lastT)) throw new Error(`row ${index + 1}: time does not increase`);
      t[n] = time;
      v[n] = volts;
      i[n] = amps;
      lastT = time;
      n++;
    },
    count: () => n,
  };
}

function papaparseText(text: string, mapping: CaptureMapping, firstRow: number, capacity: number): number {
  const collect = collector(mapping, firstRow, capacity);
  Papa.parse<string[]>(text, {
    delimiter: mapping.delimiter,
    step: (result) => collect.row(result.data),
  });
  return collect.count();
}

function papaparseStream(file: string, mapping: CaptureMapping, firstRow: number, capacity: number) {
  const collect = collector(mapping, firstRow, capacity);
  return new Promise<number>((resolve, reject) => {
    const parser = Papa.parse(Papa.NODE_STREAM_INPUT, { delimiter: mapping.delimiter });
    parser.on("data", (row: string[]) => {
      try {
        collect.row(row);
      } catch (error) {
        reject(error);
      }
    });
    parser.on("end", () => resolve(collect.count()));
    parser.on("error", reject);
    createReadStream(file).on("error", reject).pipe(parser);
  });
}

function best(times: number[]): number {
  return Math.min(...times);
}

function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(3)} s`;
}

/** Times papaparse against the stream parser on one capture file and prints both and their ratio. */
export async function comparePapaparse(file: string, size: number, mapping: CaptureMapping): Promise<void> {
  const text = readFileSync(file, "utf8");
  const reference = parseCaptureText(text, mapping);
  const samples = reference.t.length;
  const { firstRow } = reference;
  const resolved = reference.mapping;
  const times = {
    scanText: [] as number[],
    papaText: [] as number[],
    scanFile: [] as number[],
    papaFile: [] as number[],
  };
  for (let run = 0; run < RUNS; run++) {
    let start = performance.now();
    parseCaptureText(text, mapping);
    times.scanText.push(performance.now() - start);
    start = performance.now();
    const fromText = papaparseText(text, resolved, firstRow, samples);
    times.papaText.push(performance.now() - start);
    start = performance.now();
    await parseCaptureStream(createReadStream(file), mapping, { sizeHint: size });
    times.scanFile.push(performance.now() - start);
    start = performance.now();
    const fromFile = await papaparseStream(file, resolved, firstRow, samples);
    times.papaFile.push(performance.now() - start);
    if (fromText !== samples || fromFile !== samples) {
      throw new Error(`papaparse read ${fromText} and ${fromFile} samples, the stream parser ${samples}`);
    }
  }
  const line = (what: string, scan: number[], papa: number[]) =>
    console.log(
      `  ${what}: papaparse ${seconds(best(papa))}, stream parser ${seconds(best(scan))}, ` +
        `papaparse takes ${(best(papa) / best(scan)).toFixed(1)}× as long (best of ${RUNS})`,
    );
  console.log(`capture parsers: the same ${(size / 1e6).toFixed(0)} MB file, ${samples / 1e6} M samples`);
  line("from a string held whole", times.scanText, times.papaText);
  line("streamed from disk in 64 KB chunks", times.scanFile, times.papaFile);
}
