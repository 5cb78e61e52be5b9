import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { projectCandidates } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";
import { loadWritableProject } from "@/lib/projects/projects";
import { isUuid } from "@/lib/uuid";

/** DELETE /api/projects/:id/candidates/:partId: removes a candidate (the part stays in the library). */
export const DELETE = route<{ id: string; partId: string }>(
  { action: "project.write" },
  async (_req, caller, { id, partId }) => {
    const project = await loadWritableProject(caller, id);
    await db.transaction(async (tx) => {
      const removed = isUuid(partId)
        ? await tx
            .delete(projectCandidates)
            .where(and(eq(projectCandidates.projectId, project.id), eq(projectCandidates.partId, partId)))
            .returning()
        : [];
      if (!removed.length) throw new AppError("not_found:candidate", "No such candidate in this project.");
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "candidate.removed",
          subjectType: "project",
          subjectId: project.id,
          details: { partId },
        },
        tx,
      );
    });
    return json({ status: "ok" });
  },
);
