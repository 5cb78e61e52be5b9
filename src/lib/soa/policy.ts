// Margin policy defaults (METHODS.md §8): utilisation limit 0.8, junction guard 25 K, log-log reading between
// curves (METHODS.md §3).
import type { Policy, ResolvedPolicy } from "./types";

export const DEFAULT_POLICY: Readonly<ResolvedPolicy> = Object.freeze({
  utilisationLimit: 0.8,
  tjGuard: 25,
  betweenCurves: "loglog",
});

/** Fills in every missing field of a policy with its default; given fields are kept as they are. */
export function resolvePolicy(policy: Policy = {}): ResolvedPolicy {
  return {
    utilisationLimit: policy.utilisationLimit ?? DEFAULT_POLICY.utilisationLimit,
    tjGuard: policy.tjGuard ?? DEFAULT_POLICY.tjGuard,
    betweenCurves: policy.betweenCurves ?? DEFAULT_POLICY.betweenCurves,
  };
}
