import { route } from "@/lib/auth/guard";
import { loadDecision } from "@/lib/projects/decisions";
import { loadProject } from "@/lib/projects/projects";
import { renderDecisionPdf } from "@/lib/report/decision-pdf";
import { attachmentDisposition } from "@/lib/report/file-name";

/** GET /api/projects/:id/decisions/:decisionId/report: the decision record as a PDF, from its frozen snapshot. */
export const GET = route<{ id: string; decisionId: string }>(
  { action: "workspace.read" },
  async (_req, caller, { id, decisionId }) => {
    const project = await loadProject(caller, id);
    const decision = await loadDecision(project.id, decisionId);
    const pdf = await renderDecisionPdf({
      decision,
      snapshot: decision.snapshot,
    });
    const disposition = attachmentDisposition(decision.snapshot.project.name, decision.signedAt, "pdf");
    return new Response(new Uint8Array(pdf), {
      headers: {
        "content-type": "application/pdf",
        "content-disposition": disposition,
        "cache-control": "no-store",
      },
    });
  },
);
