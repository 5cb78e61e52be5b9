import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { listDecisions, signDecision } from "@/lib/projects/decisions";
import { loadProject, loadWritableProject } from "@/lib/projects/projects";
import { signDecisionSchema } from "@/lib/projects/schema";

/** GET /api/projects/:id/decisions: the project's decision history, newest first. */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  return json({ decisions: await listDecisions(project.id) });
});

/** POST /api/projects/:id/decisions { partId, rationale }: a lead signs the choice; the evaluation is frozen with it. */
export const POST = route<{ id: string }>({ action: "decision.sign" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const input = await parseBody(req, signDecisionSchema);
  const decision = await signDecision(caller, project, input);
  return json(
    { decision: { id: decision.id, chosenLabel: decision.chosenLabel, signedAt: decision.signedAt } },
    { status: 201 },
  );
});
