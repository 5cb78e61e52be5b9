// The cells of a measured-pulse paste (./measurements.ts): times, frequencies and counts read with their
// column's header unit, within the physical sanity limits, each failure a reason that names the cell as written.
import { type SaneQuantity, saneValue } from "@/lib/soa/sanity";
import { parseQuantity } from "@/lib/soa/units";
import { type CellValue, decimalPoint, readWidth } from "./cell";
import { unitScale } from "./header";
import type { MeasurementField } from "./measurements";
import type { Delimiter } from "./text";

export const MAX_LABEL_LENGTH = 80;
/** Largest count a database integer holds; longer trains are continuous in all but name. */
export const MAX_PULSE_COUNT = 2_147_483_647;
const CONTINUOUS = new Set(["cont", "continuous", "inf", "∞"]);
const BARE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** "khz" → "kHz", "HZ" → "Hz": people write hertz in any case; the prefix m stays milli. */
function normaliseHertz(text: string): string {
  return text.replace(/([kK]?)hz$/i, (_, prefix: string) => `${prefix.toLowerCase()}Hz`);
}

export function columnScale(field: MeasurementField, unit: string | null): CellValue<number> {
  if (unit === null) return { ok: true, value: 1 };
  if (field === "voltage" || field === "current") {
    const scaled = unitScale(unit, field);
    return scaled.ok ? { ok: true, value: scaled.scale } : scaled;
  }
  if (field === "width" || field === "period") {
    const scaled = unitScale(unit, "width");
    return scaled.ok ? { ok: true, value: scaled.scale } : scaled;
  }
  if (field === "frequency") {
    const parsed = parseQuantity(`1 ${normaliseHertz(unit.trim())}`, "Hz");
    if (parsed.ok && typeof parsed.value === "number") return { ok: true, value: parsed.value };
    return { ok: false, reason: `unit '${unit}' is not understood (expected Hz, with a prefix if needed)` };
  }
  return { ok: true, value: 1 };
}

/**
 * A bare number times a power-of-ten header scale, with one exponent as the engine's parser does, so that "80" in
 * a "[us]" column is the double nearest 8e-5 rather than 80 × 1e-6; other readings are returned as they are.
 */
export function exactly(
  read: CellValue<number>,
  cell: string,
  scale: number,
  delimiter: Delimiter,
): CellValue<number> {
  const text = decimalPoint(cell, delimiter);
  if (!read.ok || scale === 1 || text === null || !BARE.test(text)) return read;
  const exponent = Math.round(Math.log10(scale));
  if (Number(`1e${exponent}`) !== scale) return read;
  const [mantissa, own = "0"] = text.split(/[eE]/);
  return { ok: true, value: Number(`${mantissa}e${Number(own) + exponent}`) };
}

export function readTime(cell: string, scale: number, delimiter: Delimiter): CellValue<number> {
  const read = readWidth(cell, scale, delimiter);
  if (read.ok) {
    return read.value === "DC"
      ? { ok: false, reason: `'${cell}': a measured pulse needs a time, not DC` }
      : exactly({ ok: true, value: read.value }, cell, scale, delimiter);
  }
  if (!read.reason.startsWith(`'${cell}' is not a pulse width`)) return read;
  return { ok: false, reason: `'${cell}' is not a time (write for example 150 µs, 2.5 ms or 1e-3)` };
}

function positive(cell: string, value: number): CellValue<number> {
  if (!Number.isFinite(value)) return { ok: false, reason: `'${cell}' is not a finite number` };
  if (!(value > 0)) return { ok: false, reason: `'${cell}' must be greater than 0` };
  return { ok: true, value };
}

export function readFrequency(cell: string, scale: number, delimiter: Delimiter): CellValue<number> {
  const text = decimalPoint(cell, delimiter);
  if (text === null) return { ok: false, reason: `'${cell}' is not a number (use '.' for decimals)` };
  if (BARE.test(text)) return exactly(positive(cell, Number(text) * scale), cell, scale, delimiter);
  const parsed = parseQuantity(normaliseHertz(text), "Hz");
  if (!parsed.ok) {
    return {
      ok: false,
      reason:
        parsed.reason === "expected a number"
          ? `'${cell}' is not a frequency`
          : `'${cell}': ${parsed.reason}`,
    };
  }
  return positive(cell, parsed.value as number);
}

type Count = { ok: true; value: number | "continuous" | null } | { ok: false; reason: string };

export function readCount(cell: string): Count {
  if (cell === "") return { ok: true, value: null };
  if (CONTINUOUS.has(cell.toLowerCase())) return { ok: true, value: "continuous" };
  const value = BARE.test(cell) ? Number(cell) : Number.NaN;
  if (!Number.isInteger(value)) {
    return {
      ok: false,
      reason: `'${cell}' is not a whole number of pulses (or 'cont' for a continuous train)`,
    };
  }
  if (value < 1) return { ok: false, reason: `'${cell}': the count must be 1 or more` };
  if (value > MAX_PULSE_COUNT) {
    return {
      ok: false,
      reason: `'${cell}' is too many pulses to store; leave the cell empty for a continuous train`,
    };
  }
  return { ok: true, value };
}

/** A reading within the physical sanity limits (src/lib/soa/sanity.ts), or the reason it is refused. */
export function sane(read: CellValue<number>, cell: string, quantity: SaneQuantity): CellValue<number> {
  if (!read.ok) return read;
  const reason = saneValue(read.value, quantity);
  return reason === null ? read : { ok: false, reason: `'${cell}': ${reason}` };
}
