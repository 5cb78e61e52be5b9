// Engineering quantities in and out of the engine: "150 µs", "4.2 mΩ", "1.2 kW". SI prefixes p n µ m k M G
// belong to parsing and formatting only; inside, everything is plain SI (METHODS.md, units). Decisions:
// - the decimal separator is "." or a single "," ("1,5 ms" = "1.5 ms", as typed in many locales); a number with
//   both, or with two commas ("1,500.5", "1,5,0"), is refused: nobody can tell thousands from decimals;
// - prefixes and units are case-sensitive ("m" milli, "M" mega); µ may be written µ (U+00B5), μ (U+03BC) or
//   u; Ω may be written Ω (U+03A9), Ω (U+2126) or "ohm";
// - a prefix alone implies the expected unit ("4.2m" is 4.2e-3); "°C", "K/W" and "%" never take a prefix;
// - formatting gives `digits` significant figures without trailing zeros ("4.2 mΩ", not "4.20 mΩ": the
//   figures shown are what the value holds, not a claimed precision), a thin space U+2009 before the unit,
//   "-" for minus, and falls back to exponent notation outside p…G.

/** Units the parser knows, as written after normalisation. */
export const UNITS = ["V", "A", "W", "s", "Ω", "J", "K/W", "°C", "F", "H", "Hz", "%"] as const;
export type Unit = (typeof UNITS)[number];

const UNPREFIXED: ReadonlySet<string> = new Set(["°C", "K/W", "%"]);

const PREFIXES: Readonly<Record<string, number>> = {
  p: -12,
  n: -9,
  u: -6,
  "\u00b5": -6,
  "\u03bc": -6,
  m: -3,
  k: 3,
  M: 6,
  G: 9,
};

const UNIT_ALIASES: Readonly<Record<string, Unit>> = { ohm: "Ω", "\u2126": "Ω", "\u2103": "°C" };

export type ParsedQuantity =
  | { ok: true; value: number | "DC"; unit: Unit | null }
  | { ok: false; reason: string };

export interface ParseOptions {
  /** Accept "DC" (any case) as a pulse width. */
  allowDC?: boolean;
}

const NUMBER = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))(?:[eE]([+-]?\d+))?/;
/** A leading integer part followed by one decimal comma and digits, with no second separator after them. */
const DECIMAL_COMMA = /^([+-]?\d+),(?=\d+(?![\d.,]))/;

function unitOf(text: string): Unit | null {
  if (text in UNIT_ALIASES) return UNIT_ALIASES[text];
  return (UNITS as readonly string[]).includes(text) ? (text as Unit) : null;
}

/** Splits a suffix such as "ms", "mΩ", "m" or "K/W" into a power of ten and a unit. */
function readSuffix(suffix: string): { exponent: number; unit: Unit | null } | { reason: string } {
  if (suffix === "") return { exponent: 0, unit: null };
  const whole = unitOf(suffix);
  if (whole !== null) return { exponent: 0, unit: whole };
  const prefix = [...suffix][0];
  const rest = suffix.slice(prefix.length);
  const exponent = PREFIXES[prefix];
  if (exponent === undefined) return { reason: `unknown unit '${suffix}'` };
  if (rest === "") return { exponent, unit: null };
  const unit = unitOf(rest);
  if (unit === null) return { reason: `unknown unit '${suffix}'` };
  if (UNPREFIXED.has(unit)) return { reason: `${unit} takes no prefix` };
  return { exponent, unit };
}

/**
 * Parses an engineering value: a number with "." as decimal point, optional exponent, optional SI prefix and
 * optional unit, spaces allowed between ("150us", "150 µs", "1.5e-4", "4.2m", "4.2 mΩ"). With `expectedUnit`,
 * a different unit is an error and a missing one is implied. Empty, NaN-like or overflowing text is an error.
 */
export function parseQuantity(text: string, expectedUnit?: Unit, options: ParseOptions = {}): ParsedQuantity {
  const trimmed = text.trim();
  if (trimmed.toUpperCase() === "DC") {
    return options.allowDC
      ? { ok: true, value: "DC", unit: null }
      : { ok: false, reason: "'DC' is not allowed here" };
  }
  const comma = DECIMAL_COMMA.exec(trimmed);
  const written = comma === null ? trimmed : `${comma[1]}.${trimmed.slice(comma[1].length + 1)}`;
  const match = NUMBER.exec(written);
  if (match === null) return { ok: false, reason: "expected a number" };
  const rest = written.slice(match[0].length);
  if (/^[,.]\d/.test(rest)) {
    return { ok: false, reason: "write one decimal separator and no thousands separator (e.g. 1500.5)" };
  }
  const suffix = readSuffix(rest.replace(/^[\s\u2009\u202f\u00a0]+/, ""));
  if ("reason" in suffix) return { ok: false, reason: suffix.reason };
  if (expectedUnit !== undefined && suffix.unit !== null && suffix.unit !== expectedUnit) {
    return { ok: false, reason: `expected unit '${expectedUnit}', got '${suffix.unit}'` };
  }
  // One exponent for mantissa and prefix, so that "4.2m" is exactly the double nearest 0.0042.
  const value = Number(`${match[1]}e${Number(match[2] ?? 0) + suffix.exponent}`);
  if (!Number.isFinite(value)) return { ok: false, reason: "number out of range" };
  return { ok: true, value, unit: suffix.unit ?? expectedUnit ?? null };
}

const THIN_SPACE = "\u2009";
const FORMAT_PREFIXES = ["p", "n", "µ", "m", "", "k", "M", "G"];

function trimNumber(value: number, digits: number): string {
  return String(Number(value.toPrecision(digits)));
}

/**
 * Formats a value in engineering notation with `digits` significant figures (1…21): 4.2e-3 Ω → "4.2 mΩ",
 * 1.5e-4 s → "150 µs", 1234 W → "1.23 kW"; °C, K/W and % are written without prefix in fixed notation.
 * Zero → "0 V"; NaN or infinite → "—" (nothing to show); beyond the prefixes p…G → "1.2e-15 s".
 */
export function formatQuantity(value: number, unit: Unit | "", digits = 3): string {
  const d = Math.min(21, Math.max(1, Math.round(digits)));
  if (!Number.isFinite(value)) return "—";
  const tail = unit === "" ? "" : `${THIN_SPACE}${unit}`;
  if (value === 0) return `0${tail}`;
  if (UNPREFIXED.has(unit)) {
    const magnitude = Math.floor(Math.log10(Math.abs(value)));
    const decimals = Math.min(20, Math.max(0, d - 1 - magnitude));
    return `${String(Number(value.toFixed(decimals)))}${tail}`;
  }
  // Round first, then choose the prefix, so that 999.96 µs becomes "1 ms" and not "1000 µs".
  const rounded = Number(value.toPrecision(d));
  const group = Math.floor(Math.floor(Math.log10(Math.abs(rounded))) / 3);
  const index = group + 4;
  if (index < 0 || index >= FORMAT_PREFIXES.length) {
    return `${rounded
      .toExponential(d - 1)
      .replace(/\.?0+e/, "e")
      .replace("e+", "e")}${tail}`;
  }
  const scaled = trimNumber(rounded / 10 ** (3 * group), d);
  const prefix = FORMAT_PREFIXES[index];
  if (unit === "") return prefix === "" ? scaled : `${scaled}${THIN_SPACE}${prefix}`;
  return `${scaled}${THIN_SPACE}${prefix}${unit}`;
}
