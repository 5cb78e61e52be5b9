import "server-only";
import { env } from "@/lib/env";
import { createDb, type Db } from "./client";

const globalForDb = globalThis as unknown as { pulsefenceDb?: ReturnType<typeof createDb> };
globalForDb.pulsefenceDb ??= createDb(env().DATABASE_URL);

/** The one database client of the app, created once per process. */
export const db: Db = globalForDb.pulsefenceDb.db;
/** The same pool's SQL client, for what Drizzle does not do (LISTEN). */
export const dbSql = globalForDb.pulsefenceDb.sql;
