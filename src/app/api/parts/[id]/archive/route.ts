import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { parts } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadPart } from "@/lib/library/parts";

/** POST /api/parts/:id/archive { archived }: hides a part from the library (kept for history) or brings it back. */
export const POST = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const { archived } = await parseBody(req, z.object({ archived: z.boolean() }));
  await db.transaction(async (tx) => {
    await tx
      .update(parts)
      .set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() })
      .where(eq(parts.id, part.id));
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: archived ? "part.archived" : "part.restored",
        subjectType: "part",
        subjectId: part.id,
      },
      tx,
    );
  });
  return json({ status: "ok", archived });
});
