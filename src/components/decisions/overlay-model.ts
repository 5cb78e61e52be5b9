import { mix } from "@/components/soa-chart/chart-colours";
import type { LimitLine } from "@/components/soa-chart/chart-model";
import { q } from "@/lib/format";
import type { Verdict } from "@/lib/soa/types";
import { worseVerdict } from "@/lib/soa/verdict";
import { readWidth } from "./format";
import type { CheckedCandidate, CheckedPulse, ProjectCheck } from "./types";

// What the overlay chart draws: for each chosen pulse's read width and case temperature, one derated limit line
// per candidate; the chosen pulses as markers in their worst verdict's shape. Pure, from the check and the
// limits the server computed.

export const MAX_CHOSEN = 4;

/** A width and case temperature the chosen pulses are read at: one line per candidate for each. */
export interface LineGroup {
  key: string;
  width: number;
  caseTemp: number;
}

/** name: legend words, "QM-80T16 (Quillmere Semiconductor), 24 ms"; label at the line's end, "QM-80T16 24 ms". */
export interface OverlayLine extends LimitLine {
  partId: string;
}

export interface OverlayMarker {
  id: string;
  v: number;
  i: number;
  verdict: Verdict;
  name: string;
  /** Each candidate's verdict on this pulse, for the hover box and the table. */
  byCandidate: { partNumber: string; verdict: Verdict; utilisation: number | null; allowed: number | null }[];
}

/** Second and later families, after the accent: calm hues apart from the verdict colours. */
const FAMILIES = ["#6b4fa0", "#9c3d78", "#3a5fa8", "#5b6470", "#2f7f86", "#8a4f2a"];
const DASHES = [undefined, "8 3", "2 3", "10 3 2 3"];

/** One hue family per candidate: the accent first, then the others; a dash pattern once the hues run out. */
function candidateStyle(index: number, accent: string): { hue: string; dash?: string } {
  const hues = [accent, ...FAMILIES];
  return { hue: hues[index % hues.length], dash: DASHES[Math.floor(index / hues.length) % DASHES.length] };
}

/** The distinct (read width, case temperature) pairs of the chosen pulses, shortest first. */
export function lineGroups(pulses: CheckedPulse[]): LineGroup[] {
  const groups = new Map<string, LineGroup>();
  for (const p of pulses) {
    const width = readWidth(p);
    if (width === null) continue;
    const key = `${width}@${p.caseTemp}`;
    if (!groups.has(key)) groups.set(key, { key, width, caseTemp: p.caseTemp });
  }
  return [...groups.values()].sort((a, b) => a.width - b.width || a.caseTemp - b.caseTemp);
}

/**
 * The lines, candidate by candidate: a candidate's lines share its hue, each longer width lighter. Names carry the
 * temperature only when the chosen pulses are read at more than one.
 */
export function overlayLines(
  candidates: CheckedCandidate[],
  groups: LineGroup[],
  pointsOf: (partId: string, group: LineGroup) => [number, number][] | undefined,
  colours: { accent: string; panel: string },
): OverlayLine[] {
  const temps = new Set(groups.map((g) => g.caseTemp)).size > 1;
  return candidates.flatMap((c, k) => {
    const { hue, dash } = candidateStyle(k, colours.accent);
    return groups.flatMap((g, j) => {
      const points = pointsOf(c.partId, g);
      if (!points || points.length < 2) return [];
      const t = groups.length <= 1 ? 0 : (j / (groups.length - 1)) * 0.45;
      const width = `${q(g.width, "s")}${temps ? ` at ${q(g.caseTemp, "°C")}` : ""}`;
      return [
        {
          key: `${c.partId}-${g.key}`,
          partId: c.partId,
          name: `${c.partNumber} (${c.maker}), ${width}`,
          label: groups.length > 1 ? `${c.partNumber} ${width}` : c.partNumber,
          points,
          stroke: mix(hue, colours.panel, t),
          text: mix(hue, colours.panel, t * 0.5),
          dash,
        },
      ];
    });
  });
}

/** The chosen pulses as markers: the shape of the worst verdict over the candidates. */
export function overlayMarkers(check: ProjectCheck, pulses: CheckedPulse[]): OverlayMarker[] {
  return pulses.flatMap((p) => {
    if (p.v === null || p.i === null || !(p.v > 0 && p.i > 0)) return [];
    const byCandidate = check.candidates.map((c) => {
      const r = check.results[c.partId]?.[p.id];
      return {
        partNumber: c.partNumber,
        verdict: r?.verdict ?? ("no-data" as const),
        utilisation: r?.utilisation ?? null,
        allowed: r?.allowedCurrent ?? null,
      };
    });
    const verdict = byCandidate.length ? worseVerdict(...byCandidate.map((b) => b.verdict)) : "no-data";
    return [{ id: p.id, v: p.v, i: p.i, verdict, name: p.name, byCandidate }];
  });
}
