import "server-only";
import { createHash } from "node:crypto";
import { and, eq, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { noticeRecipients } from "@/db/queries/members";
import { type Decision, decisions, notices, type Part, projects } from "@/db/schema";
import { env } from "@/lib/env";
import { dateText } from "@/lib/format";
import { logError } from "@/lib/log";
import { enqueueMail, flushOutbox } from "@/lib/mail/outbox";
import { decisionDriftMail } from "@/lib/mail/templates";
import { verdictWords } from "@/lib/vocabulary";
import { computeDrift, type DecisionSnapshot, type DriftItem, snapshotNow } from "./decisions";

/** The verdicts of the changed part that a decision rested on and that differ now. */
export function changedVerdicts(
  frozen: DecisionSnapshot,
  now: DecisionSnapshot,
  partId: string,
): DriftItem[] {
  return computeDrift(frozen, now).results.filter(
    (r) => r.partId === partId && r.frozen !== null && r.now !== null && r.now.verdict !== r.frozen.verdict,
  );
}

/** Which drift this is: the same verdicts changed the same way are one change, noticed once. */
export function driftFingerprint(items: DriftItem[]): string {
  const key = items.map((i) => `${i.partId}/${i.pulseId}:${i.now?.verdict ?? "-"}`).sort();
  return createHash("sha256").update(key.join("\n")).digest("hex");
}

/**
 * After a library change to a part (a curve set uploaded or made active, its ratings, thermal model or transfer
 * characteristics changed), checks every standing decision of the workspace that had the part among its candidates
 * again. When verdicts the decision rested on changed, the project's owner and the lead who signed are e-mailed
 * once for this change (one e-mail each, listing every changed verdict, linking to the decision), through the
 * outbox. Only current members who have not turned these notices off are told. Runs after the change is committed
 * and never undoes it: a failure here is logged. Returns how many e-mails were queued.
 */
export async function notifyDecisionDrift(
  part: Pick<Part, "id" | "workspaceId">,
  change: string,
  actorName: string,
): Promise<number> {
  let queued = 0;
  try {
    const standing = await db
      .select()
      .from(decisions)
      .where(
        and(
          eq(decisions.workspaceId, part.workspaceId),
          isNull(decisions.supersededBy),
          sql`${decisions.snapshot} -> 'candidates' @> ${JSON.stringify([{ partId: part.id }])}::jsonb`,
        ),
      );
    for (const decision of standing) {
      queued += await noticeOne(decision, part.id, change, actorName).catch((error: unknown) => {
        logError("decision drift notice failed", error);
        return 0;
      });
    }
  } catch (error) {
    logError("decision drift notice failed", error);
  }
  if (queued) await flushOutbox();
  return queued;
}

async function noticeOne(
  decision: Decision,
  partId: string,
  change: string,
  actorName: string,
): Promise<number> {
  const [project] = await db
    .select()
    .from(projects)
    .where(and(eq(projects.id, decision.projectId), isNull(projects.archivedAt)));
  if (!project) return 0;
  const frozen = decision.snapshot;
  const items = changedVerdicts(frozen, await snapshotNow(project), partId);
  if (items.length === 0) return 0;
  const recipientIds = [...new Set([project.ownerId, decision.signedBy].filter((id): id is string => !!id))];
  if (recipientIds.length === 0) return 0;
  const recipients = await noticeRecipients({
    workspaceId: decision.workspaceId,
    userIds: recipientIds,
    notice: "decisionDrift",
  });
  if (recipients.length === 0) return 0;
  const link = `${env().APP_URL}/projects/${project.id}/decisions/${decision.id}#drift`;
  const changes = items.map((i) => ({
    label: i.label,
    frozen: verdictWords[i.frozen!.verdict],
    now: verdictWords[i.now!.verdict],
  }));
  return db.transaction(async (tx) => {
    const [notice] = await tx
      .insert(notices)
      .values({
        workspaceId: decision.workspaceId,
        subjectType: "decision-drift",
        subjectId: decision.id,
        fingerprint: driftFingerprint(items),
      })
      .onConflictDoNothing()
      .returning({ id: notices.id });
    if (!notice) return 0;
    for (const recipient of recipients) {
      const owns = recipient.id === project.ownerId;
      const signed = recipient.id === decision.signedBy;
      await enqueueMail(
        decisionDriftMail({
          to: recipient.email,
          projectName: project.name,
          chosenLabel: decision.chosenLabel,
          signedByName: decision.signedByName,
          signedAt: dateText(decision.signedAt, true),
          change,
          actorName,
          changes,
          link,
          why:
            owns && signed
              ? "you own the project and signed its decision"
              : owns
                ? "you own the project"
                : "you signed the decision",
        }),
        { kind: "decision-drift", workspaceId: decision.workspaceId },
        tx,
      );
    }
    return recipients.length;
  });
}
