import { route } from "@/lib/auth/guard";
import { blankSessionCookie, endSession } from "@/lib/auth/session";
import { json } from "@/lib/http";

/** POST /api/auth/sign-out: ends this browser's session. */
export const POST = route({ signedIn: true }, async (_req, caller) => {
  const cookie = caller.sessionId ? await endSession(caller.sessionId) : blankSessionCookie();
  return json({ status: "ok" }, { headers: { "set-cookie": cookie } });
});
