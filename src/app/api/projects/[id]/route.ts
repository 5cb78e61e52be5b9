import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { projectDetail } from "@/lib/projects/detail";
import { loadProject, loadWritableProject } from "@/lib/projects/projects";
import { projectSchema } from "@/lib/projects/schema";
import { updateProject } from "@/lib/projects/write";

/** GET /api/projects/:id: the project, its candidates, fault cases and measured pulses. */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  return json((await projectDetail(project)).detail);
});

/** PATCH /api/projects/:id: name, description, case temperature, margin policy, owner. */
export const PATCH = route<{ id: string }>({ action: "project.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const values = await parseBody(req, projectSchema);
  return json({ project: await updateProject(caller, project.id, values) });
});
