import { route } from "@/lib/auth/guard";
import { loadCurveSet, loadPart } from "@/lib/library/parts";
import { storage } from "@/lib/storage";

/** GET /api/parts/:id/curve-sets/:setId/file: the original uploaded file, by a short-lived storage link. */
export const GET = route<{ id: string; setId: string }>(
  { action: "workspace.read" },
  async (_req, caller, { id, setId }) => {
    const part = await loadPart(caller, id);
    const set = await loadCurveSet(part, setId);
    const url = await storage().presignGet(set.objectKey, { fileName: set.fileName });
    return new Response(null, { status: 302, headers: { location: url, "cache-control": "no-store" } });
  },
);
