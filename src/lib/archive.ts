import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { parts, projects } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";

const archivable = { part: parts, project: projects };

/**
 * Archives a part or a project (kept for history, hidden from its list) or brings it back, and records who did:
 * the audit action is `part.archived`, `project.restored` and so on.
 */
export async function setArchived(
  caller: MemberCaller,
  subjectType: keyof typeof archivable,
  id: string,
  archived: boolean,
): Promise<void> {
  const table = archivable[subjectType];
  await db.transaction(async (tx) => {
    await tx
      .update(table)
      .set({ archivedAt: archived ? new Date() : null, updatedAt: new Date() })
      .where(eq(table.id, id));
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: `${subjectType}.${archived ? "archived" : "restored"}`,
        subjectType,
        subjectId: id,
      },
      tx,
    );
  });
}
