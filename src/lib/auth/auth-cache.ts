// A short-lived, in-process memory of who a request is: API tokens, sessions, the memberships they act in, the
// switcher's list of a user's workspaces and a workspace's list of members, so that an API call or a page does not ask the database the same three
// questions at every request (issue: fast under load).
//
// Rules that keep it safe:
// - an entry lives at most AUTH_CACHE_TTL_MS (5 s) after it was read from the database: a change that reached no
//   process's notice (a notification lost while the listening connection was down) is seen within that bound;
// - every change that can end or narrow an access (token revoked or expired, password reset or changed, sign-out
//   everywhere, a session ended, expired, renewed or moved to another workspace, a membership added, changed or
//   removed, a workspace renamed, an account or workspace deleted) fires a PostgreSQL NOTIFY from a trigger
//   (drizzle/0011, 0014), and every app process clears its whole memory when it hears one;
//   the process that made the change also clears its own at once (`forgetCachedAuth`);
// - a database read that started before a clear is not remembered after it (a generation counter), so a
//   revocation racing a lookup cannot leave the old answer behind;
// - requests that miss the same entry at once share one database read (`sharedRead`), so an entry's expiry under
//   load costs one query, not one per request in flight; a request after a clear never joins a read from before it;
// - a remembered session is still refused once past its expiry or its maximum age (session.ts checks both).
import { LRUCache } from "lru-cache";
import type { Role } from "@/db/schema";

/** How long a token's or membership's answer is reused without the database, in ms. */
export const AUTH_CACHE_TTL_MS = 5_000;
/** `last_used_at` is written at most once per this interval per token (and never on the response path). */
export const LAST_USED_INTERVAL_MS = 60_000;
/** How long after it began a database read of the auth memory may be joined by another request, in ms. */
export const SHARED_READ_MS = 1_000;
/** The PostgreSQL channel the triggers notify on any change to tokens, memberships or accounts. */
export const AUTH_CHANNEL = "pulsefence_auth";

export interface CachedToken {
  id: string;
  workspaceId: string;
  user: { id: string; email: string; name: string };
}

export interface CachedMembership {
  role: Role;
  leadRights: boolean;
  workspaceName: string;
}

/** A valid session as read from the database (times in ms since the epoch). */
export interface CachedSession {
  userId: string;
  workspaceId: string | null;
  expiresAt: number;
  createdAt: number;
  user: { id: string; email: string; name: string };
}

/** A member of a workspace, as pages list them (owners, pickers, the team). */
export interface CachedMember {
  userId: string;
  name: string;
  email: string;
  role: Role;
  leadRights: boolean;
  joinedAt: Date;
}

/** One of a user's workspaces, for the switcher. */
export interface CachedWorkspace {
  id: string;
  name: string;
  role: Role;
}

/** A clock in ms (performance.now() in the app; a test may pass its own). */
export interface Clock {
  now(): number;
}

const MAX_ENTRIES = 10_000;

export class AuthCache {
  /** Token hash → the live token, or null for a hash that matched no live token. */
  private readonly tokens: LRUCache<string, { value: CachedToken | null }>;
  private readonly memberships: LRUCache<string, CachedMembership>;
  /** Session id (the token's hash) → the valid session. */
  private readonly sessions: LRUCache<string, CachedSession>;
  /** User id → the workspaces they belong to. */
  private readonly workspaceLists: LRUCache<string, readonly CachedWorkspace[]>;
  /** Workspace id → its members. */
  private readonly memberLists: LRUCache<string, readonly CachedMember[]>;
  /** Token id → when this process last wrote its last_used_at (clock ms). Survives clears: it is not access. */
  private readonly lastUsed: LRUCache<string, number>;
  /** Database reads in flight, by key, shared by the requests that miss at once; emptied at a clear. */
  private readonly reads = new Map<string, { read: Promise<unknown>; startedAt: number }>();
  private generationCount = 0;
  private readonly clearedListeners = new Set<() => void>();
  /** False until the process listens for changes; nothing is remembered meanwhile. */
  enabled: boolean;

