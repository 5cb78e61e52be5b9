// Verdicts (METHODS.md §8). Curve view: utilisation u = I/I_allowed against the policy's limit u_max. Thermal
// view (only with a Foster network): Tj,peak against Tj,max − ΔT_g and Tj,max. The final verdict is the worse
// of the two, ordered fail > no-data > marginal > pass: a Foster network knows nothing of the
// thermal-instability region at high voltage that the curves show (Spirito et al., MIEL 2002), so both views
// are needed.
import type { Verdict } from "./types";

const SEVERITY: Record<Verdict, number> = { pass: 0, marginal: 1, "no-data": 2, fail: 3 };

/** The worse of two verdicts (the hot paths' form of worseVerdict: no argument array). */
export function worse(a: Verdict, b: Verdict): Verdict {
  return SEVERITY[b] > SEVERITY[a] ? b : a;
}

/** The worse of the verdicts given; "pass" when none is given. */
export function worseVerdict(...verdicts: Verdict[]): Verdict {
  let worst: Verdict = "pass";
  for (const v of verdicts) if (SEVERITY[v] > SEVERITY[worst]) worst = v;
  return worst;
}

export interface CurveVerdictInput {
  /** Current of the pulse in A (I, I_pk or i*). */
  current: number;
  /** Derated, scaled allowed current in A, or null where the curves have no value. */
  allowed: number | null;
  utilisationLimit: number;
  /** Over-voltage, over-current or a case at Tj,max: fail whatever the curves say. */
  hardFail: boolean;
}

/**
 * Curve verdict: fail on a hard limit; no-data without an allowed current; fail when nothing is allowed
 * (I_allowed ≤ 0); else pass if u ≤ u_max, marginal if u ≤ 1, fail beyond. A NaN current fails.
 */
export function curveVerdict({ current, allowed, utilisationLimit, hardFail }: CurveVerdictInput): Verdict {
  if (hardFail) return "fail";
  if (allowed === null) return "no-data";
  if (!(allowed > 0)) return "fail";
  const u = current / allowed;
  if (u <= utilisationLimit) return "pass";
  if (u <= 1) return "marginal";
  return "fail";
}

/** Utilisation I/I_allowed, or null when the allowed current is null or not > 0 (JSON has no infinity). */
export function utilisation(current: number, allowed: number | null): number | null {
  return allowed !== null && allowed > 0 ? current / allowed : null;
}

/** Thermal verdict: pass if Tj,peak ≤ Tj,max − guard, marginal if ≤ Tj,max, else fail (NaN fails). */
export function thermalVerdict(tjPeak: number, tjMax: number, tjGuard: number): Verdict {
  if (tjPeak <= tjMax - tjGuard) return "pass";
  if (tjPeak <= tjMax) return "marginal";
  return "fail";
}
