import "server-only";
import { Readable } from "node:stream";
import { desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { type Capture, captures, type Project, pendingUploads } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { discardUpload } from "@/lib/library/curve-upload";
import type { ProjectPulse } from "@/lib/projects/evaluate";
import { loadProjectRow } from "@/lib/projects/projects";
import type { RecordStart, WaveformPulse } from "@/lib/soa/types";
import type { Storage } from "@/lib/storage";
import { type CaptureMapping, MAX_CAPTURE_BYTES } from "./parse";
import type { CaptureSamples } from "./parse-stream";
import { decodeSamplesStream, encodeSamplesParts } from "./samples-binary";

// A capture lives in four places: the uploaded CSV and its parsed samples (binary) in object storage, its row, and
// its results per candidate (capture_results, src/lib/capture/results.ts).
// Every object is written or removed with a row in pending_uploads standing for it until the capture row is
// committed (or, on deletion, until the object is gone): whatever fails, storage and rows end consistent, at the
// latest after the stale-upload cleanup (src/lib/library/curve-upload.ts) has run.

/** Where a capture's binary samples are stored: beside its CSV. */
export function samplesKeyOf(objectKey: string): string {
  return `${objectKey.replace(/\.csv$/i, "")}.samples.f64`;
}

/** The columns a list or a result shows; the drawn trace and the mapping stay out. */
const listed = {
  id: captures.id,
  projectId: captures.projectId,
  name: captures.name,
  fileName: captures.fileName,
  size: captures.size,
  summary: captures.summary,
  status: captures.status,
  error: captures.error,
  attempts: captures.attempts,
  start: captures.start,
  note: captures.note,
  boardSerial: captures.boardSerial,
  probe: captures.probe,
  createdBy: captures.createdBy,
  createdAt: captures.createdAt,
};

/**
 * Registers an uploaded capture CSV for processing: copies it to a key of its own (one no presigned URL was issued
 * for, so a later PUT to the upload's URL changes nothing the capture points to), checks that it is there and not
 * too large, and in one transaction inserts the capture row as `queued` (owning its CSV's key and the key its
 * samples will be stored under), records the audit event and retires the pending rows; the presigned object is
 * removed after commit. Parsing, the samples and the checks are the job's (src/lib/capture/job.ts). Any failure
 * removes the copy, the upload and the pending rows (the cleanup step finishes the job if storage is down).
 */
export async function registerCapture(
  storage: Storage,
  input: {
    project: Project;
    caller: Pick<MemberCaller, "workspaceId" | "user">;
    upload: { id: string; objectKey: string; fileName: string };
    name: string;
    mapping: CaptureMapping;
    /** What came before the record (METHODS.md §6); absent: the engine decides from the data. */
    start?: RecordStart | null;
    note?: string;
    boardSerial?: string;
    probe?: string;
  },
): Promise<Capture> {
  const { project, caller, upload } = input;
  if (!upload.objectKey.startsWith(`${project.workspaceId}/projects/${project.id}/`)) {
    throw new AppError("not_found:upload", "No such upload for this project. Upload the file again.");
  }
  const samplesKey = samplesKeyOf(upload.objectKey);
  const [reserved] = await db
    .insert(pendingUploads)
    .values({
      workspaceId: project.workspaceId,
      userId: caller.user.id,
      objectKey: samplesKey,
      fileName: upload.fileName,
      purpose: "capture-samples",
    })
    .onConflictDoNothing()
    .returning({ id: pendingUploads.id });
  if (!reserved) throw new AppError("conflict:capture", "This upload is already being registered.");
  const keptKey = `${upload.objectKey.replace(/\/[^/]+$/, "")}/kept-${crypto.randomUUID()}.csv`;
  const [kept] = await db
    .insert(pendingUploads)
    .values({
      workspaceId: project.workspaceId,
      userId: caller.user.id,
      objectKey: keptKey,
      fileName: upload.fileName,
      purpose: "kept-copy",
    })
    .returning({ id: pendingUploads.id });
  try {
    const original = await storage.head(upload.objectKey);
    if (original) await storage.copy(upload.objectKey, keptKey);
    const head = original ? await storage.head(keptKey) : null;
    if (!head)
      throw new AppError("invalid:upload-missing", "The file did not reach storage. Upload it again.");
    if (head.size > MAX_CAPTURE_BYTES) {
      throw new AppError("too_large:file", `The file is larger than ${MAX_CAPTURE_BYTES / 1e6} MB.`);
    }
    const capture = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(captures)
        .values({
          projectId: project.id,
          name: input.name,
          objectKey: keptKey,
          samplesKey,
          fileName: upload.fileName,
          size: head.size,
          mapping: input.mapping,
          status: "queued",
          start: input.start ?? null,
          note: input.note ?? null,
          boardSerial: input.boardSerial ?? null,
          probe: input.probe ?? null,
          createdBy: caller.user.id,
        })
        .returning();
      await recordAudit(
        {
          workspaceId: project.workspaceId,
          actorId: caller.user.id,
          action: "capture.added",
          subjectType: "project",
          subjectId: project.id,
          details: { captureId: row.id, name: row.name, fileName: row.fileName, size: head.size },
        },
        tx,
      );
      await tx.delete(pendingUploads).where(inArray(pendingUploads.id, [kept.id, reserved.id]));
      return row;
    });
    await discardUpload(storage, upload);
    return capture;
  } catch (error) {
    await discardUpload(storage, { id: reserved.id, objectKey: samplesKey });
    await discardUpload(storage, { id: kept.id, objectKey: keptKey });
    await discardUpload(storage, upload);
    throw error;
  }
}

