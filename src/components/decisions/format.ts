import { triangleEquivalent } from "@/lib/soa/equivalent-rectangle";
import type { PulseResult } from "@/lib/soa/types";
import { percent, q, sourceWords, verdictWords } from "../format";
import type { CheckedPulse } from "./types";

export { percent, q, shapeWords, sourceWords, verdictWords } from "../format";

/** "1 pulse", "3 pulses". */
export function plural(count: number, noun: string): string {
  return `${count} ${noun}${count === 1 ? "" : "s"}`;
}

/** A unit cost with its currency ("2.85 EUR"), or a dash. */
export function money(value: number | null, currency: string | null): string {
  if (value === null) return "—";
  return `${value.toFixed(2)}${currency ? `\u2009${currency}` : ""}`;
}

/**
 * The width the curves are read at for a pulse (METHODS.md §6): a triangle's equal-energy rectangle lasts half
 * its width; a capture's width is already its rectangle's; null when the pulse has none.
 */
export function readWidth(pulse: CheckedPulse): number | null {
  if (pulse.duration === null || !(pulse.duration > 0)) return null;
  if (pulse.kind === "triangle" && pulse.v !== null && pulse.i !== null) {
    return triangleEquivalent(pulse.v, pulse.i, pulse.duration).duration;
  }
  return pulse.duration;
}

/** A pulse in one line: "fault case · 48 V · 1.5 A · 48 ms". */
export function pulseLine(pulse: CheckedPulse): string {
  return [sourceWords[pulse.source], q(pulse.v, "V"), q(pulse.i, "A"), q(pulse.duration, "s")].join(" · ");
}

/** How a result was found, in one line for a cell's hover text. */
export function resultLine(result: PulseResult | undefined): string {
  if (!result) return "no data: the part has no SOA curves";
  const parts = [
    `${verdictWords[result.verdict]}, utilisation ${percent(result.utilisation)}`,
    `allowed ${q(result.allowedCurrent, "A")}`,
    result.tjPeak !== null ? `Tj peak ${q(result.tjPeak, "°C")}` : null,
    result.stability != null
      ? `stability S ${result.stability.toFixed(2)} (${verdictWords[result.stabilityVerdict ?? "no-data"]})`
      : null,
    `derating ×${result.derating.toFixed(2)}`,
    result.flags.length ? `flags: ${result.flags.join(", ")}` : null,
  ];
  return parts.filter(Boolean).join("; ");
}
