// The one tick module of every log axis, on screen and in the PDF report: whole decades as the domain, major ticks
// at 10^k and minor at 2…9·10^k from d3-scale's log scale, and tick labels in engineering notation ("0.1", "1",
// "10", "100", "1k"; "10µ", "1m" below `plainFrom`).
import { scaleLog } from "d3-scale";

/** The smallest whole-decade interval holding every positive finite value, at least `minDecades` wide. */
export function decadeDomain(values: readonly number[], fallback: [number, number], minDecades = 1) {
  const usable = values.filter((v) => Number.isFinite(v) && v > 0);
  if (usable.length === 0) return fallback;
  const lo = Math.floor(Math.log10(Math.min(...usable)) + 1e-9);
  let hi = Math.ceil(Math.log10(Math.max(...usable)) - 1e-9);
  if (hi - lo < minDecades) hi = lo + minDecades;
  if (hi === lo) hi = lo + 1;
  return [10 ** lo, 10 ** hi] as [number, number];
}

/**
 * The ticks of a log axis over a whole-decade domain, from d3-scale's scaleLog().ticks(): major ticks at 10^k,
 * minor ticks at 2…9·10^k. Every decade keeps its subdivisions, however many decades the axis spans.
 */
export function logTicks(domain: readonly [number, number]): { major: number[]; minor: number[] } {
  const [lo, hi] = domain;
  // d3 subdivides every decade when asked for more ticks than there are decades (and for fewer than twice the
  // subdivisions it finds): one more than the number of decades does both.
  const decades = Math.max(1, Math.round(Math.log10(hi / lo)));
  const all = scaleLog()
    .domain([lo, hi])
    .ticks(decades + 1)
    .filter((t) => t >= lo * (1 - 1e-9) && t <= hi * (1 + 1e-9));
  const isDecade = (t: number) => Math.abs(Math.log10(t) - Math.round(Math.log10(t))) < 1e-9;
  return { major: all.filter(isDecade), minor: all.filter((t) => !isDecade(t)) };
}

/** Every power of ten in [lo, hi]. */
export function decadeTicks(domain: readonly [number, number]): number[] {
  return logTicks(domain).major;
}

/** 2…9 times each power of ten inside (lo, hi). */
export function minorTicks(domain: readonly [number, number]): number[] {
  return logTicks(domain).minor;
}

const prefixes: [number, string][] = [
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
  [1, ""],
  [1e-3, "m"],
  [1e-6, "µ"],
  [1e-9, "n"],
  [1e-12, "p"],
];

/**
 * A tick label in engineering notation: 1000 → "1k", 0.001 → "1m". Values from `plainFrom` up to 1000 are
 * written plainly ("0.1", "1", "100"), as engineers label SOA axes.
 */
export function engineeringTick(value: number, plainFrom = 0.1): string {
  if (value >= plainFrom && value < 1000) return String(Number(value.toPrecision(6)));
  for (const [scale, prefix] of prefixes) {
    if (value >= scale * (1 - 1e-9)) return `${Number((value / scale).toPrecision(6))}${prefix}`;
  }
  return value.toExponential(0);
}
