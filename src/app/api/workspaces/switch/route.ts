import { getMembership } from "@/db/queries/members";
import { route } from "@/lib/auth/guard";
import { switchWorkspaceSchema } from "@/lib/auth/schemas";
import { setSessionWorkspace } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";

/** POST /api/workspaces/switch: makes another of the user's workspaces the active one of this session. */
export const POST = route({ signedIn: true }, async (req, caller) => {
  const { workspaceId } = await parseBody(req, switchWorkspaceSchema);
  const membership = await getMembership({ workspaceId, userId: caller.user.id });
  if (!membership || !caller.sessionId) throw new AppError("not_found:workspace", "No such workspace.");
  await setSessionWorkspace(caller.sessionId, workspaceId);
  return json({ status: "ok", workspace: { id: workspaceId, name: membership.workspaceName } });
});
