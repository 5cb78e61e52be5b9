import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadCandidates, loadProject, loadWritableProject } from "@/lib/projects/projects";
import { listFaultCases, listMeasuredPulses } from "@/lib/projects/pulses";
import { projectSchema } from "@/lib/projects/schema";
import { updateProject } from "@/lib/projects/write";

/** GET /api/projects/:id: the project, its candidates, fault cases and measured pulses. */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  const [candidates, faultCases, measured] = await Promise.all([
    loadCandidates(project.id),
    listFaultCases(project.id),
    listMeasuredPulses(project.id),
  ]);
  return json({
    project,
    candidates: candidates.map((c) => ({ part: c.part, hasCurves: c.limits !== null })),
    faultCases,
    measuredPulses: measured,
  });
});

/** PATCH /api/projects/:id: name, description, case temperature, margin policy, owner. */
export const PATCH = route<{ id: string }>({ action: "project.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const values = await parseBody(req, projectSchema);
  return json({ project: await updateProject(caller, project.id, values) });
});
