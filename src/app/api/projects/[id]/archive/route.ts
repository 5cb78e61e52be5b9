import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { projects } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadProject } from "@/lib/projects/projects";

/** POST /api/projects/:id/archive { archived }: archives a project (kept read-only for history) or restores it. */
export const POST = route<{ id: string }>({ action: "project.write" }, async (req, caller, { id }) => {
  const project = await loadProject(caller, id);
  const { archived } = await parseBody(req, z.object({ archived: z.boolean() }));
  await db.transaction(async (tx) => {
    await tx
      .update(projects)
      .set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() })
      .where(eq(projects.id, project.id));
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: archived ? "project.archived" : "project.restored",
        subjectType: "project",
        subjectId: project.id,
      },
      tx,
    );
  });
  return json({ status: "ok", archived });
});
