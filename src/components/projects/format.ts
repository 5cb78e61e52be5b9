import { formatTemperature } from "@/lib/soa/sanity";
import type { Repeat, Verdict } from "@/lib/soa/types";
import { formatQuantity, type Unit } from "@/lib/soa/units";

/**
 * A quantity for a cell, or a dash where there is none (JSON turns NaN into null); a temperature beyond the sane
 * display range reads "off scale".
 */
export function q(value: number | null | undefined, unit: Unit | "", digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return unit === "°C" ? formatTemperature(value) : formatQuantity(value, unit, digits);
}

export const verdictWords: Record<Verdict, string> = {
  pass: "pass",
  marginal: "marginal",
  fail: "fail",
  "no-data": "no data",
};

export const shapeWords = {
  rect: "rectangle",
  triangle: "falling triangle",
  waveform: "waveform",
  avalanche: "unclamped turn-off (avalanche)",
} as const;

/** A checked pulse's shape in words: a fault case's waveform is a fault sequence, a capture's a recorded waveform. */
export function pulseShape(pulse: { kind: keyof typeof shapeWords; source: string }): string {
  if (pulse.kind !== "waveform") return shapeWords[pulse.kind];
  return pulse.source === "fault-case" ? "fault sequence" : "recorded waveform";
}

export const sourceWords = { "fault-case": "fault case", measured: "measured", capture: "capture" } as const;

/** A repetition in words: "every 100 ms, 10 pulses", "every 1 s, continuous"; null for a single pulse. */
export function repeatText(repeat: Repeat | null | undefined): string | null {
  if (!repeat) return null;
  const count =
    repeat.count === undefined ? "continuous" : `${repeat.count} ${repeat.count === 1 ? "pulse" : "pulses"}`;
  return `every ${formatQuantity(repeat.period, "s")}, ${count}`;
}

export function repeatOf(row: {
  repeatPeriod: number | null;
  repeatCount: number | null;
}): Repeat | undefined {
  if (row.repeatPeriod === null) return undefined;
  return { period: row.repeatPeriod, ...(row.repeatCount !== null ? { count: row.repeatCount } : {}) };
}

/** Utilisation as a percentage: 0.834 → "83 %", 1.32 → "132 %". */
export function percent(u: number | null | undefined): string {
  if (u === null || u === undefined || !Number.isFinite(u)) return "—";
  return `${u < 0.1 ? (u * 100).toPrecision(2) : Math.round(u * 100)}\u2009%`;
}

/** A stored value for a form field: engineering notation without the unit, which the field shows. */
export function editableValue(value: number | null | undefined): string {
  if (value === null || value === undefined) return "";
  return formatQuantity(value, "", 6).replace("\u2009", "");
}
