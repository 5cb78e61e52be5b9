import "server-only";
import type { Project } from "@/db/schema";
import type { MeasurementRow } from "@/lib/csv/measurements";
import type { PulseResult } from "@/lib/soa/types";
import { evaluate } from "./evaluate";
import { projectCaseNetwork, projectPolicy } from "./policy";
import { loadCandidates } from "./projects";

/**
 * Verdicts of pasted rows against every candidate before anything is saved (the preview), by the same engine
 * path as the saved results. Rows with errors get no verdicts.
 */
export async function previewVerdicts(project: Project, rows: MeasurementRow[]) {
  const candidates = await loadCandidates(project.id);
  const valid = rows.filter((r) => r.errors.length === 0);
  const evaluation = await evaluate(
    candidates.map((c) => ({ partId: c.part.id, limits: c.limits })),
    valid.map((r) => {
      const id = `row-${r.row}`;
      const repeat = r.repeat ? { repeat: r.repeat } : {};
      return {
        id,
        source: "measured" as const,
        name: r.label,
        caseTemp: project.caseTemp,
        v: r.v,
        i: r.i,
        duration: r.duration,
        kind: r.kind,
        ...repeat,
        pulse: { id, kind: r.kind, v: r.v, i: r.i, duration: r.duration, ...repeat },
      };
    }),
    projectPolicy(project),
    projectCaseNetwork(project),
  );
  return {
    candidates: candidates.map((c) => ({
      partId: c.part.id,
      partNumber: c.part.partNumber,
      maker: c.part.maker,
      hasCurves: c.limits !== null,
    })),
    rows: rows.map((r) => ({
      ...r,
      verdicts: Object.fromEntries(
        candidates.map((c) => [
          c.part.id,
          (evaluation.results[c.part.id]?.[`row-${r.row}`] ?? null) as PulseResult | null,
        ]),
      ),
    })),
  };
}
