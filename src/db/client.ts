import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";

/** Seconds to wait for a connection before a request is answered 503: an outage is told, not waited out. */
export const connectTimeoutSeconds = 3;

/** Creates a Drizzle client on its own connection pool (scripts and tests; the app uses `db` from index.ts). */
export function createDb(url: string, options: { max?: number } = {}) {
  const sql = postgres(url, {
    max: options.max ?? 10,
    connect_timeout: connectTimeoutSeconds,
    onnotice: () => {},
  });
  return { db: drizzle(sql, { schema, casing: "snake_case" }), sql };
}

export type Db = ReturnType<typeof createDb>["db"];
