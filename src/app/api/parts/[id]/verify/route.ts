import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getActiveCurveSet } from "@/db/queries/parts";
import { type FindingAcceptance, parts } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { findingKey, unaccepted, verifySchema } from "@/lib/library/acceptance";
import { loadPart } from "@/lib/library/parts";

/**
 * POST /api/parts/:id/verify { acceptances: [{ key, reason }] }: a lead confirms the part against its datasheet.
 * Every open finding of the active curve set must be accepted with a reason; who, when and the reasons are kept.
 */
export const POST = route<{ id: string }>({ action: "part.verify" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const { acceptances } = await parseBody(req, verifySchema);
  const active = await getActiveCurveSet({ partId: part.id });
  if (!active) {
    throw new AppError("conflict:no-curves", "Upload the part's SOA curves before verifying it.");
  }
  const findings = active.findings;
  const open = unaccepted(findings, acceptances);
  if (open.length > 0) {
    throw new AppError(
      "conflict:open-findings",
      `${open.length} open ${open.length === 1 ? "finding needs" : "findings need"} a reason to be accepted before the part can be verified.`,
      { details: { open: open.map(findingKey) } },
    );
  }
  const reasons = new Map(acceptances.map((a) => [a.key, a.reason.trim()]));
  const accepted: FindingAcceptance[] = findings.map((f) => ({
    key: findingKey(f),
    message: f.message,
    reason: reasons.get(findingKey(f)) ?? "",
  }));
  const verifiedAt = new Date();
  await db.transaction(async (tx) => {
    await tx
      .update(parts)
      .set({ status: "verified", verifiedBy: caller.user.id, verifiedAt, acceptedFindings: accepted })
      .where(eq(parts.id, part.id));
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "part.verified",
        subjectType: "part",
        subjectId: part.id,
        details: { curveSetId: active.id, acceptedFindings: accepted },
      },
      tx,
    );
  });
  return json({ status: "verified", verifiedBy: caller.user.name, verifiedAt, acceptedFindings: accepted });
});
