import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { parseZthCsv } from "@/lib/csv/zth";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { CsvRejected, discardUpload, getPendingUpload, readUploadedText } from "@/lib/library/curve-upload";
import { loadPart, setThermalModel } from "@/lib/library/parts";
import { fitFoster } from "@/lib/soa/fit-foster";
import { storage } from "@/lib/storage";

const fitSchema = z.object({
  uploadId: z.string().min(1),
  maxTerms: z.number().int().min(3).max(6).default(4),
});

/**
 * POST /api/parts/:id/thermal/fit { uploadId, maxTerms }: fits a Foster network of 3–6 positive terms to an
 * uploaded Z_th(t) CSV and makes it the part's thermal model, keeping the points and the fit error to draw.
 * The uploaded file is not kept: the points are stored with the model.
 */
export const POST = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const { uploadId, maxTerms } = await parseBody(req, fitSchema);
  const upload = await getPendingUpload({ workspaceId: caller.workspaceId, uploadId, purpose: "zth" });
  try {
    const { text } = await readUploadedText(storage(), upload.objectKey);
    const parsed = parseZthCsv(text);
    if (!parsed.ok) throw new CsvRejected(parsed.errors);
    const fit = fitFoster(parsed.points, { maxTerms });
    if (!fit.ok) throw new AppError("invalid:fit", `No thermal model could be fitted: ${fit.reason}`);
    const updated = await setThermalModel(caller, part, fit.terms, {
      kind: "fitted",
      fileName: upload.fileName,
      points: parsed.points.map(([t, z]) => [t, z]),
      rmsRelativeError: fit.rmsRelativeError,
      maxRelativeError: fit.maxRelativeError,
    });
    return json({ foster: updated.foster, thermalSource: updated.thermalSource, status: updated.status });
  } finally {
    await discardUpload(storage(), upload);
  }
});
