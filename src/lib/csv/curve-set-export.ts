// Writing curves as a long-form curve-set CSV, the shape parseCurveSetCsv reads first: a header
// "pulse width,V_DS [V],I_D [A]", then one row per point. Used for downloads and by the demo library, so that
// generated curve sets go through the same upload path as a digitised file.
import type { Curve, Duration } from "@/lib/soa/types";

export const LONG_HEADER = "pulse width,V_DS [V],I_D [A]";

const TIME_UNITS: readonly [string, number][] = [
  ["s", 0],
  ["ms", -3],
  ["us", -6],
  ["ns", -9],
];

/**
 * A pulse width as an ASCII label that reads back to the same number: 1e-5 → "10us", 0.0015 → "1.5ms",
 * "DC" → "DC"; bare seconds where no prefix gives 1…999 with at most 12 digits.
 */
export function formatWidth(duration: Duration): string {
  if (duration === "DC") return "DC";
  for (const [unit, exponent] of TIME_UNITS) {
    // toPrecision(12) removes the binary noise of the division (1e-4 / 1e-6 = 100.00000000000001).
    const scaled: number = Number((duration / 10 ** exponent).toPrecision(12));
    const exact = Number(`${scaled}e${exponent}`) === duration;
    if (scaled >= 1 && scaled < 1000 && exact) return `${scaled}${unit}`;
  }
  return String(duration);
}

function formatNumber(value: number, digits: number | undefined): string {
  return String(digits === undefined ? value : Number(value.toPrecision(digits)));
}

export interface LongCsvOptions {
  /** Significant figures of V and I; absent: every digit, so that the file reads back exactly. */
  digits?: number;
}

/** Writes curves in the long form, points in the order given, LF line ends and a final newline. */
export function curvesToLongCsv(curves: readonly Curve[], options: LongCsvOptions = {}): string {
  const lines = [LONG_HEADER];
  for (const { duration, points } of curves) {
    const width = formatWidth(duration);
    for (const [v, i] of points)
      lines.push(`${width},${formatNumber(v, options.digits)},${formatNumber(i, options.digits)}`);
  }
  return `${lines.join("\n")}\n`;
}
