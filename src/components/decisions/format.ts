// A decision's pulses and results in one line each, for the matrix's hover texts and the overlay's labels; the
// figures and words come from lib/format.ts and lib/vocabulary.ts.

import { factor, percent, q } from "@/lib/format";
import { triangleEquivalent } from "@/lib/soa/equivalent-rectangle";
import type { PulseResult } from "@/lib/soa/types";
import { sourceWords, verdictWords } from "@/lib/vocabulary";
import type { CheckedPulse } from "./types";

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
      ? `stability S ${factor(result.stability)} (${verdictWords[result.stabilityVerdict ?? "no-data"]})`
      : null,
    `derating ×${factor(result.derating)}`,
    result.flags.length ? `flags: ${result.flags.join(", ")}` : null,
  ];
  return parts.filter(Boolean).join("; ");
}