/** A capture whose job could not be queued: failed, saying so (its row and objects stay until it is deleted). */
export async function markUnqueued(captureId: string): Promise<void> {
  await db
    .update(captures)
    .set({
      status: "failed",
      error: "Failed while queueing it for processing: the job queue could not be reached.",
    })
    .where(eq(captures.id, captureId));
}

/** Stores parsed samples as the capture's binary object, streamed from the samples' own memory. */
export async function putSamples(
  storage: Storage,
  samplesKey: string,
  samples: CaptureSamples,
): Promise<void> {
  const parts = encodeSamplesParts(samples);
  await storage.put(
    samplesKey,
    Readable.from(parts.map((part) => Buffer.from(part.buffer, part.byteOffset, part.byteLength))),
    {
      contentType: "application/octet-stream",
      contentLength: parts.reduce((sum, part) => sum + part.byteLength, 0),
    },
  );
}

/** The project's capture, or a 404. */
export async function getCapture(input: { projectId: string; captureId: string }): Promise<Capture> {
  return loadProjectRow(captures, input.projectId, input.captureId);
}

/** The project's captures, newest first, without their traces. */
export function listCaptures(projectId: string) {
  return db
    .select(listed)
    .from(captures)
    .where(eq(captures.projectId, projectId))
    .orderBy(desc(captures.createdAt));
}

/** The samples a capture was parsed into, as stored (streamed into one buffer). */
export async function loadCaptureSamples(
  storage: Storage,
  capture: Pick<Capture, "id" | "samplesKey">,
): Promise<CaptureSamples> {
  const unreadable = (cause: unknown) =>
    new AppError("internal:capture-samples", "The capture's samples could not be read from storage.", {
      cause,
    });
  const stream = await storage.stream(capture.samplesKey);
  if (!stream) throw unreadable(`no object ${capture.samplesKey} for capture ${capture.id}`);
  try {
    return await decodeSamplesStream(stream);
  } catch (error) {
    throw error instanceof RangeError ? unreadable(error) : error;
  }
}

/**
 * Deletes a capture's row, then its two objects. The objects are entered in pending_uploads (dated long ago) in
 * the same transaction, so that if storage fails now the next cleanup removes them.
 */
export async function deleteCapture(
  storage: Storage,
  input: { capture: Capture; caller: Pick<MemberCaller, "workspaceId" | "user"> },
): Promise<void> {
  const { capture, caller } = input;
  const doomed = await db.transaction(async (tx) => {
    await tx.delete(captures).where(eq(captures.id, capture.id));
    const rows = await tx
      .insert(pendingUploads)
      .values(
        [capture.objectKey, capture.samplesKey].map((objectKey) => ({
          workspaceId: caller.workspaceId,
          userId: caller.user.id,
          objectKey,
          fileName: capture.fileName,
          purpose: "capture-deleted",
          createdAt: new Date(0),
        })),
      )
      .returning({ id: pendingUploads.id, objectKey: pendingUploads.objectKey });
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "capture.deleted",
        subjectType: "project",
        subjectId: capture.projectId,
        details: { captureId: capture.id, name: capture.name, fileName: capture.fileName },
      },
      tx,
    );
    return rows;
  });
  for (const row of doomed) await discardUpload(storage, row);
}

/**
 * A processed capture as a pulse of its project's check, drawn at its equal-energy rectangle; the samples are
 * loaded only when the check needs them, and null when only stored results are to be used.
 */
export function capturePulse(
  project: Project,
  capture: Pick<Capture, "id" | "name" | "start"> & { summary: NonNullable<Capture["summary"]> },
  samples: CaptureSamples | (() => Promise<CaptureSamples>) | null,
): ProjectPulse {
  const rect = capture.summary.equivalent;
  // The engine walks any array-like; WaveformPulse names number[] for the JSON contract.
  const asPulse = (s: CaptureSamples) =>
    ({
      id: capture.id,
      kind: "waveform",
      ...s,
      ...(capture.start === null ? {} : { start: capture.start }),
    }) as unknown as WaveformPulse;
  return {
    id: capture.id,
    source: "capture",
    name: capture.name,
    caseTemp: project.caseTemp,
    v: rect.ok ? rect.v : null,
    i: rect.ok ? rect.i : null,
    duration: rect.ok ? rect.duration : null,
    kind: "waveform",
    pulse:
      samples === null
        ? null
        : typeof samples === "function"
          ? async () => asPulse(await samples())
          : asPulse(samples),
  };
}
