import { db } from "@/db";
import { listApiTokens } from "@/db/queries/api-tokens";
import { recordAudit } from "@/db/queries/audit";
import { apiTokens } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { createTokenSchema } from "@/lib/auth/schemas";
import { hashToken, randomToken } from "@/lib/auth/tokens";
import { json, parseBody } from "@/lib/http";

/** GET /api/account/tokens: the user's API tokens (never the secrets). */
export const GET = route({ signedIn: true }, async (_req, caller) => {
  return json({ tokens: await listApiTokens({ userId: caller.user.id }) });
});

/**
 * POST /api/account/tokens: a named token acting as the user in the active workspace, with the user's role there.
 * The secret is in this response only; the database keeps its SHA-256.
 */
export const POST = route({ action: "workspace.read" }, async (req, caller) => {
  const { name } = await parseBody(req, createTokenSchema);
  const secret = randomToken("pf_");
  const token = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({
        userId: caller.user.id,
        workspaceId: caller.workspaceId,
        name,
        tokenHash: hashToken(secret),
        prefix: secret.slice(0, 9),
      })
      .returning({
        id: apiTokens.id,
        name: apiTokens.name,
        prefix: apiTokens.prefix,
        createdAt: apiTokens.createdAt,
      });
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "token.created",
        subjectType: "api-token",
        subjectId: row.id,
        details: { name },
      },
      tx,
    );
    return row;
  });
  return json({ token: { ...token, secret } }, { status: 201 });
});
