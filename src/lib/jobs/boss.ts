import "server-only";
import PgBoss from "pg-boss";
import { env } from "@/lib/env";
import { logError } from "@/lib/log";

// The app's job queue: pg-boss, on the app's own PostgreSQL (its tables live in the schema "pgboss"). Jobs are
// claimed with SKIP LOCKED, so any number of app processes, on any number of machines, can work one queue; a job
// whose worker died is expired and retried. Sending needs no worker: an instance started with JOB_WORKERS=0 only
// queues, and another one does the work.

/** Parse, store and check a freshly registered capture. */
export const CAPTURE_QUEUE = "capture-process";
/** Recompute a capture's stored results whose inputs changed (a candidate added, a part or the project edited). */
export const RECHECK_QUEUE = "capture-recheck";

/**
 * Where the queue puts a capture job that failed for good, however it failed: the handler threw on its last try, or
 * its worker died (killed, out of memory) on every try and the job expired. Its worker marks the capture failed, so
 * that no capture waits in "processing" for ever.
 */
export const GAVE_UP_QUEUE = "capture-gave-up";

/** Tries per job: the first, then `RETRY_LIMIT` retries 2 s, 4 s… apart; then the capture is marked failed. */
export const RETRY_LIMIT = 2;

// The dead-letter queue first: the others refer to it.
const queues: PgBoss.Queue[] = [
  { name: GAVE_UP_QUEUE, policy: "standard" as const },
  { name: CAPTURE_QUEUE, policy: "standard" as const, deadLetter: GAVE_UP_QUEUE },
  // One waiting and one running recheck per capture at most (its id is the singleton key).
  { name: RECHECK_QUEUE, policy: "stately" as const, deadLetter: GAVE_UP_QUEUE },
].map((q) => ({
  ...q,
  retryLimit: RETRY_LIMIT,
  retryDelay: 2,
  retryBackoff: true,
  // A job whose worker died is retried once this has passed; processing a 2 M-sample capture takes seconds.
  expireInSeconds: 120,
  retentionMinutes: 60,
}));

/** A started pg-boss on `url` with the app's queues created. Plain, so tests and scripts can make their own. */
export async function createBoss(url: string, { supervise = true } = {}): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: url,
    max: 4,
    application_name: "pulsefence-jobs",
    supervise,
    schedule: false,
    deleteAfterDays: 7,
  });
  boss.on("error", (error) => logError("job queue", error));
  await boss.start();
  for (const queue of queues) {
    const existing = await boss.getQueue(queue.name);
    if (existing) {
      // A queue made before it had a dead-letter queue gains one.
      if (existing.deadLetter !== queue.deadLetter) await boss.updateQueue(queue.name, queue);
      continue;
    }
    // Two processes starting at once may both try: the loser's duplicate-key error is harmless.
    await boss.createQueue(queue.name, queue).catch(async (error) => {
      if (!(await boss.getQueue(queue.name))) throw error;
    });
  }
  return boss;
}

const globalForBoss = globalThis as unknown as { pulsefenceBoss?: Promise<PgBoss> };

/** The process's job queue client, started on first use. */
export function jobQueue(): Promise<PgBoss> {
  globalForBoss.pulsefenceBoss ??= createBoss(env().DATABASE_URL).catch((error) => {
    globalForBoss.pulsefenceBoss = undefined;
    throw error;
  });
  return globalForBoss.pulsefenceBoss;
}

/** Stops the process's job queue, letting running jobs finish for up to `timeoutMs`. */
export async function stopJobQueue(timeoutMs = 20_000): Promise<void> {
  const started = globalForBoss.pulsefenceBoss;
  if (!started) return;
  globalForBoss.pulsefenceBoss = undefined;
  const boss = await started.catch(() => null);
  await boss?.stop({ graceful: true, wait: true, timeout: timeoutMs });
}
