import { atCaseTemp, type CheckContext, checkPulse, prepareCheck } from "@/lib/soa/check";
import type { FosterTerm } from "@/lib/soa/foster";
import type { Policy, Pulse, PulseResult, Repeat, Verdict } from "@/lib/soa/types";

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
 * policy. One prepared part per candidate, shared by the case temperatures (only the derating differs); captures
 * are loaded once and shared, and a pulse with stored results is not checked again; no per-pulse allocation
 * beyond the results themselves. With a case path (METHODS.md §14) the case heats with each pulse's power through
 * it. A pulse with no verdict yet from any candidate (its stored results being recomputed) gets no worst verdict.
 */
export async function evaluate(
  candidates: EvaluatedCandidate[],
  pulses: ProjectPulse[],
  policy: Policy,
  caseNetwork?: FosterTerm[],
): Promise<Evaluation> {
  const loaded: (Pulse | null)[] = [];
  for (const p of pulses) {
    loaded.push(
      p.stored || p.pulse === null ? null : typeof p.pulse === "function" ? await p.pulse() : p.pulse,
    );
  }
  const results: Evaluation["results"] = {};
  // The worst verdict so far per pulse, by index (severity 0..3), and whether it has one; keyed by id at the end.
  const worst = new Uint8Array(pulses.length);
  const judged = new Uint8Array(pulses.length);
  for (const candidate of candidates) {
    const forPart: Record<string, PulseResult> = {};
    if (candidate.limits === null) {
      for (let k = 0; k < pulses.length; k++) {
        worst[k] = Math.max(worst[k], SEVERITY["no-data"]);
        judged[k] = 1;
      }
      results[candidate.partId] = forPart;
      continue;
    }
    // One prepared part; each other case temperature shares its curves and thermal data (atCaseTemp).
    let base: CheckContext | null = null;
    const contexts = new Map<number, CheckContext>();
    for (let k = 0; k < pulses.length; k++) {
      const p = pulses[k];
      const pulse = loaded[k];
      if (pulse === null) {
        const known = p.stored?.[candidate.partId];
        if (known) {
          forPart[p.id] = known;
          worst[k] = Math.max(worst[k], SEVERITY[known.verdict]);
          judged[k] = 1;
        }
        continue;
      }
      let ctx = contexts.get(p.caseTemp);
      if (ctx === undefined) {
        base ??= prepareCheck(candidate.limits, p.caseTemp, policy, caseNetwork);
        ctx = atCaseTemp(base, p.caseTemp);
        contexts.set(p.caseTemp, ctx);
      }
      const result = checkPulse(ctx, pulse);
      forPart[p.id] = result;
      const severity = SEVERITY[result.verdict];
      if (severity > worst[k]) worst[k] = severity;
      judged[k] = 1;
    }
    results[candidate.partId] = forPart;
  }
  const worstByPulse: Evaluation["worstByPulse"] = {};
  for (let k = 0; k < pulses.length; k++) if (judged[k]) worstByPulse[pulses[k].id] = VERDICTS[worst[k]];
  return { results, worstByPulse };
}

/** Verdicts by severity (METHODS.md §8: fail > no-data > marginal > pass). */
const VERDICTS: readonly Verdict[] = ["pass", "marginal", "no-data", "fail"];
const SEVERITY: Record<Verdict, number> = { pass: 0, marginal: 1, "no-data": 2, fail: 3 };
