import "server-only";
import type { Project } from "@/db/schema";
import { loadCandidates } from "./projects";
import { listFaultCases, listMeasuredPulses } from "./pulses";

/**
 * The project with its candidates, fault cases and measured pulses: what GET /api/projects/:id answers and what
 * the project page renders on the server, so both have one shape. The loaded candidates come back too, for a
 * caller that checks the project next and need not load them again.
 */
export async function projectDetail(project: Project) {
  const [candidates, faultCases, measured] = await Promise.all([
    loadCandidates(project.id),
    listFaultCases(project.id),
    listMeasuredPulses(project.id),
  ]);
  return {
    detail: {
      project,
      candidates: candidates.map((c) => ({ part: c.part, hasCurves: c.limits !== null })),
      faultCases,
      measuredPulses: measured,
    },
    candidates,
  };
}
