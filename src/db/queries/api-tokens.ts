import "server-only";
import { and, desc, eq, gt, isNull, lt, or } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens, users } from "@/db/schema";

/**
 * The live (not revoked, not expired) token with this SHA-256, its user and workspace, and when it was last used;
 * or null. One query; the guard remembers the answer briefly (src/lib/auth/token-auth.ts).
 */
export async function findActiveApiToken(tokenHash: string) {
  const [row] = await db
    .select({
      id: apiTokens.id,
      workspaceId: apiTokens.workspaceId,
      lastUsedAt: apiTokens.lastUsedAt,
      user: { id: users.id, email: users.email, name: users.name },
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(
      and(
        eq(apiTokens.tokenHash, tokenHash),
        isNull(apiTokens.revokedAt),
        gt(apiTokens.expiresAt, new Date()),
      ),
    );
  return row ?? null;
}

/**
 * Marks a token used now, unless it was marked within `intervalMs` (by any process): at most about one write per
 * token and interval, whatever the request rate.
 */
export async function markApiTokenUsed(id: string, intervalMs: number): Promise<void> {
  const now = new Date();
  await db
    .update(apiTokens)
    .set({ lastUsedAt: now })
    .where(
      and(
        eq(apiTokens.id, id),
        or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, new Date(now.getTime() - intervalMs))),
      ),
    );
}

export function listApiTokens({ userId }: { userId: string }) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      workspaceId: apiTokens.workspaceId,
      createdAt: apiTokens.createdAt,
      expiresAt: apiTokens.expiresAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .where(eq(apiTokens.userId, userId))
    .orderBy(desc(apiTokens.createdAt));
}
