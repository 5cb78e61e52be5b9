import { getPendingInvitation } from "@/db/queries/invitations";
import { route } from "@/lib/auth/guard";
import { sendInvitation } from "@/lib/auth/invite";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";

/** POST /api/team/invitations/:id/resend: a fresh link (7 more days); the old link stops working. */
export const POST = route<{ id: string }>({ action: "member.invite" }, async (_req, caller, { id }) => {
  const old = await getPendingInvitation({ workspaceId: caller.workspaceId, id });
  if (!old) throw new AppError("not_found:invitation", "No such pending invitation.");
  const invitation = await sendInvitation(caller, { email: old.email, role: old.role, replaceId: old.id });
  return json({ invitation }, { status: 201 });
});
