import { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getPart } from "@/db/queries/parts";
import { projectCandidates } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { loadWritableProject } from "@/lib/projects/projects";

/** POST /api/projects/:id/candidates { partId }: adds a library part of the workspace as a candidate. */
export const POST = route<{ id: string }>({ action: "project.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const { partId } = await parseBody(req, z.object({ partId: z.string() }));
  const part = await getPart({ workspaceId: caller.workspaceId, partId });
  if (!part) throw new AppError("not_found:part", "No such part in this workspace's library.");
  await db.transaction(async (tx) => {
    await tx
      .insert(projectCandidates)
      .values({ projectId: project.id, partId: part.id })
      .onConflictDoNothing();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "candidate.added",
        subjectType: "project",
        subjectId: project.id,
        details: { partId: part.id, partNumber: part.partNumber },
      },
      tx,
    );
  });
  return json({ status: "ok" }, { status: 201 });
});
