import "server-only";
import { createHash } from "node:crypto";
import { and, eq, lt, ne } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { curveSets, curves, type Part, parts, pendingUploads } from "@/db/schema";
import { type CsvIssue, digitisedCurveSet, parseCurveSetCsv } from "@/lib/csv/curve-set";
import { MAX_CSV_BYTES, overLimit } from "@/lib/csv/limits";
import { AppError } from "@/lib/errors";
import { dateText } from "@/lib/format";
import { logError } from "@/lib/log";
import { findCurveSetIssues } from "@/lib/soa/findings";
import type { Storage } from "@/lib/storage";
import { isUuid } from "@/lib/uuid";
import { noticePartChange } from "./part-changed";
import { draftFields, findingPart } from "./part-findings";

/** An upload not registered within this time is removed by the cleanup step. */
export const staleUploadMs = 60 * 60 * 1000;

export interface UploadTicket {
  uploadId: string;
  objectKey: string;
  url: string;
}

/** Reserves an object key for a browser upload and returns a presigned PUT URL for it. */
export async function presignUpload(
  storage: Storage,
  input: {
    workspaceId: string;
    userId: string;
    /** Where the object lives under the workspace, e.g. `parts/<id>` or `projects/<id>`. */
    owner: string;
    fileName: string;
    size: number;
    purpose: string;
    maxBytes?: number;
  },
): Promise<UploadTicket> {
  const maxBytes = input.maxBytes ?? MAX_CSV_BYTES;
  if (input.size > maxBytes) {
    throw new AppError("too_large:file", `The file is ${overLimit(input.size, maxBytes)}.`);
  }
  if (!/\.(csv|txt|tsv)$/i.test(input.fileName)) {
    throw new AppError("invalid:file-type", "Upload a CSV text file (.csv, .tsv or .txt).");
  }
  await cleanupStaleUploads(storage).catch((error) => logError("upload cleanup failed", error));
  const objectKey = `${input.workspaceId}/${input.owner}/${input.purpose}/${crypto.randomUUID()}.csv`;
  const url = await storage.presignPut(objectKey, { contentType: "text/csv", contentLength: input.size });
  const [row] = await db
    .insert(pendingUploads)
    .values({
      workspaceId: input.workspaceId,
      userId: input.userId,
      objectKey,
      fileName: input.fileName.slice(0, 200),
      purpose: input.purpose,
    })
    .returning({ id: pendingUploads.id });
  return { uploadId: row.id, objectKey, url };
}

/** A pending upload of the workspace for this purpose, or a 404. */
export async function getPendingUpload(input: { workspaceId: string; uploadId: string; purpose: string }) {
  const [row] = isUuid(input.uploadId)
    ? await db
        .select()
        .from(pendingUploads)
        .where(
          and(
            eq(pendingUploads.id, input.uploadId),
            eq(pendingUploads.workspaceId, input.workspaceId),
            eq(pendingUploads.purpose, input.purpose),
          ),
        )
    : [];
  if (!row) throw new AppError("not_found:upload", "No such upload. Upload the file again.");
  return row;
}

/**
 * After a failed registration: claims the pending row and deletes its object in one transaction. Only the request
 * that claims the row touches the object, and a registered row is written in the transaction that deletes the
 * pending one, so an object a committed row points to is never deleted. If storage cannot be reached, the row
 * stays, so the cleanup step removes the object later: nothing is left behind for good.
 */
export async function discardUpload(
  storage: Storage,
  upload: { id: string; objectKey: string },
): Promise<void> {
  await db
    .transaction(async (tx) => {
      const [claimed] = await tx
        .delete(pendingUploads)
        .where(eq(pendingUploads.id, upload.id))
        .returning({ id: pendingUploads.id });
      if (claimed) await storage.remove(upload.objectKey);
    })
    .catch(() => {});
}

/**
 * Marks a pending upload registered inside the transaction that registers it. The row lock makes a second
 * registration of the same upload wait for the first and then find nothing: it answers 409 and leaves the objects
 * alone. The row itself stays until the uploaded object is removed (after commit, or by the cleanup step).
 */
export async function claimPendingUpload(tx: Tx, uploadId: string): Promise<void> {
  const [claimed] = await tx
    .update(pendingUploads)
    .set({ purpose: "registered" })
    .where(and(eq(pendingUploads.id, uploadId), ne(pendingUploads.purpose, "registered")))
    .returning({ id: pendingUploads.id });
  if (!claimed) throw new UploadAlreadyRegistered();
}

