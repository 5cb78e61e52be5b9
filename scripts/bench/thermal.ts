// Thermal benchmark: capture → Tj by the exact update (METHODS.md §4), and the same capture by direct
// superposition of step responses for comparison. Figures are printed, never asserted.
// Target: 10 M samples × 4 Foster terms in ≤ 0.25 s, met by the fused route (waveformRiseVI: p = v·i formed inside
// the pass). The split route (powerFromVI, then waveformRise) is timed too, with p → Tj apart: writing p into a
// fresh 80 MB array costs first-touch page faults, which on some virtual machines outweigh the thermal pass.
import type { FosterTerm } from "../../src/lib/soa/foster";
import { powerFromVI, waveformRise, waveformRiseVI } from "../../src/lib/soa/thermal-waveform";

const RUNS = 5;
const CASE_TEMP = 85;
const WINDOW = 60e-3;
// A fictitious 4-term junction-to-case network.
export const NETWORK: FosterTerm[] = [
  { r: 0.015, tau: 2e-5 },
  { r: 0.08, tau: 4e-4 },
  { r: 0.22, tau: 6e-3 },
  { r: 0.18, tau: 5e-2 },
];

export interface Capture {
  t: Float64Array;
  v: Float64Array;
  i: Float64Array;
}

/**
 * Pre-charge inrush as a scope would record it (METHODS.md §11 example): 48 V into 1000 µF at 1 V/ms with a
 * 4.8 Ω load, gate released 2 ms into the window; a 300 kHz ring on the current and ±1 % noise on both channels.
 */
export function inrushCapture(samples: number): Capture {
  const [vIn, slew, capacitance, load, delay] = [48, 1000, 1000e-6, 4.8, 2e-3];
  const h = WINDOW / (samples - 1);
  const t = new Float64Array(samples);
  const v = new Float64Array(samples);
  const i = new Float64Array(samples);
  let state = 12345;
  const noise = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return 0.02 * (state / 4294967296 - 0.5);
  };
  for (let j = 0; j < samples; j++) {
    const time = j * h;
    const rampTime = Math.max(0, time - delay);
    const vOut = Math.min(vIn, slew * rampTime);
    const charging = time > delay && vOut < vIn;
    const ring = charging
      ? 1 + 0.05 * Math.exp(-rampTime / 50e-6) * Math.sin(2 * Math.PI * 300e3 * rampTime)
      : 1;
    t[j] = time;
    v[j] = Math.max(0, vIn - vOut) * (1 + noise());
    i[j] = ((charging ? capacitance * slew : 0) + vOut / load) * ring * (1 + noise());
  }
  return { t, v, i };
}

/** Wall times in ms of capture → Tj by the fused route over RUNS runs: best, first; and Tj. */
function timeFused(capture: Capture) {
  let best = Number.POSITIVE_INFINITY;
  let first = 0;
  let tj = 0;
  for (let run = 0; run < RUNS; run++) {
    const start = performance.now();
    tj = CASE_TEMP + waveformRiseVI(capture.t, capture.v, capture.i, NETWORK).peak;
    const elapsed = performance.now() - start;
    if (run === 0) first = elapsed;
    best = Math.min(best, elapsed);
  }
  return { best, first, tj };
}

/** Wall times in ms of capture → Tj by the split route over RUNS runs: best total, best p → Tj part, first; and Tj. */
function timeSplit(capture: Capture) {
  let best = Number.POSITIVE_INFINITY;
  let bestRise = Number.POSITIVE_INFINITY;
  let first = 0;
  let tj = 0;
  for (let run = 0; run < RUNS; run++) {
    const start = performance.now();
    const p = powerFromVI(capture.v, capture.i);
    const middle = performance.now();
    tj = CASE_TEMP + waveformRise(capture.t, p, NETWORK).peak;
    const end = performance.now();
    if (run === 0) first = end - start;
    best = Math.min(best, end - start);
    bestRise = Math.min(bestRise, end - middle);
  }
  return { best, bestRise, first, tj };
}

