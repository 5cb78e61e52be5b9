import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { curveSets, parts } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json } from "@/lib/http";
import { noticePartChange } from "@/lib/library/part-changed";
import { draftFields } from "@/lib/library/part-findings";
import { loadCurveSet, loadPart } from "@/lib/library/parts";

/** POST /api/parts/:id/curve-sets/:setId/activate: makes an earlier revision the active one; back to draft. */
export const POST = route<{ id: string; setId: string }>(
  { action: "part.write" },
  async (_req, caller, { id, setId }) => {
    const part = await loadPart(caller, id);
    const fileName = await db.transaction(async (tx) => {
      const set = await loadCurveSet(part, setId, tx);
      await tx.update(curveSets).set({ active: false }).where(eq(curveSets.partId, part.id));
      await tx.update(curveSets).set({ active: true }).where(eq(curveSets.id, set.id));
      await tx
        .update(parts)
        .set({ ...draftFields, updatedAt: new Date() })
        .where(eq(parts.id, part.id));
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "curve-set.activated",
          subjectType: "part",
          subjectId: part.id,
          details: { curveSetId: set.id },
        },
        tx,
      );
      return set.fileName;
    });
    await noticePartChange(part, `curve set ${fileName} made active`, caller.user.name);
    return json({ status: "ok" });
  },
);
