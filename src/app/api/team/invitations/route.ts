import { listPendingInvitations } from "@/db/queries/invitations";
import { route } from "@/lib/auth/guard";
import { sendInvitation } from "@/lib/auth/invite";
import { inviteSchema } from "@/lib/auth/schemas";
import { json, parseBody } from "@/lib/http";

/** GET /api/team/invitations: pending invitations of the active workspace. */
export const GET = route({ action: "member.invite" }, async (_req, caller) => {
  return json({ invitations: await listPendingInvitations({ workspaceId: caller.workspaceId }) });
});

/** POST /api/team/invitations: invites an e-mail address with a role; the link goes out by e-mail. */
export const POST = route({ action: "member.invite" }, async (req, caller) => {
  const input = await parseBody(req, inviteSchema);
  const invitation = await sendInvitation(caller, input);
  return json({ invitation }, { status: 201 });
});