  constructor(
    private readonly clock: Clock = performance,
    options: { enabled?: boolean; ttlMs?: number } = {},
  ) {
    const ttl = options.ttlMs ?? AUTH_CACHE_TTL_MS;
    this.enabled = options.enabled ?? true;
    const lru = { max: MAX_ENTRIES, ttl, ttlResolution: 0, perf: clock, ttlAutopurge: false } as const;
    this.tokens = new LRUCache(lru);
    this.memberships = new LRUCache(lru);
    this.sessions = new LRUCache(lru);
    this.workspaceLists = new LRUCache(lru);
    this.memberLists = new LRUCache(lru);
    this.lastUsed = new LRUCache({ max: MAX_ENTRIES });
  }

  /** The current generation: pass it back to `remember…` so a read that raced a clear is dropped. */
  generation(): number {
    return this.generationCount;
  }

  token(hash: string): { value: CachedToken | null } | undefined {
    return this.enabled ? this.tokens.get(hash) : undefined;
  }

  rememberToken(hash: string, value: CachedToken | null, generation: number): void {
    if (this.enabled && generation === this.generationCount) this.tokens.set(hash, { value });
  }

  membership(workspaceId: string, userId: string): CachedMembership | undefined {
    return this.enabled ? this.memberships.get(`${workspaceId}:${userId}`) : undefined;
  }

  rememberMembership(workspaceId: string, userId: string, value: CachedMembership, generation: number): void {
    if (this.enabled && generation === this.generationCount) {
      this.memberships.set(`${workspaceId}:${userId}`, value);
    }
  }

  session(id: string): CachedSession | undefined {
    return this.enabled ? this.sessions.get(id) : undefined;
  }

  rememberSession(id: string, value: CachedSession, generation: number): void {
    if (this.enabled && generation === this.generationCount) this.sessions.set(id, value);
  }

  workspaces(userId: string): readonly CachedWorkspace[] | undefined {
    return this.enabled ? this.workspaceLists.get(userId) : undefined;
  }

  /** Lists are shared by every request that reads them until a clear: they are frozen, rows included. */
  rememberWorkspaces(userId: string, value: readonly CachedWorkspace[], generation: number): void {
    if (this.enabled && generation === this.generationCount) this.workspaceLists.set(userId, frozen(value));
  }

  members(workspaceId: string): readonly CachedMember[] | undefined {
    return this.enabled ? this.memberLists.get(workspaceId) : undefined;
  }

  rememberMembers(workspaceId: string, value: readonly CachedMember[], generation: number): void {
    if (this.enabled && generation === this.generationCount) this.memberLists.set(workspaceId, frozen(value));
  }

  /**
   * True when this token's last_used_at is due a write (none by this process within LAST_USED_INTERVAL_MS), and
   * marks it written; the caller then writes it off the response path.
   */
  lastUsedDue(tokenId: string): boolean {
    const now = this.clock.now();
    const last = this.lastUsed.get(tokenId);
    if (last !== undefined && now - last < LAST_USED_INTERVAL_MS) return false;
    this.lastUsed.set(tokenId, now);
    return true;
  }

  /**
   * `read()` (a database read that remembers what it found), shared: a request that misses `key` while a read of
   * it is in flight since the last clear waits for that read instead of starting its own. A clear drops the reads
   * in flight, so a request after it starts afresh. Its answer was read no earlier than the request that started
   * it, and is as fresh as a remembered one. A read is joined only in its first SHARED_READ_MS: one that hangs holds
   * up only those. Not shared while nothing is remembered (not listening yet).
   */
  sharedRead<T>(key: string, read: () => Promise<T>): Promise<T> {
    if (!this.enabled) return read();
    const now = this.clock.now();
    const running = this.reads.get(key);
    if (running && now - running.startedAt < SHARED_READ_MS) return running.read as Promise<T>;
    const started = read().finally(() => {
      if (this.reads.get(key)?.read === started) this.reads.delete(key);
    });
    this.reads.set(key, { read: started, startedAt: now });
    return started;
  }

  /** Forgets everything remembered (a change was made or heard of). */
  clear(): void {
    this.generationCount++;
    this.reads.clear();
    this.tokens.clear();
    this.memberships.clear();
    this.sessions.clear();
    this.workspaceLists.clear();
    this.memberLists.clear();
    for (const listener of this.clearedListeners) listener();
  }

  /** Calls `listener` at every clear until the returned function is called. */
  onClear(listener: () => void): () => void {
    this.clearedListeners.add(listener);
    return () => this.clearedListeners.delete(listener);
  }
}

function frozen<T extends object>(rows: readonly T[]): readonly T[] {
  for (const row of rows) Object.freeze(row);
  return Object.freeze(rows);
}
