import { createAccount } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { signUpSchema } from "@/lib/auth/schemas";
import { startSession } from "@/lib/auth/session";
import { json, parseBody } from "@/lib/http";

/** POST /api/auth/sign-up: a new account and its workspace, with the new user as admin; signs in. */
export const POST = publicRoute(async (req) => {
  const input = await parseBody(req, signUpSchema);
  const { userId, workspaceId } = await createAccount(input);
  const cookie = await startSession(userId, workspaceId);
  return json({ status: "ok" }, { status: 201, headers: { "set-cookie": cookie } });
});
