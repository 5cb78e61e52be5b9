// The project's matrix path: 50 candidates × 1 000 pulses through evaluate() and rankCandidates(), as the project
// page, the comparison and a decision's snapshot run it (src/lib/projects/check.ts without the database). Figures
// are printed, never asserted. Target: ≤ 100 ms for the whole matrix, ranking included.
import type { ProjectPulse } from "../../src/lib/projects/evaluate";
import { evaluate } from "../../src/lib/projects/evaluate";
import { rankCandidates } from "../../src/lib/projects/matrix";
import type { PartLimits } from "../../src/lib/soa/types";
import { buildMatrix } from "./matrix";

const RUNS = 7;
/** The project's temperature, and two fault cases' overrides (one engine context per candidate and temperature). */
const CASE_TEMPS = [85, 85, 85, 85, 105, 125];

export function projectMatrix(): {
  candidates: { partId: string; limits: PartLimits }[];
  pulses: ProjectPulse[];
} {
  const matrix = buildMatrix();
  const candidates = matrix.map((request, k) => ({ partId: `part-${k}`, limits: request.part }));
  // One project's pulses for every candidate: the pulses made for the 100 V part, at a mix of case temperatures.
  const source = matrix.find((r) => r.part.vdsMax === 100) ?? matrix[0];
  const pulses = source.pulses.map((pulse, k): ProjectPulse => {
    const shaped = pulse.kind === "rect" || pulse.kind === "triangle" ? pulse : null;
    return {
      id: `pulse-${k}`,
      source: k % 3 === 0 ? "fault-case" : "measured",
      name: `Pulse ${k}`,
      caseTemp: CASE_TEMPS[k % CASE_TEMPS.length],
      v: shaped?.v ?? null,
      i: shaped?.i ?? null,
      duration: shaped?.duration ?? null,
      kind: pulse.kind,
      ...(shaped?.repeat ? { repeat: shaped.repeat } : {}),
      pulse,
    };
  });
  return { candidates, pulses };
}

export async function runProjectMatrixBench(): Promise<void> {
  const { candidates, pulses } = projectMatrix();
  const rankable = candidates.map((c) => ({
    partId: c.partId,
    partNumber: c.partId,
    maker: "Bench",
    unitCost: null,
    currency: null,
    hasCurves: true,
  }));
  const pulseIds = pulses.map((p) => p.id);
  const policy = { utilisationLimit: 0.8, tjGuard: 10, voltageLimit: 0.8, betweenCurves: "loglog" as const };
  let best = Number.POSITIVE_INFINITY;
  let bestEngine = Number.POSITIVE_INFINITY;
  let ranked = 0;
  // Two runs to warm the engine up (as in a running server), then the measured ones.
  for (let run = 0; run < 2; run++) await evaluate(candidates, pulses, policy);
  for (let run = 0; run < RUNS; run++) {
    const start = performance.now();
    const evaluation = await evaluate(candidates, pulses, policy);
    const engineDone = performance.now();
    ranked = rankCandidates(rankable, pulseIds, evaluation.results).length;
    const end = performance.now();
    best = Math.min(best, end - start);
    bestEngine = Math.min(bestEngine, engineDone - start);
  }
  console.log(
    `project matrix: ${candidates.length} candidates × ${pulses.length} pulses through evaluate + rank, ` +
      `best of ${RUNS}: ${best.toFixed(1)} ms (evaluate ${bestEngine.toFixed(1)} ms; ${ranked} ranked; ` +
      `${new Set(CASE_TEMPS).size} case temperatures)`,
  );
}
