// Margin policy defaults (METHODS.md §8): utilisation limit 0.8, junction guard 25 K, voltage limit 0.8 of V_DSS
// (voltage derating of power MOSFETs to 75–90 % of the rating is common practice in derating guidelines) and the
// log-log reading between curves (METHODS.md §3).
import type { Policy, ResolvedPolicy } from "./types";

export const DEFAULT_POLICY: Readonly<ResolvedPolicy> = Object.freeze({
  utilisationLimit: 0.8,
  tjGuard: 25,
  voltageLimit: 0.8,
  betweenCurves: "loglog",
});

/** Fills in every missing field of a policy with its default; given fields are kept as they are. */
export function resolvePolicy(policy: Policy = {}): ResolvedPolicy {
  return {
    utilisationLimit: policy.utilisationLimit ?? DEFAULT_POLICY.utilisationLimit,
    tjGuard: policy.tjGuard ?? DEFAULT_POLICY.tjGuard,
    voltageLimit: policy.voltageLimit ?? DEFAULT_POLICY.voltageLimit,
    betweenCurves: policy.betweenCurves ?? DEFAULT_POLICY.betweenCurves,
  };
}
