import { sql } from "drizzle-orm";
import { db } from "@/db";
import { publicRoute } from "@/lib/auth/guard";
import { mailer } from "@/lib/mail";
import { storage } from "@/lib/storage";

export const dynamic = "force-dynamic";

type Status = "ok" | string;

async function probe(run: () => Promise<unknown>): Promise<Status> {
  try {
    await run();
    return "ok";
  } catch (error) {
    return error instanceof Error ? error.message : String(error);
  }
}

/** GET /api/health: each service "ok" or what is wrong; 200 only when all are ok. Public, reveals no data. */
export const GET = publicRoute(async () => {
  const [dbStatus, storageStatus, mailStatus] = await Promise.all([
    probe(() => db.execute(sql`select 1`)),
    probe(() => storage().ping()),
    probe(() => mailer().ping()),
  ]);
  const body = { db: dbStatus, storage: storageStatus, mail: mailStatus };
  const healthy = Object.values(body).every((s) => s === "ok");
  return Response.json(body, { status: healthy ? 200 : 503, headers: { "cache-control": "no-store" } });
});