/**
 * The classic method: power held at p_k from t_k to t_(k+1), rise at t_n = Σ_(k≤n) (p_k − p_(k−1))·Z_th(t_n − t_k),
 * with Z_th tabulated once on the uniform grid. O(N²).
 */
function superposeSteps(p: Float64Array, h: number): Float64Array {
  const n = p.length;
  const z = new Float64Array(n);
  for (let lag = 0; lag < n; lag++) {
    for (const { r, tau } of NETWORK) z[lag] -= r * Math.expm1((-lag * h) / tau);
  }
  const rise = new Float64Array(n);
  for (let m = 0; m < n; m++) {
    let sum = 0;
    for (let k = 0; k <= m; k++) sum += (p[k] - (k === 0 ? 0 : p[k - 1])) * z[m - k];
    rise[m] = sum;
  }
  return rise;
}

/** The same held (staircase) power as samples for the exact update: a zero-length step at every sample. */
function staircase(t: Float64Array, p: Float64Array) {
  const n = t.length;
  const ts = new Float64Array(2 * n - 1);
  const ps = new Float64Array(2 * n - 1);
  ts[0] = t[0];
  ps[0] = p[0];
  for (let k = 1; k < n; k++) {
    ts[2 * k - 1] = t[k];
    ps[2 * k - 1] = p[k - 1];
    ts[2 * k] = t[k];
    ps[2 * k] = p[k];
  }
  return { ts, ps };
}

function maxDifference(a: Float64Array, b: ArrayLike<number>, stride = 1, offset = 0): number {
  let max = 0;
  for (let m = 1; m < a.length; m++) max = Math.max(max, Math.abs(a[m] - b[stride * m - offset]));
  return max;
}

function format(ms: number): string {
  return ms < 1000 ? `${ms.toFixed(1)} ms` : `${(ms / 1000).toFixed(2)} s`;
}

export function runThermalBench(): void {
  console.log(
    `thermal: capture (t, v, i) → Tj = Tc + max Σθ_i, ${NETWORK.length} Foster terms, uniform ${WINDOW * 1e3} ms ` +
      `window, Tc ${CASE_TEMP} °C; best of ${RUNS} runs (first run shown too)`,
  );
  for (const samples of [1_000_000, 10_000_000]) {
    const capture = inrushCapture(samples);
    const fused = timeFused(capture);
    const split = timeSplit(capture);
    console.log(
      `  ${samples / 1e6} M samples, fused (p = v·i inside the pass): ${format(fused.best)} ` +
        `(first ${format(fused.first)}), ${(samples / fused.best / 1e3).toFixed(0)} M samples/s; ` +
        `Tj ${fused.tj.toFixed(3)} °C`,
    );
    console.log(
      `    split (p = v·i stored, then p → Tj): ${format(split.best)} (first ${format(split.first)}), ` +
        `${(samples / split.best / 1e3).toFixed(0)} M samples/s; of which p → Tj ${format(split.bestRise)}; ` +
        `Tj ${split.tj === fused.tj ? "the same" : `differs by ${(split.tj - fused.tj).toExponential(1)} K`}`,
    );
  }

  const samples = 20_000;
  const capture = inrushCapture(samples);
  const p = powerFromVI(capture.v, capture.i);
  const h = WINDOW / (samples - 1);
  const fast = timeSplit(capture);
  const start = performance.now();
  const superposed = superposeSteps(p, h);
  const direct = performance.now() - start;
  const { ts, ps } = staircase(capture.t, p);
  const held = waveformRise(ts, ps, NETWORK, { trace: true }).trace!;
  const linear = waveformRise(capture.t, p, NETWORK, { trace: true }).trace!;
  console.log(
    `  ${samples / 1000} k samples: superposition of step responses (O(N²), one run) ${format(direct)}, exact update p → Tj ` +
      `${format(fast.bestRise)} (${Math.round(direct / fast.bestRise)}× faster)`,
  );
  console.log(
    `    max |ΔTj|, both on the held (staircase) power: ${maxDifference(superposed, held, 2, 1).toExponential(1)} K; ` +
      `held vs linear between samples (the models differ by O(h)): ${maxDifference(superposed, linear).toFixed(4)} K`,
  );
}
