import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import type { db } from "@/db";
import { noticeRecipients } from "@/db/queries/members";
import { curveSets, curves, type Part } from "@/db/schema";
import { env } from "@/lib/env";
import { enqueueMail, flushOutbox } from "@/lib/mail/outbox";
import { verificationLapsedMail } from "@/lib/mail/templates";
import { findCurveSetIssues, ORDER_FINDING_KINDS } from "@/lib/soa/findings";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** The part data the findings depend on (ratings and thermal model). */
export function findingPart(part: Pick<Part, "tjMax" | "foster" | "rthJc">) {
  return { tjMax: part.tjMax, foster: part.foster ?? undefined, rthJc: part.rthJc };
}

/**
 * Finds every curve set's findings again for the part as it now is, after its ratings or thermal model changed:
 * the kinds that need the points in digitised order are kept as stored at upload, the others are found again
 * from the stored curves. Runs in the caller's transaction so the findings never disagree with the part.
 */
export async function refreshFindings(tx: Tx, part: Pick<Part, "id" | "tjMax" | "foster" | "rthJc">) {
  const sets = await tx
    .select({ id: curveSets.id, refCaseTemp: curveSets.refCaseTemp, findings: curveSets.findings })
    .from(curveSets)
    .where(eq(curveSets.partId, part.id));
  if (sets.length === 0) return;
  const rows = await tx
    .select({ curveSetId: curves.curveSetId, duration: curves.duration, points: curves.points })
    .from(curves)
    .where(
      inArray(
        curves.curveSetId,
        sets.map((s) => s.id),
      ),
    )
    .orderBy(asc(curves.position));
  for (const set of sets) {
    const kept = set.findings.filter((f) => ORDER_FINDING_KINDS.includes(f.kind));
    const found = findCurveSetIssues(
      {
        refCaseTemp: set.refCaseTemp,
        curves: rows
          .filter((r) => r.curveSetId === set.id)
          .map((r) => ({ duration: r.duration ?? ("DC" as const), points: r.points })),
      },
      findingPart(part),
    ).filter((f) => !ORDER_FINDING_KINDS.includes(f.kind));
    await tx
      .update(curveSets)
      .set({ findings: [...kept, ...found] })
      .where(eq(curveSets.id, set.id));
  }
}

/** The fields that return a part to draft: the verification, its verifier and its accepted findings are gone. */
export const draftFields = {
  status: "draft" as const,
  verifiedBy: null,
  verifiedAt: null,
  acceptedFindings: [],
};

/**
 * E-mails the lead who verified the part that the verification lapsed, and why, through the outbox: queued after
 * the change is committed and sent (or retried while mail is down); it never undoes the change.
 */
export async function noticeLapsedVerification(
  part: Pick<Part, "id" | "workspaceId" | "partNumber" | "maker" | "status" | "verifiedBy">,
  change: string,
  actorName: string,
): Promise<boolean> {
  if (part.status !== "verified" || !part.verifiedBy) return false;
  // Only a current member who has not turned these notices off is told.
  const [verifier] = await noticeRecipients({
    workspaceId: part.workspaceId,
    userIds: [part.verifiedBy],
    notice: "verificationLapsed",
  });
  if (!verifier) return false;
  await enqueueMail(
    verificationLapsedMail({
      to: verifier.email,
      part: `${part.maker} ${part.partNumber}`,
      change,
      actorName,
      link: `${env().APP_URL}/library/${part.id}`,
    }),
    { kind: "verification-lapsed", workspaceId: part.workspaceId },
  );
  await flushOutbox();
  return true;
}
