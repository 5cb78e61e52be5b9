import { acceptInvitation } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { acceptInvitationSchema } from "@/lib/auth/schemas";
import { startSession } from "@/lib/auth/session";
import { json, parseBody } from "@/lib/http";

/** POST /api/invitations/accept: uses an invitation link once and signs in to its workspace. */
export const POST = publicRoute(async (req) => {
  const input = await parseBody(req, acceptInvitationSchema);
  const { userId, workspaceId } = await acceptInvitation(input);
  const cookie = await startSession(userId, workspaceId);
  return json({ status: "ok" }, { headers: { "set-cookie": cookie } });
});
