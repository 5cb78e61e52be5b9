// The one place for how the product writes its values and verdicts on screen: quantities, percentages and the
// words for verdicts, pulse shapes and pulse sources. Area-specific helpers (components/decisions/format.ts,
// components/projects/format.ts) build on these and never define their own copies.
import { formatTemperature } from "@/lib/soa/sanity";
import type { Verdict } from "@/lib/soa/types";
import { formatQuantity, type Unit } from "@/lib/soa/units";

/**
 * A quantity for a cell, or a dash where there is none (JSON turns NaN into null); a temperature beyond the sane
 * display range reads "off scale".
 */
export function q(value: number | null | undefined, unit: Unit | "", digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return unit === "°C" ? formatTemperature(value) : formatQuantity(value, unit, digits);
}

/** Utilisation as a percentage: 0.834 → "83 %", 1.32 → "132 %", 0.042 → "4.2 %". */
export function percent(u: number | null | undefined): string {
  if (u === null || u === undefined || !Number.isFinite(u)) return "—";
  return `${u < 0.1 ? (u * 100).toPrecision(2) : Math.round(u * 100)}\u2009%`;
}

/** A verdict in words, as every table, badge and hover text says it. */
export const verdictWords: Readonly<Record<Verdict, string>> = {
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

/** Where a checked pulse came from. */
export const sourceWords = { "fault-case": "fault case", measured: "measured", capture: "capture" } as const;
