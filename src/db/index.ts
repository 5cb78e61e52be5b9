import "server-only";
import { env } from "@/lib/env";
import { createDb, type Db } from "./client";

const globalForDb = globalThis as unknown as { pulsefenceDb?: Db };
globalForDb.pulsefenceDb ??= createDb(env().DATABASE_URL).db;

/** The one database client of the app, created once per process. */
export const db: Db = globalForDb.pulsefenceDb;