/** The upload was registered (or discarded) by another request: its object belongs to that request now. */
export class UploadAlreadyRegistered extends AppError {
  constructor() {
    super("conflict:upload", "This upload is already registered.");
  }
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Reads an uploaded text file back from storage, within the size limit. */
export async function readUploadedText(
  storage: Storage,
  objectKey: string,
): Promise<{ text: string; bytes: Buffer }> {
  const head = await storage.head(objectKey);
  if (!head) throw new AppError("invalid:upload-missing", "The file did not reach storage. Upload it again.");
  if (head.size > MAX_CSV_BYTES) {
    await storage.remove(objectKey);
    throw new AppError("too_large:file", `The file is ${overLimit(head.size)}.`);
  }
  const bytes = await storage.get(objectKey);
  if (!bytes)
    throw new AppError("invalid:upload-missing", "The file did not reach storage. Upload it again.");
  return { text: new TextDecoder("utf-8").decode(bytes), bytes };
}

export class CsvRejected extends AppError {
  constructor(readonly issues: CsvIssue[]) {
    super("invalid:csv", `The file was not accepted: ${issues[0]?.message ?? "unreadable"}`, {
      details: { issues },
    });
  }
}

/**
 * Parses, checks and stores a curve set from an object already in storage: curves, findings, object key, name,
 * size and SHA-256 in one transaction, the new set active and the part back to draft. A rejected file or a failed
 * transaction deletes the object, so a file in storage and its row are always both there or both gone. The set
 * points to a copy of the parsed bytes that no URL can overwrite. The same upload registered twice at once: one
 * wins, the other answers 409 and deletes nothing the winner uses.
 */
export async function registerCurveSet(
  storage: Storage,
  input: {
    part: Part;
    userId: string;
    userName: string;
    upload: { id: string; objectKey: string; fileName: string };
    refCaseTemp?: number;
  },
) {
  const { upload } = input;
  let kept: { id: string; objectKey: string } | null = null;
  try {
    const { text, bytes } = await readUploadedText(storage, upload.objectKey);
    const parsed = parseCurveSetCsv(text);
    if (!parsed.ok) throw new CsvRejected(parsed.errors);
    const sha256 = createHash("sha256").update(bytes).digest("hex");
    const refCaseTemp = input.refCaseTemp ?? 25;
    const [same] = await db
      .select({ id: curveSets.id, fileName: curveSets.fileName, createdAt: curveSets.createdAt })
      .from(curveSets)
      .where(
        and(
          eq(curveSets.partId, input.part.id),
          eq(curveSets.sha256, sha256),
          eq(curveSets.refCaseTemp, refCaseTemp),
        ),
      );
    if (same) {
      throw new AppError(
        "conflict:same-curve-set",
        `This file matches the revision ${same.fileName} uploaded on ${dateText(same.createdAt)}, ` +
          "byte for byte: nothing was added. Activate that revision under Curve-set revisions if it is not the active one.",
        { details: { curveSetId: same.id } },
      );
    }
    const findings = findCurveSetIssues(
      { ...digitisedCurveSet(parsed.curves), refCaseTemp },
      findingPart(input.part),
    );
    kept = await keepCopy(
      storage,
      { ...upload, workspaceId: input.part.workspaceId, userId: input.userId },
      bytes,
    );
    const { id: keptId, objectKey: keptKey } = kept;
    const set = await db.transaction(async (tx) => {
      await claimPendingUpload(tx, upload.id);
      await tx.delete(pendingUploads).where(eq(pendingUploads.id, keptId));
      await tx.update(curveSets).set({ active: false }).where(eq(curveSets.partId, input.part.id));
      const [row] = await tx
        .insert(curveSets)
        .values({
          workspaceId: input.part.workspaceId,
          partId: input.part.id,
          objectKey: keptKey,
          fileName: upload.fileName,
          size: bytes.length,
          sha256,
          shape: parsed.shape,
          refCaseTemp,
          active: true,
          findings,
          uploadedBy: input.userId,
        })
        .returning();
      await tx.insert(curves).values(
        parsed.curves.map((c, position) => ({
          curveSetId: row.id,
          position,
          duration: c.duration === "DC" ? null : c.duration,
          points: c.points,
        })),
      );
      await tx
        .update(parts)
        .set({ ...draftFields, updatedAt: new Date() })
        .where(eq(parts.id, input.part.id));
      await recordAudit(
        {
          workspaceId: input.part.workspaceId,
          actorId: input.userId,
          action: "curve-set.uploaded",
          subjectType: "part",
          subjectId: input.part.id,
          details: { curveSetId: row.id, fileName: upload.fileName, curves: parsed.curves.length },
        },
        tx,
      );
      return row;
    });
    await noticePartChange(input.part, `new curve set ${upload.fileName}`, input.userName);
    // The presigned object is no longer needed; if storage fails here, the cleanup step removes it later.
    await discardUpload(storage, upload);
    return { curveSet: set, curves: parsed.curves.length, findings, warnings: parsed.warnings };
  } catch (error) {
    if (kept) await discardUpload(storage, kept);
    if (!(error instanceof UploadAlreadyRegistered)) await discardUpload(storage, upload);
    throw error;
  }
}

/**
 * Stores the bytes that were parsed and hashed under a key of their own, one no presigned URL was ever issued for:
 * a PUT to the upload's URL after registration changes nothing the curve set points to. A pending row is written
 * first, so a failure anywhere leaves nothing behind for good.
 */
async function keepCopy(
  storage: Storage,
  upload: { objectKey: string; fileName: string; workspaceId: string; userId: string },
  bytes: Buffer,
): Promise<{ id: string; objectKey: string }> {
  const objectKey = `${upload.objectKey.replace(/\/[^/]+$/, "")}/kept-${crypto.randomUUID()}.csv`;
  const [row] = await db
    .insert(pendingUploads)
    .values({
      workspaceId: upload.workspaceId,
      userId: upload.userId,
      objectKey,
      fileName: upload.fileName,
      purpose: "kept-copy",
    })
    .returning({ id: pendingUploads.id });
  const reserved = { id: row.id, objectKey };
  try {
    await storage.put(objectKey, bytes, { contentType: "text/csv", contentLength: bytes.length });
  } catch (error) {
    await discardUpload(storage, reserved);
    throw error;
  }
  return reserved;
}

/** Removes objects whose upload was presigned but never registered (the browser left, or the parse failed). */
export async function cleanupStaleUploads(storage: Storage, olderThanMs = staleUploadMs): Promise<number> {
  const stale = await db
    .select()
    .from(pendingUploads)
    .where(lt(pendingUploads.createdAt, new Date(Date.now() - olderThanMs)));
  for (const upload of stale) await discardUpload(storage, upload);
  return stale.length;
}
