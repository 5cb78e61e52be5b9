import { route } from "@/lib/auth/guard";
import { json } from "@/lib/http";
import { computeDrift, loadDecision, snapshotNow } from "@/lib/projects/decisions";
import { loadProject } from "@/lib/projects/projects";

/**
 * GET /api/projects/:id/decisions/:decisionId: the decision with its frozen snapshot, and the drift: what would
 * differ if the project were checked now (settings, curve versions, pulses, results).
 */
export const GET = route<{ id: string; decisionId: string }>(
  { action: "workspace.read" },
  async (_req, caller, { id, decisionId }) => {
    const project = await loadProject(caller, id);
    const decision = await loadDecision(project.id, decisionId);
    const frozen = decision.snapshot;
    const drift = computeDrift(frozen, await snapshotNow(project));
    return json({ decision, drift });
  },
);
