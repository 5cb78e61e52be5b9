import type { PulseResult, Verdict } from "@/lib/soa/types";
import { worseVerdict } from "@/lib/soa/verdict";

export interface MatrixCandidate {
  partId: string;
  partNumber: string;
  maker: string;
  unitCost: number | null;
  currency: string | null;
  hasCurves: boolean;
}

export interface MatrixRow {
  partId: string;
  rank: number;
  /** The worst verdict over every pulse ("no-data" for a candidate without curves or pulses to judge). */
  worstVerdict: Verdict;
  /** The largest utilisation over every pulse; null when none has a number (e.g. every result is no data). */
  worstUtilisation: number | null;
  /** True when every pulse passes (not marginal, fail or no data). */
  passesAll: boolean;
}

const severity: Record<Verdict, number> = { pass: 0, marginal: 1, "no-data": 2, fail: 3 };

/**
 * Ranks candidates for the comparison (PRODUCT.md, step 6): those that pass every pulse first, by worst-case
 * utilisation and then unit cost (a part without a cost after those with one); then the rest, best worst verdict
 * first, then by worst-case utilisation. A fail without a utilisation (case at Tj,max) counts as the worst.
 */
export function rankCandidates(
  candidates: MatrixCandidate[],
  pulseIds: string[],
  results: Record<string, Record<string, PulseResult>>,
): MatrixRow[] {
  const rows = candidates.map((c) => {
    const byPulse = results[c.partId] ?? {};
    let worstVerdict: Verdict = pulseIds.length === 0 || !c.hasCurves ? "no-data" : "pass";
    let worstUtilisation: number | null = null;
    for (const id of pulseIds) {
      const r = byPulse[id];
      worstVerdict = worseVerdict(worstVerdict, r?.verdict ?? "no-data");
      if (r?.utilisation != null) worstUtilisation = Math.max(worstUtilisation ?? 0, r.utilisation);
    }
    return { candidate: c, worstVerdict, worstUtilisation, passesAll: worstVerdict === "pass" };
  });
  const u = (x: number | null) => x ?? Number.POSITIVE_INFINITY;
  const cost = (c: MatrixCandidate) => c.unitCost ?? Number.POSITIVE_INFINITY;
  rows.sort((a, b) => {
    if (a.passesAll !== b.passesAll) return a.passesAll ? -1 : 1;
    if (!a.passesAll && severity[a.worstVerdict] !== severity[b.worstVerdict]) {
      return severity[a.worstVerdict] - severity[b.worstVerdict];
    }
    if (u(a.worstUtilisation) !== u(b.worstUtilisation)) return u(a.worstUtilisation) - u(b.worstUtilisation);
    return cost(a.candidate) - cost(b.candidate);
  });
  return rows.map((r, k) => ({
    partId: r.candidate.partId,
    rank: k + 1,
    worstVerdict: r.worstVerdict,
    worstUtilisation: r.worstUtilisation,
    passesAll: r.passesAll,
  }));
}
