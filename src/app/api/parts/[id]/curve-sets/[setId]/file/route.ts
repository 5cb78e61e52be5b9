import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { curveSets } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { loadPart } from "@/lib/library/parts";
import { storage } from "@/lib/storage";
import { isUuid } from "@/lib/uuid";

/** GET /api/parts/:id/curve-sets/:setId/file: the original uploaded file, by a short-lived storage link. */
export const GET = route<{ id: string; setId: string }>(
  { action: "workspace.read" },
  async (_req, caller, { id, setId }) => {
    const part = await loadPart(caller, id);
    const [set] = isUuid(setId)
      ? await db
          .select({ objectKey: curveSets.objectKey, fileName: curveSets.fileName })
          .from(curveSets)
          .where(and(eq(curveSets.id, setId), eq(curveSets.partId, part.id)))
      : [];
    if (!set) throw new AppError("not_found:curve-set", "No such curve set.");
    const url = await storage().presignGet(set.objectKey, { fileName: set.fileName });
    return new Response(null, { status: 302, headers: { location: url, "cache-control": "no-store" } });
  },
);
