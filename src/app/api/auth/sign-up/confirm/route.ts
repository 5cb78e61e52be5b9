import { confirmSignUp } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { confirmSignUpSchema } from "@/lib/auth/schemas";
import { startSession } from "@/lib/auth/session";
import { ipKeys, reserveAttempt } from "@/lib/auth/throttle";
import { hashToken } from "@/lib/auth/tokens";
import { json, parseBody } from "@/lib/http";

/**
 * POST /api/auth/sign-up/confirm { token }: uses the e-mailed sign-up link once: creates the account and its
 * workspace, with the new user as admin, and signs in (201). A used or expired link is a 404.
 */
export const POST = publicRoute(async (req) => {
  const { token } = await parseBody(req, confirmSignUpSchema);
  await reserveAttempt("sign-up", [`link:${hashToken(token)}`, ...ipKeys(req)]);
  const { userId, workspaceId } = await confirmSignUp(token);
  const cookie = await startSession(userId, workspaceId);
  return json({ status: "ok" }, { status: 201, headers: { "set-cookie": cookie } });
});
