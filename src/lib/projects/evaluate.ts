import { type CheckContext, checkPulse, prepareCheck } from "@/lib/soa/check";
import type { FosterTerm } from "@/lib/soa/foster";
import type { Policy, Pulse, PulseResult, Repeat, Verdict } from "@/lib/soa/types";
import { worseVerdict } from "@/lib/soa/verdict";

/** Where a pulse of a project comes from. */
export type PulseSource = "fault-case" | "measured" | "capture";

/** A pulse of a project as the results show it, with what the engine needs to check it. */
export interface ProjectPulse {
  id: string;
  source: PulseSource;
  name: string;
  /** Case temperature this pulse is checked at: the project's, or the fault case's override. */
  caseTemp: number;
  /** The point drawn on the chart: (V, I) of the pulse, or of a capture's peak-power sample. */
  v: number | null;
  i: number | null;
  /** Width in s (a capture: its equal-energy rectangle's width), for labels. */
  duration: number | null;
  kind: Pulse["kind"];
  repeat?: Repeat;
  /** The pulse in the engine's form; captures are loaded only when checked; null: only `stored` results count. */
  pulse: Pulse | (() => Promise<Pulse>) | null;
  /**
   * Results already computed and current (a capture's, stored by its job), by candidate: they are used as they
   * are, and a candidate missing here gets no result for this pulse yet (it is being recomputed).
   */
  stored?: Record<string, PulseResult>;
}

export interface EvaluatedCandidate {
  partId: string;
  /** Null when the candidate has no SOA curves yet: every verdict is then "no data". */
  limits: Parameters<typeof prepareCheck>[0] | null;
}

export interface Evaluation {
  /** results[partId][pulseId]; a candidate without curves has none. */
  results: Record<string, Record<string, PulseResult>>;
  /** The worst verdict per pulse over all candidates (for notices and summaries). */
  worstByPulse: Record<string, Verdict>;
}

/**
 * Checks every pulse against every candidate through the engine, at each pulse's case temperature and the project's
 * policy. One engine context per (candidate, case temperature); captures are loaded once and shared, and a pulse
 * with stored results is not checked again. With a case path (METHODS.md §14) the case heats with each pulse's
 * power through it.
 */
export async function evaluate(
  candidates: EvaluatedCandidate[],
  pulses: ProjectPulse[],
  policy: Policy,
  caseNetwork?: FosterTerm[],
): Promise<Evaluation> {
  const loaded = new Map<string, Pulse>();
  for (const p of pulses) {
    if (p.stored || p.pulse === null) continue;
    loaded.set(p.id, typeof p.pulse === "function" ? await p.pulse() : p.pulse);
  }
  const results: Evaluation["results"] = {};
  const worstByPulse: Evaluation["worstByPulse"] = {};
  for (const candidate of candidates) {
    const contexts = new Map<number, CheckContext>();
    const forPart: Record<string, PulseResult> = {};
    for (const p of pulses) {
      if (candidate.limits === null) {
        worstByPulse[p.id] = worseVerdict(worstByPulse[p.id] ?? "pass", "no-data");
        continue;
      }
      if (p.stored || p.pulse === null) {
        const known = p.stored?.[candidate.partId];
        if (known) {
          forPart[p.id] = known;
          worstByPulse[p.id] = worseVerdict(worstByPulse[p.id] ?? "pass", known.verdict);
        }
        continue;
      }
      let ctx = contexts.get(p.caseTemp);
      if (!ctx) {
        ctx = prepareCheck(candidate.limits, p.caseTemp, policy, caseNetwork);
        contexts.set(p.caseTemp, ctx);
      }
      const result = checkPulse(ctx, loaded.get(p.id)!);
      forPart[p.id] = result;
      worstByPulse[p.id] = worseVerdict(worstByPulse[p.id] ?? "pass", result.verdict);
    }
    results[candidate.partId] = forPart;
  }
  return { results, worstByPulse };
}
