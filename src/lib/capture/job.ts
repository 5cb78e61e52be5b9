import "server-only";
import { createHash } from "node:crypto";
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { captures, projects } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { CAPTURE_QUEUE, GAVE_UP_QUEUE, jobQueue, RECHECK_QUEUE } from "@/lib/jobs/boss";
import { logError } from "@/lib/log";
import { notifyFailingEvidence } from "@/lib/projects/notify";
import { loadCandidates } from "@/lib/projects/projects";
import { powerFromVI } from "@/lib/soa/thermal-waveform";
import type { Storage } from "@/lib/storage";
import { parseCaptureStream } from "./parse-stream";
import { processCapture } from "./process";
import { computeCaptureResults, storeCaptureResults, storedResults } from "./results";
import { loadCaptureSamples, putSamples } from "./store";

// A capture's processing, as a job of the queue (src/lib/jobs/boss.ts): read the kept CSV from storage, parse it,
// compute power, the summary and the drawn trace once, store the samples, check it against every candidate with
// its junction-temperature trace, and write summary, trace and results in one transaction. A file that cannot be
// accepted fails at once; anything else (storage or database down, a worker killed) is retried a bounded number
// of times, and then the capture is marked failed. Every failure says what failed and where, for the page.

/** Which try of a job this is, as the queue counts them. */
export interface Attempt {
  retryCount: number;
  retryLimit: number;
}

const onlyTry: Attempt = { retryCount: 0, retryLimit: 0 };

/** The failure as the page says it: the step, and the error's own message when it is ours to show. */
function failureWords(error: unknown, step: string, attempt: Attempt, final: boolean): string {
  const what =
    error instanceof AppError
      ? error.message
      : `an unexpected error${typeof (error as { code?: unknown })?.code === "string" ? ` (${(error as { code: string }).code})` : ""}`;
  const tries = attempt.retryCount + 1;
  const outcome =
    error instanceof AppError && error.status < 500
      ? ""
      : final
        ? ` Gave up after ${tries} ${tries === 1 ? "try" : "tries"}.`
        : ` Try ${tries} of ${attempt.retryLimit + 1}; trying again shortly.`;
  return `Failed while ${step}: ${what}${/[.!?]$/.test(what) ? "" : "."}${outcome}`;
}

/**
 * Processes a queued capture (see above) and, unless `notify` is false (the demo seed), e-mails the project's owner
 * when it fails on a candidate. Answers what became of it; a capture already processed, failed or deleted is left
 * alone. A retryable failure before the last try rethrows (the queue retries it) after setting
 * the capture back to queued with the reason.
 */
export async function processCaptureJob(
  storage: Storage,
  captureId: string,
  { attempt = onlyTry, notify = true }: { attempt?: Attempt; notify?: boolean } = {},
): Promise<"done" | "failed" | "skipped"> {
  const [row] = await db
    .update(captures)
    .set({ status: "processing", attempts: sql`${captures.attempts} + 1` })
    .where(and(eq(captures.id, captureId), sql`${captures.status} in ('queued', 'processing')`))
    .returning();
  if (!row) return "skipped";
  let step = "reading the file from storage";
  try {
    const [project] = await db.select().from(projects).where(eq(projects.id, row.projectId));
    const head = await storage.head(row.objectKey);
    const stream = head ? await storage.stream(row.objectKey) : null;
    if (!head || !stream) {
      throw new AppError("invalid:upload-missing", "The file is no longer in storage. Upload it again.");
    }
    step = "reading the CSV";
    const hash = createHash("sha256");
    const parsed = await parseCaptureStream(stream, row.mapping, {
      sizeHint: head.size,
      onChunk: (chunk) => hash.update(chunk),
    });
    step = "computing power, energy and the equal-energy rectangle";
    const { p, summary, trace } = processCapture(parsed);
    step = "storing the samples";
    await putSamples(storage, row.samplesKey, parsed);
    step = "checking it against the candidates";
    const candidates = await loadCandidates(project.id);
    const results = await computeCaptureResults(project, candidates, { ...row, summary }, parsed, p);
    step = "saving the results";
    const saved = await db.transaction(async (tx) => {
      const [done] = await tx
        .update(captures)
        .set({
          status: "done",
          summary,
          trace,
          sha256: hash.digest("hex"),
          size: parsed.bytes,
          mapping: parsed.mapping,
          error: null,
          processedAt: new Date(),
        })
        .where(and(eq(captures.id, captureId), eq(captures.status, "processing")))
        .returning({ id: captures.id });
      if (done) await storeCaptureResults(tx, captureId, results);
      return Boolean(done);
    });
    // Deleted meanwhile: the samples just stored belong to nothing.
    if (!saved) {
      await storage
        .remove(row.samplesKey)
        .catch((error) => logError("capture samples of a deleted capture", error));
      return "skipped";
    }
    if (notify) {
      await notifyOwner(project, candidates, { ...row, summary }, results).catch((error) =>
        logError("capture notice", error),
      );
    }
    return "done";
  } catch (error) {
    const permanent = error instanceof AppError && error.status < 500;
    const final = permanent || attempt.retryCount >= attempt.retryLimit;
    if (!permanent) logError(`capture job (${step})`, error);
    await db
      .update(captures)
      .set({ status: final ? "failed" : "queued", error: failureWords(error, step, attempt, final) })
      .where(and(eq(captures.id, captureId), eq(captures.status, "processing")));
    if (final) return "failed";
    throw error;
  }
}

