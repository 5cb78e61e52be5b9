// Small made-up matrix data for the unit tests of the ranking, the matrix filters and the overlay: a checked
// pulse, one cell's result and a candidate, each with only what a test varies as arguments.
import type { CheckedPulse } from "@/components/decisions/types";
import type { PulseResult, Verdict } from "@/lib/soa/types";

export const checkedPulse = (
  id: string,
  source: CheckedPulse["source"],
  extra: Partial<CheckedPulse> = {},
): CheckedPulse => ({
  id,
  source,
  name: id,
  caseTemp: 85,
  v: 48,
  i: 2,
  duration: 0.01,
  kind: "rect",
  ...extra,
});

export const cellResult = (verdict: Verdict, utilisation: number | null): PulseResult => ({
  id: "",
  allowedCurrent: utilisation === null ? null : 1,
  utilisation,
  tjPeak: null,
  derating: 0.6,
  verdict,
  flags: [],
  curveVerdict: verdict,
  thermalVerdict: null,
  stabilityVerdict: null,
  stability: null,
  equivalentWidth: 0.01,
  repetitionScale: null,
});

export const matrixCandidate = (partId: string, unitCost: number | null = null) => ({
  partId,
  partNumber: partId.toUpperCase(),
  maker: "Invented",
  unitCost,
  currency: "EUR",
  hasCurves: true,
});
