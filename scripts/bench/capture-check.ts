// The whole capture check against its anchor: a compiled IIR filter over the same samples (scripts/bench/iir.c, built
// with the machine's C compiler when there is one: p = v·i, each Foster term filtered into its own array, summed),
// with the same arithmetic fused into one compiled loop printed beside it. Printed: capture → Tj (the exact
// update with the between-samples search), the per-sample curve reading of METHODS.md §6 with 4 curves, and the
// whole check (both, plus flags and verdicts), each as a time and as a ratio to the compiled filter. Goals
// (issue 10): capture → Tj ≤ 0.5× the filter; the whole check ≤ 1× the filter. Figures only, never asserted.
import { execFileSync } from "node:child_process";
import { rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { checkPulse, prepareCheck } from "../../src/lib/soa/check";
import { rampFactor, waveformRiseVI } from "../../src/lib/soa/thermal-waveform";
import type { PartLimits, WaveformPulse } from "../../src/lib/soa/types";
import { readWaveform } from "../../src/lib/soa/waveform-check";
import { type Capture, inrushCapture, NETWORK } from "./thermal";

const RUNS = 5;
const SAMPLES = 10_000_000;

/** A fictitious part with 4 pulse curves and a DC curve (package line, thermal line, a steeper segment at high V). */
const PART: PartLimits = {
  vdsMax: 100,
  tjMax: 175,
  foster: NETWORK,
  soa: {
    curves: [1e-4, 1e-3, 1e-2, 1e-1, "DC" as const].map((duration, k) => {
      const level = [2000, 600, 200, 90, 60][k];
      return {
        duration,
        points: [
          [0.5, 400],
          [level / 400, 400],
          [40, level / 40],
          [100, level / 300],
        ] as [number, number][],
      };
    }),
  },
};

function best(run: () => void): number {
  let fastest = Number.POSITIVE_INFINITY;
  for (let k = 0; k < RUNS; k++) {
    const start = performance.now();
    run();
    fastest = Math.min(fastest, performance.now() - start);
  }
  return fastest;
}

/** Best times in ms of the compiled filter and fused loop over the capture, or null without a C compiler. */
function compiledFilter(capture: Capture): { ms: number; fused: number; peak: number } | null {
  const dir = tmpdir();
  const binary = join(dir, `pf-iir-${process.pid}`);
  const data = join(dir, `pf-iir-${process.pid}.bin`);
  try {
    execFileSync("cc", ["-O2", "-o", binary, join(import.meta.dirname, "iir.c")], { stdio: "ignore" });
  } catch {
    return null;
  }
  const h = capture.t[1] - capture.t[0];
  const header = new Float64Array(13);
  header[0] = capture.t.length;
  NETWORK.forEach(({ r, tau }, k) => {
    const x = h / tau;
    const oneMinusA = -Math.expm1(-x);
    header[1 + k] = oneMinusA;
    header[5 + k] = r * (oneMinusA - rampFactor(x));
    header[9 + k] = r * rampFactor(x);
  });
  const bytes = (a: Float64Array) => new Uint8Array(a.buffer, a.byteOffset, a.byteLength);
  writeFileSync(data, Buffer.concat([bytes(header), bytes(capture.v), bytes(capture.i)]));
  try {
    const [ms, fused, peak] = execFileSync(binary, [data], { encoding: "utf8" })
      .trim()
      .split(" ")
      .map(Number);
    return { ms, fused, peak };
  } finally {
    rmSync(binary, { force: true });
    rmSync(data, { force: true });
  }
}

export function runCaptureCheckBench(): void {
  const capture = inrushCapture(SAMPLES);
  const pulse = { id: "inrush", kind: "waveform", ...capture } as unknown as WaveformPulse;
  const ctx = prepareCheck(PART, 85);
  let tj = 0;
  const thermal = best(() => {
    tj = waveformRiseVI(capture.t, capture.v, capture.i, NETWORK).maxRise;
  });
  const reading = best(() => readWaveform(ctx.reader, pulse, ctx.derating));
  let verdict = "";
  const whole = best(() => {
    verdict = checkPulse(ctx, pulse).verdict;
  });
  const filter = compiledFilter(capture);
  const ratio = (ms: number) => (filter === null ? "" : ` (${(ms / filter.ms).toFixed(2)}× the filter)`);
  console.log(
    `capture check: ${SAMPLES / 1e6} M samples, ${NETWORK.length} Foster terms, 4 curves + DC; best of ${RUNS}`,
  );
  if (filter === null) console.log("  compiled IIR filter: no C compiler (cc) on this machine, no anchor");
  else {
    console.log(
      `  compiled IIR filter (cc -O2): ${filter.ms.toFixed(1)} ms; fused into one compiled loop: ` +
        `${filter.fused.toFixed(1)} ms; its peak rise at the samples and ours between them differ by ` +
        `${Math.abs(filter.peak - tj).toExponential(1)} K`,
    );
  }
  console.log(`  capture → Tj (between samples included): ${thermal.toFixed(1)} ms${ratio(thermal)}`);
  console.log(`  per-sample curve reading: ${reading.toFixed(1)} ms${ratio(reading)}`);
  console.log(`  whole check: ${whole.toFixed(1)} ms${ratio(whole)}; verdict ${verdict}`);
}
