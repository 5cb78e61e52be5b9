import { route } from "@/lib/auth/guard";
import { blankSessionCookie, endAllSessions } from "@/lib/auth/session";
import { json } from "@/lib/http";

/** POST /api/auth/sign-out-everywhere: ends every session of the signed-in user, this one too. */
export const POST = route({ signedIn: true }, async (_req, caller) => {
  await endAllSessions(caller.user.id);
  return json({ status: "ok" }, { headers: { "set-cookie": blankSessionCookie() } });
});
