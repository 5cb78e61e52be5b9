import "server-only";
import { and, asc, desc, eq, lte } from "drizzle-orm";
import { db } from "@/db";
import { mailOutbox } from "@/db/schema";
import { logError } from "@/lib/log";
import { settledWithin } from "@/lib/time-limit";
import { mailer } from "./index";
import type { Mail, Mailer } from "./mailer";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Puts an e-mail in the outbox, in the caller's transaction when given one, so the mail exists exactly when the
 * change that wants it is committed. Delivery happens after commit (call `kickOutbox`) and by the worker.
 */
export async function enqueueMail(
  mail: Mail,
  input: { kind: string; workspaceId?: string | null },
  client: Tx | typeof db = db,
): Promise<void> {
  await client.insert(mailOutbox).values({
    workspaceId: input.workspaceId ?? null,
    kind: input.kind,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html ?? null,
  });
}

/** Seconds to wait before the next try after `attempts` failures: 10 s doubling, at most 15 min. */
export function backoffSeconds(attempts: number): number {
  return Math.min(15 * 60, 10 * 2 ** Math.max(0, attempts - 1));
}

const batchSize = 20;

/**
 * Sends the due e-mails of the outbox. Rows are claimed with FOR UPDATE SKIP LOCKED, so several app instances (or a
 * kick beside the timer) never send one twice; a row is marked sent only after the server accepted it, else it is
 * retried later with backoff. Returns how many were sent.
 */
export async function deliverOutbox(
  transport: Pick<Mailer, "send"> = mailer(),
  now = new Date(),
): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  await db.transaction(async (tx) => {
    const due = await tx
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.status, "pending"), lte(mailOutbox.nextAttemptAt, now)))
      .orderBy(asc(mailOutbox.createdAt))
      .limit(batchSize)
      .for("update", { skipLocked: true });
    for (const row of due) {
      try {
        await transport.send({
          to: row.to,
          subject: row.subject,
          text: row.text,
          html: row.html ?? undefined,
        });
        await tx
          .update(mailOutbox)
          .set({ status: "sent", sentAt: new Date(), attempts: row.attempts + 1, text: "", html: null })
          .where(eq(mailOutbox.id, row.id));
        sent++;
      } catch (error) {
        const attempts = row.attempts + 1;
        await tx
          .update(mailOutbox)
          .set({
            attempts,
            lastError: errorCode(error),
            nextAttemptAt: new Date(now.getTime() + backoffSeconds(attempts) * 1000),
          })
          .where(eq(mailOutbox.id, row.id));
        failed++;
      }
    }
  });
  return { sent, failed };
}

/** What went wrong, as a code an admin can read: the socket's (ECONNREFUSED) or ours (unavailable:mail). */
function errorCode(error: unknown): string {
  const e = error as { code?: unknown; cause?: { code?: unknown } };
  if (typeof e?.cause?.code === "string") return e.cause.code;
  return typeof e?.code === "string" ? e.code : "send-failed";
}

let running: Promise<void> | null = null;
let again = false;

/**
 * Starts a delivery pass now, in the background (after a commit that enqueued mail). One pass runs at a time; a kick
 * during a pass asks for another after it, so mail queued meanwhile is not left for the timer.
 */
export function kickOutbox(): void {
  if (running) {
    again = true;
    return;
  }
  running = (async () => {
    do {
      again = false;
      const { sent, failed } = await deliverOutbox().catch((error) => {
        logError("mail outbox pass failed", error);
        return { sent: 0, failed: 0 };
      });
      if (sent + failed >= batchSize) again = true;
    } while (again);
  })().finally(() => {
    running = null;
  });
}

/**
 * Kicks a delivery pass and waits for it, at most `maxWaitMs`: a request that queued mail answers after the mail
 * was handed to the server when that is quick, and never waits long on a slow or dead one.
 */
export async function flushOutbox(maxWaitMs = 2000): Promise<void> {
  kickOutbox();
  await settledWithin(outboxIdle(), maxWaitMs, undefined);
}

/** Resolves when the background delivery pass (if any) has finished. */
export async function outboxIdle(): Promise<void> {
  await running;
}

/** The worker: a delivery pass every `intervalMs`, started once per server process by instrumentation. */
export function startOutboxWorker(intervalMs = 5000): void {
  const timer = setInterval(kickOutbox, intervalMs);
  timer.unref();
}

/** The workspace's recent e-mails and their state, for admins (never the body). */
export function listOutbox({ workspaceId, limit = 50 }: { workspaceId: string; limit?: number }) {
  return db
    .select({
      id: mailOutbox.id,
      kind: mailOutbox.kind,
      to: mailOutbox.to,
      subject: mailOutbox.subject,
      status: mailOutbox.status,
      attempts: mailOutbox.attempts,
      lastError: mailOutbox.lastError,
      nextAttemptAt: mailOutbox.nextAttemptAt,
      sentAt: mailOutbox.sentAt,
      createdAt: mailOutbox.createdAt,
    })
    .from(mailOutbox)
    .where(eq(mailOutbox.workspaceId, workspaceId))
    .orderBy(desc(mailOutbox.createdAt))
    .limit(limit);
}
