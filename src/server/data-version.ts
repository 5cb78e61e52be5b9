import postgres from "postgres";
import { connectTimeoutSeconds } from "@/db/client";

/**
 * The database's state as one text, for the page memory (page-cache.ts): PostgreSQL's current snapshot
 * (`pg_current_snapshot()`: the oldest transaction still running, the next transaction id, the ones in progress).
 * Any transaction that writes and commits (or rolls back) anywhere in the database changes it: one in progress at
 * the first reading leaves the in-progress list, one started later moves the next id. Reads change nothing. So two
 * equal answers mean every page rendered between them saw the same committed data.
 */
export function snapshotVersion(url: string): { version: () => Promise<string>; end: () => Promise<void> } {
  const sql = postgres(url, { max: 2, connect_timeout: connectTimeoutSeconds, onnotice: () => {} });
  return {
    version: async () => {
      const [row] = await sql<{ v: string }[]>`select pg_current_snapshot()::text as v`;
      if (!row) throw new Error("pg_current_snapshot() answered no row");
      return row.v;
    },
    end: () => sql.end({ timeout: 5 }),
  };
}
