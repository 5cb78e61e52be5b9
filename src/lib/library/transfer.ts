import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { type Part, parts, type TransferRow } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { csvIssue } from "@/lib/csv/issues";
import { parseTransferCsv } from "@/lib/csv/transfer";
import { CsvRejected } from "./curve-upload";
import { noticePartChange } from "./part-changed";
import { draftFields } from "./part-findings";
import { reviewTransfer, type TransferFinding } from "./transfer-findings";

/**
 * Reads transfer characteristics from the text typed, pasted or read from a file (the same rules either way),
 * refuses unreadable cells and blocking findings with their rows, and stores the two curves with their source;
 * the part returns to draft (its verifier is told), as for any change the checks depend on.
 */
export async function setTransfer(
  caller: MemberCaller,
  part: Part,
  input: { text: string; fileName?: string },
): Promise<{ part: Part; findings: TransferFinding[] }> {
  const parsed = parseTransferCsv(input.text);
  if (!parsed.ok) throw new CsvRejected(parsed.errors);
  const review = reviewTransfer(parsed.curves);
  if (!review.data) {
    throw new CsvRejected(
      review.findings.filter((f) => f.severity === "error").map((f) => csvIssue(f.row, null, f.message)),
    );
  }
  const transfer: TransferRow = {
    ...review.data,
    source: input.fileName ? { kind: "uploaded", fileName: input.fileName } : { kind: "typed" },
  };
  const updated = await writeTransfer(caller, part, transfer, review.findings.length);
  return { part: updated, findings: review.findings };
}

/** Removes the part's transfer characteristics (its stability checks then say nothing). */
export function clearTransfer(caller: MemberCaller, part: Part): Promise<Part> {
  return writeTransfer(caller, part, null, 0);
}

async function writeTransfer(
  caller: MemberCaller,
  part: Part,
  transfer: TransferRow | null,
  warnings: number,
) {
  const updated = await db.transaction(async (tx) => {
    const [updated] = await tx
      .update(parts)
      .set({ transfer, ...draftFields, updatedAt: new Date() })
      .where(eq(parts.id, part.id))
      .returning();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "part.transfer-changed",
        subjectType: "part",
        subjectId: part.id,
        details: transfer
          ? { temps: transfer.temps, points: transfer.curves.map((c) => c.length), warnings }
          : { removed: true },
      },
      tx,
    );
    return updated;
  });
  await noticePartChange(part, "transfer characteristics changed", caller.user.name);
  return updated;
}
