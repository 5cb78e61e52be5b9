import { and, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { apiTokens } from "@/db/schema";
import { forgetCachedAuth } from "@/lib/auth/auth-memory";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";
import { isUuid } from "@/lib/uuid";

/** DELETE /api/account/tokens/:id: revokes one of the user's own tokens; it answers 401 from then on. */
export const DELETE = route<{ id: string }>({ signedIn: true }, async (_req, caller, { id }) => {
  if (!isUuid(id)) throw new AppError("not_found:token", "No such token.");
  await db.transaction(async (tx) => {
    const [revoked] = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, caller.user.id), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id, workspaceId: apiTokens.workspaceId, name: apiTokens.name });
    if (!revoked) throw new AppError("not_found:token", "No such active token.");
    await recordAudit(
      {
        workspaceId: revoked.workspaceId,
        actorId: caller.user.id,
        action: "token.revoked",
        subjectType: "api-token",
        subjectId: revoked.id,
        details: { name: revoked.name },
      },
      tx,
    );
  });
  forgetCachedAuth();
  return json({ status: "ok" });
});
