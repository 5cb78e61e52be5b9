import { allowedCurrent } from "@/lib/soa/allowed-current";
import { prepareCurveSet } from "@/lib/soa/curve-set";
import { derate } from "@/lib/soa/derate";
import { type FosterTerm, zth } from "@/lib/soa/foster";
import { instabilityBoundary } from "@/lib/soa/instability-boundary";
import { prepareTransfer } from "@/lib/soa/stability";
import type { BetweenCurves, CurveSet, Duration, Flag, TransferData } from "@/lib/soa/types";

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
  /**
   * The instability boundary for the typed width (METHODS.md §12): V_max(I) = 1/(α(I)·Z_th(t)), points [V, I];
   * null without a width, transfer characteristics or a thermal model.
   */
  instability: { width: number; zth: number; points: [number, number][] } | null;
}

const samplesPerDecade = 24;

/**
 * The lines the SOA chart draws, computed by the engine so that the chart and every check agree: the digitised
 * curves, the same scaled by the derating factor for the case temperature, and the line for any pulse width.
 */
export function computeLimits(
  set: CurveSet,
  part: { tjMax: number; foster?: readonly FosterTerm[] | null; transfer?: TransferData | null },
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
  let instability: Limits["instability"] = null;
  if (options.width !== undefined && options.width > 0 && part.transfer && part.foster?.length) {
    const z = zth(part.foster as FosterTerm[], options.width);
    // Beyond 100 × the highest digitised voltage the boundary is off every chart and says nothing.
    const vTop = 100 * Math.max(...curves.flatMap((c) => c.points.map(([v]) => v)));
    const points = instabilityBoundary(prepareTransfer(part.transfer), z).filter(([v]) => v <= vTop);
    instability = { width: options.width, zth: z, points };
  }
  return {
    refCaseTemp: prepared.refCaseTemp,
    caseTemp: options.caseTemp,
    derating: k,
    curves,
    derated,
    interpolated,
    instability,
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
