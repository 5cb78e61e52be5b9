import { route } from "@/lib/auth/guard";
import { loadDecision } from "@/lib/projects/decisions";
import { loadProject } from "@/lib/projects/projects";
import { decisionCsv } from "@/lib/report/decision-csv";
import { downloadName } from "@/lib/report/file-name";

/** GET /api/projects/:id/decisions/:decisionId/csv: the decision's frozen evaluation as CSV, in rank order. */
export const GET = route<{ id: string; decisionId: string }>(
  { action: "workspace.read" },
  async (_req, caller, { id, decisionId }) => {
    const project = await loadProject(caller, id);
    const decision = await loadDecision(project.id, decisionId);
    const snapshot = decision.snapshot;
    return new Response(decisionCsv(snapshot), {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${downloadName(snapshot.project.name, decision.signedAt, "csv")}"`,
        "cache-control": "no-store",
      },
    });
  },
);
