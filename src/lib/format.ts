// The one place for how the product writes its figures, on screen, in the PDF report and in e-mail: quantities with
// their units, utilisation, factors, money, file sizes and the values a form shows for editing. The words (verdicts,
// pulse shapes, sources, builders) are in `vocabulary.ts`. Rules, one per quantity (DESIGN.md, numbers and units):
// - a quantity: three significant figures in engineering notation with a thin space before the unit ("4.2 mΩ",
//   "150 µs"), no trailing zeros; a temperature beyond the sane range reads "off scale"; nothing → "—";
// - utilisation: a whole percentage from 10 % up ("83 %", "132 %"), two significant figures below ("4.2 %");
// - a factor without unit (stability factor S, derating ×, repetition ×): three significant figures ("0.85",
//   "1.23"), no trailing zeros, like every other figure;
// - money: two decimals and the currency code ("2.85 EUR");
// - a file size: SI units (1 kB = 1000 B, 1 MB = 10⁶ B) with three significant figures ("5 MB", "1.25 kB");
// - a value for editing: engineering notation without unit, 15 significant figures, so saving a form unchanged
//   never changes the value.
// The PDF's font has no thin space: the report passes these texts through `plainSpaces`.
import { formatTemperature } from "@/lib/soa/sanity";
import type { Repeat } from "@/lib/soa/types";
import { formatQuantity, type Unit } from "@/lib/soa/units";

export const THIN_SPACE = "\u2009";

const missing = (value: number | null | undefined): value is null | undefined =>
  value === null || value === undefined || !Number.isFinite(value);

/**
 * A quantity for a cell, or a dash where there is none (JSON turns NaN into null); a temperature beyond the sane
 * display range reads "off scale".
 */
export function q(value: number | null | undefined, unit: Unit | "", digits = 3): string {
  if (missing(value)) return "—";
  return unit === "°C" ? formatTemperature(value) : formatQuantity(value, unit, digits);
}

/**
 * Utilisation (or a curve's deviation) as a percentage, rounded up, so that it never reads lower than it is: a
 * pulse at 100.4 % of its limit fails and must not read "100 %". Whole percent from 10 %, two significant figures
 * below: 0.834 → "84 %", 1.004 → "101 %", 0.8 → "80 %", 0.042 → "4.2 %". Noise in a value's last digits (1.1 × 100
 * is 110.00000000000001) is not rounded up.
 */
export function percent(u: number | null | undefined): string {
  if (missing(u)) return "—";
  const pct = Number((u * 100).toPrecision(12));
  if (pct === 0 || Math.abs(pct) >= 10) return `${Math.ceil(pct)}${THIN_SPACE}%`;
  const step = 10 ** (Math.floor(Math.log10(Math.abs(pct))) - 1);
  return `${Number((Math.ceil(pct / step) * step).toPrecision(2))}${THIN_SPACE}%`;
}

/**
 * A limit someone set, as a percentage written as set (up to 4 significant figures, never rounded to a whole
 * percent): 0.875 → "87.5 %", 0.9 → "90 %". A measured utilisation uses `percent`; a setting shown rounded
 * would read as another setting.
 */
export function settingPercent(fraction: number | null | undefined): string {
  if (missing(fraction)) return "—";
  return `${Number((fraction * 100).toPrecision(4))}${THIN_SPACE}%`;
}

/** A factor without unit (stability factor S, derating, repetition scale): 0.8 → "0.8", 1.2345 → "1.23". */
export function factor(value: number | null | undefined): string {
  if (missing(value)) return "—";
  return String(Number(value.toPrecision(3)));
}

/** A unit cost with its currency ("2.85 EUR"), or a dash. */
export function money(value: number | null | undefined, currency: string | null | undefined): string {
  if (missing(value)) return "—";
  return `${value.toFixed(2)}${currency ? `${THIN_SPACE}${currency}` : ""}`;
}

/** A file size in B, kB or MB (SI): 512 → "512 B", 1250 → "1.25 kB", 5_000_000 → "5 MB". */
export function fileSize(size: number): string {
  if (size < 1000) return `${size}${THIN_SPACE}B`;
  if (size < 1e6) return `${Number((size / 1e3).toPrecision(3))}${THIN_SPACE}kB`;
  return `${Number((size / 1e6).toPrecision(3))}${THIN_SPACE}MB`;
}

/** A stored rating in a column's unit (the unit sits in the header): 0.0016 Ω in mΩ (scale 1e-3) → "1.6". */
export function inUnit(value: number | null | undefined, scale = 1, digits = 3): string {
  if (missing(value)) return "—";
  return String(Number((value / scale).toPrecision(digits)));
}

/**
 * A stored value as a form field shows it for editing: engineering notation without the unit, which the field
 * shows ("150µ"), or plain digits for fields that take no prefix; empty when there is none. 15 significant figures
 * unless `digits` says fewer (a figure offered to another form, rounded as the screen shows it).
 */
export function editable(
  value: number | null | undefined,
  kind: "plain" | "prefixed" = "prefixed",
  digits = 15,
): string {
  if (value === null || value === undefined) return "";
  if (kind === "plain") return String(Number(value.toPrecision(digits)));
  return formatQuantity(value, "", digits).replace(THIN_SPACE, "");
}

/** A date as engineers read it, ISO order, UTC: "2026-12-03"; with `withTime`, "2026-12-03 06:14 UTC". */
export function dateText(date: Date, withTime = false): string {
  const iso = date.toISOString();
  return withTime ? `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC` : iso.slice(0, 10);
}

/** How far long work has come, as a whole percentage of the bar: 0.456 → "46 %". Not a figure of the product. */
export function progress(fraction: number): string {
  return `${Math.round(fraction * 100)}${THIN_SPACE}%`;
}

/** A count of things, with thousands grouped: 1000000 → "1,000,000". */
export function count(n: number): string {
  return n.toLocaleString("en-GB");
}

/** A temperature difference (a margin or a rise) in kelvin, three significant figures: 25 → "25 K". */
export function kelvin(value: number | null | undefined): string {
  if (missing(value)) return "—";
  return `${Number(value.toPrecision(3))}${THIN_SPACE}K`;
}

/** "1 pulse", "3 pulses". */
export function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? "" : "s"}`;
}

/** A repetition in words: "every 100 ms, 10 pulses", "every 1 s, continuous"; null for a single pulse. */
export function repeatText(repeat: Repeat | null | undefined): string | null {
  if (!repeat) return null;
  const count = repeat.count === undefined ? "continuous" : plural(repeat.count, "pulse");
  return `every ${formatQuantity(repeat.period, "s")}, ${count}`;
}

/** The repetition of a stored pulse row, or none when its period is empty. */
export function repeatOf(row: {
  repeatPeriod: number | null;
  repeatCount: number | null;
}): Repeat | undefined {
  if (row.repeatPeriod === null) return undefined;
  return { period: row.repeatPeriod, ...(row.repeatCount !== null ? { count: row.repeatCount } : {}) };
}

/** A text for the PDF, whose font has no thin space: thin spaces become plain ones. */
export function plainSpaces(text: string): string {
  return text.replaceAll(THIN_SPACE, " ");
}