/** E-mails the project's owner if the capture fails, or has no data, on a candidate (once per capture). */
async function notifyOwner(
  project: Parameters<typeof notifyFailingEvidence>[0],
  candidates: Awaited<ReturnType<typeof loadCandidates>>,
  capture: { id: string; name: string; summary: NonNullable<(typeof captures.$inferSelect)["summary"]> },
  results: Awaited<ReturnType<typeof computeCaptureResults>>,
): Promise<number> {
  const rect = capture.summary.equivalent;
  const order = ["pass", "marginal", "fail", "no-data"] as const;
  let worst: (typeof order)[number] = "pass";
  for (const r of results) {
    const verdict = r.result?.verdict ?? "no-data";
    if (order.indexOf(verdict) > order.indexOf(worst)) worst = verdict;
  }
  return notifyFailingEvidence(
    project,
    {
      candidates: candidates.map((c) => ({
        partId: c.part.id,
        maker: c.part.maker,
        partNumber: c.part.partNumber,
      })),
      pulses: [
        {
          id: capture.id,
          source: "capture",
          name: capture.name,
          v: rect.ok ? rect.v : null,
          i: rect.ok ? rect.i : null,
          duration: rect.ok ? rect.duration : null,
        },
      ],
      results: Object.fromEntries(
        results.filter((r) => r.result).map((r) => [r.partId, { [capture.id]: r.result! }]),
      ),
      worstByPulse: { [capture.id]: worst },
    },
    [capture.id],
  );
}

/**
 * Recomputes a processed capture's results whose inputs changed since they were stored (see results.ts), from its
 * stored samples. Answers whether anything was recomputed.
 */
export async function recheckCapture(storage: Storage, captureId: string): Promise<boolean> {
  const [row] = await db.select().from(captures).where(eq(captures.id, captureId));
  if (row?.status !== "done" || !row.summary) return false;
  const [project] = await db.select().from(projects).where(eq(projects.id, row.projectId));
  const candidates = await loadCandidates(project.id);
  const stored = await storedResults(project, candidates, row);
  if ([...stored.values()].every((s) => s.current)) return false;
  const samples = await loadCaptureSamples(storage, row);
  const p = powerFromVI(samples.v, samples.i);
  const results = await computeCaptureResults(
    project,
    candidates,
    { ...row, summary: row.summary },
    samples,
    p,
  );
  await db.transaction(async (tx) => {
    const [still] = await tx
      .select({ id: captures.id })
      .from(captures)
      .where(eq(captures.id, captureId))
      .for("update");
    if (!still) return;
    await storeCaptureResults(tx, captureId, results);
    await tx.update(captures).set({ error: null }).where(eq(captures.id, captureId));
  });
  return true;
}

/** Said on a capture whose job failed for good without saying why (its worker died on every try). */
export const GAVE_UP_WORDS =
  "Processing stopped without finishing on every try (the worker was stopped or ran out of time or memory). Upload the file again; if it fails again, the server's log says more.";
/** Said on a processed capture whose results could not be recomputed after a change. */
export const RECHECK_GAVE_UP_WORDS =
  "Its results could not be recomputed after the last change (the worker stopped on every try); they are not shown as current.";

/**
 * A capture job that the queue gave up on (GAVE_UP_QUEUE): a capture still waiting is marked failed, a processed one
 * whose recheck gave up says so, unless a handler already said why. Safe to run twice.
 */
export async function captureGaveUp(captureId: string): Promise<void> {
  await db
    .update(captures)
    .set({ status: "failed", error: GAVE_UP_WORDS })
    .where(and(eq(captures.id, captureId), inArray(captures.status, ["queued", "processing"])));
  await db
    .update(captures)
    .set({ error: RECHECK_GAVE_UP_WORDS })
    .where(and(eq(captures.id, captureId), eq(captures.status, "done"), isNull(captures.error)));
}

/** Queues a registered capture's processing; answers the job's id. */
export async function queueCapture(captureId: string): Promise<string | null> {
  return (await jobQueue()).send(CAPTURE_QUEUE, { captureId });
}

/** Queues rechecks of captures with stale results, in the background (one waiting per capture at most). */
export function queueRechecks(captureIds: string[]): void {
  if (!captureIds.length) return;
  void (async () => {
    const boss = await jobQueue();
    for (const captureId of captureIds)
      await boss.send(RECHECK_QUEUE, { captureId }, { singletonKey: captureId });
  })().catch((error) => logError("queueing capture rechecks", error));
}

/**
 * Starts `concurrency` workers of each capture queue in this process (instrumentation calls it, unless
 * JOB_WORKERS=0). Workers in other processes or machines share the queues.
 */
export async function startCaptureWorkers(storage: () => Storage, concurrency: number): Promise<void> {
  if (concurrency < 1) return;
  const boss = await jobQueue();
  const options = { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 0.5 } as const;
  await boss.work<{ captureId: string }>(GAVE_UP_QUEUE, options, async ([job]) => {
    await captureGaveUp(job.data.captureId);
  });
  for (let k = 0; k < concurrency; k++) {
    await boss.work<{ captureId: string }>(CAPTURE_QUEUE, options, async ([job]) => {
      await processCaptureJob(storage(), job.data.captureId, { attempt: job });
    });
    await boss.work<{ captureId: string }>(RECHECK_QUEUE, options, async ([job]) => {
      try {
        await recheckCapture(storage(), job.data.captureId);
      } catch (error) {
        // After the last try, the capture says so: its page stops waiting and shows why.
        if (job.retryCount >= job.retryLimit) {
          await db
            .update(captures)
            .set({ error: failureWords(error, "recomputing its results", job, true) })
            .where(eq(captures.id, job.data.captureId));
        }
        throw error;
      }
    });
  }
}
