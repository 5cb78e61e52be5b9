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

/** How long a storage or mail probe's answer stands for the probes after it. */
const PROBE_MEMORY_MS = 2_000;

/**
 * A probe whose answer is reused for PROBE_MEMORY_MS, and shared by the calls that come while it runs. Storage
 * and mail are probed over the network (a signed request, an SMTP greeting), which cost more CPU than the rest of
 * a health answer together; a load balancer's probe every second or so then costs one probe per process. The
 * database, which every request needs, is probed on every call.
 */
function remembered(run: () => Promise<Status>): () => Promise<Status> {
  let last: { at: number; status: Promise<Status> } | null = null;
  return () => {
    const now = Date.now();
    if (!last || now - last.at >= PROBE_MEMORY_MS) last = { at: now, status: run() };
    return last.status;
  };
}

const storageProbe = remembered(() => probe("storage", () => storage().ping()));
const mailProbe = remembered(() => probe("mail", () => mailer().ping()));

/** GET /api/health: each service "ok" or "unavailable"; 200 only when all are ok. Public, reveals no internals. */
export const GET = publicRoute(async () => {
  const [dbStatus, storageStatus, mailStatus] = await Promise.all([
    probe("database", () => db.execute(sql`select 1`)),
    storageProbe(),
    mailProbe(),
  ]);
  const body = { db: dbStatus, storage: storageStatus, mail: mailStatus };
  const healthy = Object.values(body).every((s) => s === "ok");
  const headers = new Headers({ "cache-control": "no-store" });
  if (!healthy) headers.set("retry-after", "5");
  return Response.json(body, { status: healthy ? 200 : 503, headers });
});
