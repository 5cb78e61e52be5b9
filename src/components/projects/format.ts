import type { Repeat } from "@/lib/soa/types";
import { formatQuantity } from "@/lib/soa/units";
import { shapeWords } from "../format";

export { percent, q, shapeWords, sourceWords, verdictWords } from "../format";

/** A checked pulse's shape in words: a fault case's waveform is a fault sequence, a capture's a recorded waveform. */
export function pulseShape(pulse: { kind: keyof typeof shapeWords; source: string }): string {
  if (pulse.kind !== "waveform") return shapeWords[pulse.kind];
  return pulse.source === "fault-case" ? "fault sequence" : "recorded waveform";
}

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

/** A stored value for a form field: engineering notation without the unit, which the field shows. */
export function editableValue(value: number | null | undefined): string {
  if (value === null || value === undefined) return "";
  return formatQuantity(value, "", 6).replace("\u2009", "");
}
