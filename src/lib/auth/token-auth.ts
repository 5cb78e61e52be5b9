import "server-only";
import { dbSql } from "@/db";
import { findActiveApiToken, markApiTokenUsed } from "@/db/queries/api-tokens";
import { getMembership } from "@/db/queries/members";
import { logError } from "@/lib/log";
import {
  AUTH_CHANNEL,
  AuthCache,
  type CachedMembership,
  type CachedToken,
  LAST_USED_INTERVAL_MS,
} from "./auth-cache";
import { hashToken } from "./tokens";

// Bearer-token authentication for /api/v1 with a short-lived memory per process (rules in auth-cache.ts).

interface State {
  cache: AuthCache;
  listening: Promise<void> | null;
  pendingWrites: Set<Promise<void>>;
}
const globalForAuth = globalThis as unknown as { pulsefenceAuth?: State };
globalForAuth.pulsefenceAuth ??= {
  cache: new AuthCache(performance, { enabled: false }),
  listening: null,
  pendingWrites: new Set(),
};
const state: State = globalForAuth.pulsefenceAuth;

/** This process's memory of tokens and memberships (exported for tests). */
export const authCache = state.cache;

/**
 * Listens for the triggers' notifications (drizzle/0011): each clears this process's memory. The memory is used
 * only once listening; at every (re)connect it is cleared, since notifications may have been missed meanwhile.
 */
function listen(): void {
  state.listening ??= dbSql
    .listen(
      AUTH_CHANNEL,
      () => authCache.clear(),
      () => {
        authCache.clear();
        authCache.enabled = true;
      },
    )
    .then(() => {})
    .catch((error) => {
      // Without notifications nothing is remembered: every request asks the database, as before.
      authCache.enabled = false;
      state.listening = null;
      logError("auth cache: could not listen for changes", error);
    });
}

/** Resolves once this process listens for changes (or gave up trying; then nothing is remembered). Tests. */
export async function whenListening(): Promise<void> {
  listen();
  await state.listening;
}

/** The live token behind a bearer secret, or null. At most one query per AUTH_CACHE_TTL_MS per token. */
export async function authenticateToken(secret: string): Promise<CachedToken | null> {
  listen();
  const hash = hashToken(secret);
  const cached = authCache.token(hash);
  let token: CachedToken | null;
  if (cached) {
    token = cached.value;
  } else {
    const generation = authCache.generation();
    const row = await findActiveApiToken(hash);
    token = row && { id: row.id, workspaceId: row.workspaceId, user: row.user };
    authCache.rememberToken(hash, token, generation);
    // A token read from the database and marked within the interval (by any process) needs no write.
    if (row?.lastUsedAt && Date.now() - row.lastUsedAt.getTime() < LAST_USED_INTERVAL_MS) {
      authCache.lastUsedDue(row.id);
    }
  }
  if (token && authCache.lastUsedDue(token.id)) markUsedLater(token.id);
  return token;
}

/** Writes last_used_at after the response, never failing the request. */
function markUsedLater(tokenId: string): void {
  const write = markApiTokenUsed(tokenId, LAST_USED_INTERVAL_MS)
    .catch((error) => logError("auth cache: could not mark a token used", error))
    .finally(() => state.pendingWrites.delete(write));
  state.pendingWrites.add(write);
}

/** Resolves when every last_used_at write started so far is done (tests). */
export async function settleTokenWrites(): Promise<void> {
  await Promise.all(state.pendingWrites);
}

/** A token caller's membership of the token's workspace, remembered as briefly as the token. */
export async function tokenMembership(workspaceId: string, userId: string): Promise<CachedMembership | null> {
  const cached = authCache.membership(workspaceId, userId);
  if (cached) return cached;
  const generation = authCache.generation();
  const row = await getMembership({ workspaceId, userId });
  if (!row) return null;
  const membership = { role: row.role, leadRights: row.leadRights };
  authCache.rememberMembership(workspaceId, userId, membership, generation);
  return membership;
}

/**
 * Forgets every remembered token and membership in this process at once; called after a change that ends or
 * narrows an access, beside the trigger's notification that reaches every process (this one a moment later).
 */
export function forgetCachedAuth(): void {
  authCache.clear();
}
