import { allowedCurrent } from "@/lib/soa/allowed-current";
import { prepareCurveSet } from "@/lib/soa/curve-set";
import { derate } from "@/lib/soa/derate";
import type { FosterTerm } from "@/lib/soa/foster";
import type { BetweenCurves, CurveSet, Duration, Flag } from "@/lib/soa/types";

export interface LimitLine {
  duration: Duration;
  points: [number, number][];
}

export interface Limits {
  refCaseTemp: number;
  caseTemp: number;
  /** Derating factor k (METHODS.md §5) applied to every derated line. */
  derating: number;
  curves: LimitLine[];
  derated: LimitLine[];
  /** The limit line for a typed pulse width, read between the curves by the policy, derated; null if none asked. */
  interpolated: { width: number; policy: BetweenCurves; flags: Flag[]; points: [number, number][] } | null;
}

const samplesPerDecade = 24;

/**
 * The lines the SOA chart draws, computed by the engine so that the chart and every check agree: the digitised
 * curves, the same scaled by the derating factor for the case temperature, and the line for any pulse width.
 */
export function computeLimits(
  set: CurveSet,
  part: { tjMax: number; foster?: readonly FosterTerm[] | null },
  options: { caseTemp: number; width?: number; policy?: BetweenCurves },
): Limits {
  const prepared = prepareCurveSet(set);
  const k = derate(part.tjMax, options.caseTemp, prepared.refCaseTemp);
  const all = [...prepared.finite, ...(prepared.dc ? [prepared.dc] : [])];
  const curves = all.map((c) => ({
    duration: c.duration,
    points: c.points.map(([v, i]) => [v, i] as [number, number]),
  }));
  const derated = curves.map((c) => ({
    duration: c.duration,
    points: c.points.map(([v, i]) => [v, i * k] as [number, number]),
  }));
  let interpolated: Limits["interpolated"] = null;
  if (options.width !== undefined && options.width > 0) {
    const policy = options.policy ?? "loglog";
    const flags = new Set<Flag>();
    const points: [number, number][] = [];
    for (const v of voltageGrid(curves)) {
      const result = allowedCurrent(prepared, v, options.width, policy, part.foster ?? null);
      for (const f of result.flags) if (f !== "below-curve-range" && f !== "above-curve-range") flags.add(f);
      if (result.current !== null && !result.flags.includes("below-curve-range"))
        points.push([v, result.current * k]);
    }
    interpolated = { width: options.width, policy, flags: [...flags], points };
  }
  return {
    refCaseTemp: prepared.refCaseTemp,
    caseTemp: options.caseTemp,
    derating: k,
    curves,
    derated,
    interpolated,
  };
}

/** Every digitised voltage, plus a log-spaced grid between the lowest and highest, sorted and unique. */
function voltageGrid(curves: LimitLine[]): number[] {
  const vs = curves.flatMap((c) => c.points.map(([v]) => v));
  if (vs.length === 0) return [];
  const lo = Math.min(...vs);
  const hi = Math.max(...vs);
  const n = Math.max(1, Math.ceil(Math.log10(hi / lo) * samplesPerDecade));
  for (let j = 0; j <= n; j++) vs.push(lo * (hi / lo) ** (j / n));
  return [...new Set(vs)].sort((a, b) => a - b);
}
