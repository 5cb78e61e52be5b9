import "server-only";
import { findActiveApiToken, markApiTokenUsed } from "@/db/queries/api-tokens";
import { logError } from "@/lib/log";
import { type CachedToken, LAST_USED_INTERVAL_MS } from "./auth-cache";
import { authCache, listenForAuthChanges } from "./auth-memory";
import { hashToken } from "./tokens";

// Bearer-token authentication for /api/v1 with a short-lived memory per process (rules in auth-cache.ts).

// On globalThis, like the memory itself: every bundle of the app that includes this module shares one set.
const globalForWrites = globalThis as unknown as { pulsefenceTokenWrites?: Set<Promise<void>> };
globalForWrites.pulsefenceTokenWrites ??= new Set();
const pendingWrites = globalForWrites.pulsefenceTokenWrites;

/** The live token behind a bearer secret, or null. At most one query per AUTH_CACHE_TTL_MS per token. */
export async function authenticateToken(secret: string): Promise<CachedToken | null> {
  listenForAuthChanges();
  const hash = hashToken(secret);
  const cached = authCache.token(hash);
  let token: CachedToken | null;
  if (cached) {
    token = cached.value;
  } else {
    // Requests that miss at once (the entry just expired under load) share one read.
    token = await authCache.sharedRead(`token:${hash}`, async () => {
      const generation = authCache.generation();
      const row = await findActiveApiToken(hash);
      const found = row && { id: row.id, workspaceId: row.workspaceId, user: row.user };
      authCache.rememberToken(hash, found, generation);
      // A token read from the database and marked within the interval (by any process) needs no write.
      if (row?.lastUsedAt && Date.now() - row.lastUsedAt.getTime() < LAST_USED_INTERVAL_MS) {
        authCache.lastUsedDue(row.id);
      }
      return found;
    });
  }
  if (token && authCache.lastUsedDue(token.id)) markUsedLater(token.id);
  return token;
}

/** Writes last_used_at after the response, never failing the request. */
function markUsedLater(tokenId: string): void {
  const write = markApiTokenUsed(tokenId, LAST_USED_INTERVAL_MS)
    .catch((error) => logError("auth cache: could not mark a token used", error))
    .finally(() => pendingWrites.delete(write));
  pendingWrites.add(write);
}

/** Resolves when every last_used_at write started so far is done (tests). */
export async function settleTokenWrites(): Promise<void> {
  await Promise.all(pendingWrites);
}
