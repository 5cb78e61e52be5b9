// Temperature derating of the SOA (METHODS.md §5): k = (Tj,max − Tc)/(Tj,max − T_ref), clamped to [0, 1].
// Linear derating of the thermally limited SOA is common practice, stated in many manufacturers' application
// notes; applied to the whole curve (R_DS(on) and package segments too) it is conservative. No up-rating
// below T_ref.

/**
 * Derating factor k for case temperature `caseTemp` (°C). Tc at or above Tj,max gives 0; Tc at or below T_ref
 * gives 1. Nothing can be claimed when Tj,max ≤ T_ref or any input is NaN: the result is then 0.
 */
export function derate(tjMax: number, caseTemp: number, refCaseTemp = 25): number {
  const span = tjMax - refCaseTemp;
  if (!(span > 0)) return 0;
  const k = (tjMax - caseTemp) / span;
  if (Number.isNaN(k)) return 0;
  return Math.min(1, Math.max(0, k));
}
