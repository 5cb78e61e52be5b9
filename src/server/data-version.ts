import postgres from "postgres";
import { connectTimeoutSeconds } from "@/db/client";
import { SESSION_COOKIE } from "@/lib/auth/cookie-name";
import { freshNonce } from "@/lib/nonce";
import { settledWithin } from "@/lib/time-limit";
import type { PageCacheOptions } from "./page-cache";

/** How long the state may take to read before a page is rendered without the page memory, ms. */
const READ_LIMIT_MS = 250;

/**
 * The database's state as one text, for the page memory (page-cache.ts): PostgreSQL's current snapshot
 * (`pg_current_snapshot()`: xmin, xmax (one past the latest completed transaction id) and the ids in progress).
 * Every transaction that wrote (so holds an id) changes it when it completes, committed or rolled back: one in
 * progress at the first reading leaves the in-progress list, one that began later raises xmax. Reads change nothing,
 * nor does a sequence's `nextval` alone (not data a page shows). So two equal answers mean every page rendered
 * between them saw the same committed data. Answers null when the database does not answer within 250 ms.
 */
export function snapshotVersion(url: string): {
  version: () => Promise<string | null>;
  end: () => Promise<void>;
} {
  const sql = postgres(url, { max: 2, connect_timeout: connectTimeoutSeconds, onnotice: () => {} });
  const read = async () => {
    const [row] = await sql<{ v: string }[]>`select pg_current_snapshot()::text as v`;
    return row?.v ?? null;
  };
  return {
    version: () =>
      settledWithin(
        read().catch(() => null),
        READ_LIMIT_MS,
        null,
      ),
    end: () => sql.end({ timeout: 5 }),
  };
}

/**
 * The state of this process's memory of who a request is (src/lib/auth/auth-memory.ts, kept on globalThis, so the
 * framework's bundle and this module see one): each clearing (a sign-out, a membership changed, here or heard of)
 * gives a new one, so an answer given with what the memory held before is not sent after.
 */
export function authMemoryState(): string {
  const auth = (globalThis as { pulsefenceAuth?: { cache: { generation(): number; enabled: boolean } } })
    .pulsefenceAuth;
  return auth ? `${auth.cache.generation()}:${auth.cache.enabled}` : "none";
}

/** The state an answer kept in memory depends on: this process's auth memory's and the database's; null if unsaid. */
export function answerVersion(url: string): {
  version: () => Promise<string | null>;
  end: () => Promise<void>;
} {
  const database = snapshotVersion(url);
  return {
    version: async () => {
      const auth = authMemoryState();
      const data = await database.version();
      return data === null ? null : `${auth}|${data}`;
    },
    end: database.end,
  };
}

/**
 * The memory's settings for an app process or a lean API server: PF_PAGE_MEMORY_MB bounds it (default 64; 0 turns
 * it off), PF_PAGE_MEMORY_SECONDS says how long an answer is kept (default 5, as long as a session is remembered:
 * auth-cache.ts). Undefined when it is off or there is no database to read the state from.
 */
export function memoryFromEnvironment(env: NodeJS.ProcessEnv): Omit<PageCacheOptions, "answers"> | undefined {
  const memoryMb = Number(env.PF_PAGE_MEMORY_MB ?? 64);
  const keepSeconds = Number(env.PF_PAGE_MEMORY_SECONDS ?? 5);
  if (!(memoryMb > 0) || !env.DATABASE_URL) return undefined;
  return {
    version: answerVersion(env.DATABASE_URL).version,
    sessionCookie: SESSION_COOKIE,
    nonce: freshNonce,
    ttlMs: keepSeconds * 1000,
    maxBytes: memoryMb * 1024 * 1024,
  };
}
