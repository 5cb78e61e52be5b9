import { route } from "@/lib/auth/guard";
import { json } from "@/lib/http";
import { checkProject } from "@/lib/projects/check";
import { loadProject } from "@/lib/projects/projects";

/**
 * GET /api/projects/:id/check: every fault case, measured pulse and capture against every candidate, with each
 * verdict's utilisation, allowed current, Tj peak, derating and flags.
 */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  return json(await checkProject(project));
});
