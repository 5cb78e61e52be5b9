import { sql } from "drizzle-orm";
import { db } from "@/db";
import { publicRoute } from "@/lib/auth/guard";
import { logError } from "@/lib/log";
import { mailer } from "@/lib/mail";
import { storage } from "@/lib/storage";

export const dynamic = "force-dynamic";

type Status = "ok" | "unavailable";

/** A service's state: "ok" or "unavailable". What failed is logged (safely), never shown to the caller. */
async function probe(service: string, run: () => Promise<unknown>): Promise<Status> {
  try {
    await run();
    return "ok";
  } catch (error) {
    logError(`health: ${service} unavailable`, error);
    return "unavailable";
  }
}

/** GET /api/health: each service "ok" or "unavailable"; 200 only when all are ok. Public, reveals no internals. */
export const GET = publicRoute(async () => {
  const [dbStatus, storageStatus, mailStatus] = await Promise.all([
    probe("database", () => db.execute(sql`select 1`)),
    probe("storage", () => storage().ping()),
    probe("mail", () => mailer().ping()),
  ]);
  const body = { db: dbStatus, storage: storageStatus, mail: mailStatus };
  const healthy = Object.values(body).every((s) => s === "ok");
  const headers = new Headers({ "cache-control": "no-store" });
  if (!healthy) headers.set("retry-after", "5");
  return Response.json(body, { status: healthy ? 200 : 503, headers });
});
