import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { getPendingUpload, registerCurveSet } from "@/lib/library/curve-upload";
import { loadPart } from "@/lib/library/parts";
import { storage } from "@/lib/storage";

const registerSchema = z.object({
  uploadId: z.string().min(1),
  refCaseTemp: z.number().finite().min(-55).max(150).optional(),
});

/**
 * POST /api/parts/:id/curve-sets { uploadId }: reads the uploaded CSV back from storage, parses and checks it, and
 * stores the curves as the part's active set. A rejected file answers 400 with every row-level problem.
 */
export const POST = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const { uploadId, refCaseTemp } = await parseBody(req, registerSchema);
  const upload = await getPendingUpload({ workspaceId: caller.workspaceId, uploadId, purpose: "curve-set" });
  const result = await registerCurveSet(storage(), {
    part,
    userId: caller.user.id,
    userName: caller.user.name,
    upload,
    refCaseTemp,
  });
  return json(result, { status: 201 });
});
