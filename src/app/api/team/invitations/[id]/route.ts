import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getPendingInvitation } from "@/db/queries/invitations";
import { invitations } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";

/** DELETE /api/team/invitations/:id: revokes a pending invitation; its link stops working. */
export const DELETE = route<{ id: string }>({ action: "member.invite" }, async (_req, caller, { id }) => {
  const invitation = await getPendingInvitation({ workspaceId: caller.workspaceId, id });
  if (!invitation) throw new AppError("not_found:invitation", "No such pending invitation.");
  await db.transaction(async (tx) => {
    await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, id));
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "invitation.revoked",
        subjectType: "invitation",
        subjectId: id,
        details: { email: invitation.email, role: invitation.role },
      },
      tx,
    );
  });
  return json({ status: "ok" });
});
