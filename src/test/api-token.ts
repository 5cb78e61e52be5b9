// An API token made the way a user makes one: through the account's token route, with a session of the user.
import { POST as createToken } from "@/app/api/account/tokens/route";
import { call, sessionCookie } from "./fixtures";

/** A new API token of the user in the workspace, named `name`; the secret is shown only here, as in the app. */
export async function newApiToken(
  userId: string,
  workspaceId: string,
  name: string,
): Promise<{ id: string; secret: string }> {
  const cookie = await sessionCookie(userId, workspaceId);
  const res = await call(createToken, "POST", { cookie, body: { name } });
  return (await res.json()).token;
}
