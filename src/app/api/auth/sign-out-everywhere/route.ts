import { and, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens } from "@/db/schema";
import { forgetCachedAuth } from "@/lib/auth/auth-memory";
import { route } from "@/lib/auth/guard";
import { blankSessionCookie, endAllSessions } from "@/lib/auth/session";
import { json } from "@/lib/http";

/** POST /api/auth/sign-out-everywhere: ends every session of the signed-in user, this one too, and every API token. */
export const POST = route({ signedIn: true }, async (_req, caller) => {
  await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.userId, caller.user.id), isNull(apiTokens.revokedAt)));
  forgetCachedAuth();
  await endAllSessions(caller.user.id);
  return json({ status: "ok" }, { headers: { "set-cookie": blankSessionCookie() } });
});
