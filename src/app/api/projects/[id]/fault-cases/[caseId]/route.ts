import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { faultCases } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadProjectRow, loadWritableProject } from "@/lib/projects/projects";
import { anyFaultCaseSchema } from "@/lib/projects/schema";
import { faultCaseColumns } from "@/lib/projects/write";

/** PATCH /api/projects/:id/fault-cases/:caseId: edits a fault case. */
export const PATCH = route<{ id: string; caseId: string }>(
  { action: "project.write" },
  async (req, caller, { id, caseId }) => {
    const project = await loadWritableProject(caller, id);
    const existing = await loadProjectRow(faultCases, project.id, caseId);
    const values = await parseBody(req, anyFaultCaseSchema);
    const faultCase = await db.transaction(async (tx) => {
      const [row] = await tx
        .update(faultCases)
        .set({ ...faultCaseColumns(values), updatedAt: new Date() })
        .where(eq(faultCases.id, existing.id))
        .returning();
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "fault-case.updated",
          subjectType: "project",
          subjectId: project.id,
          details: { faultCaseId: row.id, name: row.name },
        },
        tx,
      );
      return row;
    });
    return json({ faultCase });
  },
);

/** DELETE /api/projects/:id/fault-cases/:caseId. */
export const DELETE = route<{ id: string; caseId: string }>(
  { action: "project.write" },
  async (_req, caller, { id, caseId }) => {
    const project = await loadWritableProject(caller, id);
    const existing = await loadProjectRow(faultCases, project.id, caseId);
    await db.transaction(async (tx) => {
      await tx.delete(faultCases).where(eq(faultCases.id, existing.id));
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "fault-case.deleted",
          subjectType: "project",
          subjectId: project.id,
          details: { faultCaseId: existing.id, name: existing.name },
        },
        tx,
      );
    });
    return json({ status: "ok" });
  },
);
