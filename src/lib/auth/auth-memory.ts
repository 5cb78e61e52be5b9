import "server-only";
import { dbSql } from "@/db";
import { getMembership, listMembers, listUserWorkspaces } from "@/db/queries/members";
import { logError } from "@/lib/log";
import {
  AUTH_CHANNEL,
  AuthCache,
  type CachedMember,
  type CachedMembership,
  type CachedWorkspace,
} from "./auth-cache";

// This process's memory of who a request is (rules in auth-cache.ts): the listening that keeps it true, and the
// membership and workspace-list lookups that go through it. Tokens (token-auth.ts) and sessions (session.ts) use it.

interface State {
  cache: AuthCache;
  listening: Promise<void> | null;
}
const globalForAuth = globalThis as unknown as { pulsefenceAuth?: State };
globalForAuth.pulsefenceAuth ??= { cache: new AuthCache(performance, { enabled: false }), listening: null };
const state: State = globalForAuth.pulsefenceAuth;

/** This process's memory of tokens, sessions and memberships (exported for tests). */
export const authCache = state.cache;

/**
 * Listens for the triggers' notifications (drizzle/0011, 0014): each clears this process's memory. The memory is
 * used only once listening; at every (re)connect it is cleared, since notifications may have been missed meanwhile.
 */
export function listenForAuthChanges(): void {
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
  listenForAuthChanges();
  await state.listening;
}

/**
 * What memory holds (`cached`), else what `read` gets from the database, remembered (`remember`, with the
 * generation taken before the read) unless it is null. Requests that miss `key` at once share one read.
 */
async function throughMemory<T>(
  key: string,
  cached: T | undefined,
  read: () => Promise<T | null>,
  remember: (value: T, generation: number) => void,
): Promise<T | null> {
  listenForAuthChanges();
  if (cached !== undefined) return cached;
  return authCache.sharedRead(key, async () => {
    const generation = authCache.generation();
    const value = await read();
    if (value !== null) remember(value, generation);
    return value;
  });
}

/** A member's role in a workspace, remembered as briefly as the rest; null when not a member. */
export function rememberedMembership(workspaceId: string, userId: string): Promise<CachedMembership | null> {
  return throughMemory(
    `membership:${workspaceId}:${userId}`,
    authCache.membership(workspaceId, userId),
    async () => {
      const row = await getMembership({ workspaceId, userId });
      return row && { role: row.role, leadRights: row.leadRights, workspaceName: row.workspaceName };
    },
    (value, generation) => authCache.rememberMembership(workspaceId, userId, value, generation),
  );
}

/** The workspaces a user belongs to (the switcher's list), remembered as briefly as the rest. */
export async function rememberedWorkspaces(userId: string): Promise<readonly CachedWorkspace[]> {
  const rows = await throughMemory(
    `workspaces:${userId}`,
    authCache.workspaces(userId),
    () => listUserWorkspaces({ userId }),
    (value, generation) => authCache.rememberWorkspaces(userId, value, generation),
  );
  return rows ?? [];
}

/** A workspace's members (owners, pickers, the team page), remembered as briefly as the rest. */
export async function rememberedMembers(workspaceId: string): Promise<readonly CachedMember[]> {
  const rows = await throughMemory(
    `members:${workspaceId}`,
    authCache.members(workspaceId),
    () => listMembers({ workspaceId }),
    (value, generation) => authCache.rememberMembers(workspaceId, value, generation),
  );
  return rows ?? [];
}

/**
 * Forgets everything remembered in this process at once; called after a change that ends or narrows an access,
 * beside the trigger's notification that reaches every process (this one a moment later).
 */
export function forgetCachedAuth(): void {
  authCache.clear();
}
