import { type MatrixRow, rankCandidates } from "@/lib/projects/matrix";
import type { CheckedPulse, MatrixData } from "./types";

// The comparison matrix worked out before any cell is drawn: which pulses are columns, and the candidates in rank
// order. Pure, so that the table can memoise it and re-render nothing while the data stand still.

export const scopes = ["all", "fault-cases", "measured"] as const;
export type PulseScope = (typeof scopes)[number];

export interface MatrixFilter {
  scope: PulseScope;
  failuresOnly: boolean;
}

/** The filter from the URL: `?pulses=fault-cases|measured` and `?failures=1`; anything else is the default. */
export function filterFrom(params: { get(name: string): string | null }): MatrixFilter {
  const scope = params.get("pulses");
  return {
    scope: scopes.includes(scope as PulseScope) ? (scope as PulseScope) : "all",
    failuresOnly: params.get("failures") === "1",
  };
}

/** Measured pulses and captures are both bench evidence: "measured" shows them together. */
function inScope(pulse: CheckedPulse, scope: PulseScope): boolean {
  if (scope === "fault-cases") return pulse.source === "fault-case";
  if (scope === "measured") return pulse.source !== "fault-case";
  return true;
}

/** The pulses shown as columns: in the scope and, with `failuresOnly`, failed by at least one candidate. */
export function visiblePulses(data: MatrixData, filter: MatrixFilter): CheckedPulse[] {
  return data.pulses.filter(
    (p) =>
      inScope(p, filter.scope) &&
      (!filter.failuresOnly ||
        data.candidates.some((c) => data.results[c.partId]?.[p.id]?.verdict === "fail")),
  );
}

/**
 * Ranks over every pulse of the project, whatever the filter shows: the worst case of a candidate is the worst
 * of all its evidence, so hiding columns never promotes a part.
 */
export function rankAll(data: MatrixData): MatrixRow[] {
  return rankCandidates(
    data.candidates,
    data.pulses.map((p) => p.id),
    data.results,
  );
}

/** The top-ranked candidate that passes every pulse, if any: the decision form's default. */
export function bestPassing(ranking: MatrixRow[]): string | null {
  return ranking.find((r) => r.passesAll)?.partId ?? null;
}

/** Counts of the project's pulses by source. */
export function pulseCounts(pulses: CheckedPulse[]) {
  let faultCases = 0;
  let measured = 0;
  let captures = 0;
  for (const p of pulses) {
    if (p.source === "fault-case") faultCases++;
    else if (p.source === "measured") measured++;
    else captures++;
  }
  return { faultCases, measured, captures };
}
