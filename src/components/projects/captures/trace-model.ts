import { TEMPERATURE_DISPLAY_RANGE } from "@/lib/soa/sanity";
import type { Unit } from "@/lib/soa/units";

// What the trace charts draw, worked out before any pixel: the samples inside the time window, a panel's value
// range over them, and each series' min/max envelope as closed paths.

export type Pair = [number | null, number | null];

export interface TraceSeries {
  key: string;
  label: string;
  t: number[];
  y: Pair[];
  stroke: string;
  dash?: string;
}

/** Indices of the samples inside [t0, t1], with one neighbour either side so lines reach the edges. */
export function visibleRange(t: number[], t0: number, t1: number): [number, number] {
  let first = 0;
  while (first < t.length - 1 && t[first + 1] < t0) first++;
  let last = t.length - 1;
  while (last > 0 && t[last - 1] > t1) last--;
  return [first, last];
}

/**
 * A panel's value axis over the window: lowest to highest sample of its series there, 6 % room either side; a
 * temperature held within the display range (a runaway result is said "off scale" in words, not drawn to 10⁹ °C);
 * a flat trace gets ±1 around its value, and a panel with no finite sample 0 to 1.
 */
export function panelDomain(series: TraceSeries[], window: [number, number], unit: Unit): [number, number] {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const s of series) {
    const [first, last] = visibleRange(s.t, window[0], window[1]);
    for (let j = first; j <= last; j++) {
      const [a, b] = s.y[j] ?? [null, null];
      if (a !== null && Number.isFinite(a)) lo = Math.min(lo, a);
      if (b !== null && Number.isFinite(b)) hi = Math.max(hi, b);
    }
  }
  if (unit === "°C") {
    lo = Math.max(lo, TEMPERATURE_DISPLAY_RANGE.min);
    hi = Math.min(hi, TEMPERATURE_DISPLAY_RANGE.max);
  }
  if (!(lo <= hi)) [lo, hi] = [0, 1];
  if (lo === hi) [lo, hi] = [lo - 1, hi + 1];
  const pad = (hi - lo) * 0.06;
  return [lo - pad, hi + pad];
}

/** The min/max envelope of a decimated series as closed paths, one per run of finite samples. */
export function envelopePaths(
  series: TraceSeries,
  window: [number, number],
  x: (t: number) => number,
  y: (v: number) => number,
): string[] {
  const [first, last] = visibleRange(series.t, window[0], window[1]);
  const paths: string[] = [];
  let run: number[] = [];
  const flush = () => {
    if (run.length === 0) return;
    const upper = run.map((k) => `${x(series.t[k]).toFixed(1)},${y(series.y[k][1] as number).toFixed(1)}`);
    const lower = run
      .slice()
      .reverse()
      .map((k) => `${x(series.t[k]).toFixed(1)},${y(series.y[k][0] as number).toFixed(1)}`);
    paths.push(`M${upper.join("L")}L${lower.join("L")}Z`);
    run = [];
  };
  for (let k = first; k <= last; k++) {
    const [lo, hi] = series.y[k] ?? [null, null];
    if (lo === null || hi === null || !Number.isFinite(lo) || !Number.isFinite(hi)) flush();
    else run.push(k);
  }
  flush();
  return paths;
}
