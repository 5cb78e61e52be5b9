// Decade arithmetic for log-log axes: whole decades as the domain, major ticks at 10^k, minor at 2…9·10^k,
// and tick labels in engineering notation ("0.1", "1", "10", "100", "1k"; "10µ", "1m" below `plainFrom`).

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

/** Every power of ten in [lo, hi]. */
export function decadeTicks([lo, hi]: readonly [number, number]): number[] {
  const out: number[] = [];
  for (let k = Math.round(Math.log10(lo)); k <= Math.round(Math.log10(hi)); k++) out.push(exact(k, 1));
  return out;
}

/** 2…9 times each power of ten inside (lo, hi). */
export function minorTicks([lo, hi]: readonly [number, number]): number[] {
  const out: number[] = [];
  for (let k = Math.round(Math.log10(lo)); k < Math.round(Math.log10(hi)); k++) {
    for (let m = 2; m <= 9; m++) out.push(exact(k, m));
  }
  return out;
}

/** m·10^k without binary noise (0.1·3 is 0.30000000000000004, "3e-1" is 0.3). */
function exact(k: number, m: number): number {
  return Number(`${m}e${k}`);
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
