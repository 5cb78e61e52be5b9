import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getActiveCurveSet } from "@/db/queries/parts";
import { parts } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";
import { loadPart } from "@/lib/library/parts";

/** POST /api/parts/:id/verify: a lead confirms the part against its datasheet (who and when are kept). */
export const POST = route<{ id: string }>({ action: "part.verify" }, async (_req, caller, { id }) => {
  const part = await loadPart(caller, id);
  if (!(await getActiveCurveSet({ partId: part.id }))) {
    throw new AppError("conflict:no-curves", "Upload the part's SOA curves before verifying it.");
  }
  const verifiedAt = new Date();
  await db.transaction(async (tx) => {
    await tx
      .update(parts)
      .set({ status: "verified", verifiedBy: caller.user.id, verifiedAt })
      .where(eq(parts.id, part.id));
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "part.verified",
        subjectType: "part",
        subjectId: part.id,
      },
      tx,
    );
  });
  return json({ status: "verified", verifiedBy: caller.user.name, verifiedAt });
});
