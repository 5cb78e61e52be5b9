import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { queueCapture } from "@/lib/capture/job";
import { captureMappingSchema } from "@/lib/capture/parse";
import { listCaptures, markUnqueued, registerCapture } from "@/lib/capture/store";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { getPendingUpload } from "@/lib/library/curve-upload";
import { loadProject, loadWritableProject } from "@/lib/projects/projects";
import { storage } from "@/lib/storage";

const optionalText = (max: number) =>
  z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().trim().max(max).optional());

const registerSchema = z.object({
  uploadId: z.string().min(1),
  name: z.string().trim().min(1, { message: "Name the capture" }).max(120),
  mapping: captureMappingSchema,
  // What came before the record (METHODS.md §6): "rest", "steady", or "auto" (the engine decides from the data).
  start: z
    .enum(["auto", "rest", "steady"], { message: "Choose what came before the record" })
    .default("auto")
    .transform((s) => (s === "auto" ? null : s)),
  note: optionalText(2000),
  boardSerial: optionalText(80),
  probe: optionalText(120),
});

/** GET /api/projects/:id/captures: the project's captures with their status and summaries, newest first. */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  return json({ captures: await listCaptures(project.id) });
});

/**
 * POST /api/projects/:id/captures { uploadId, name, mapping, start, note, boardSerial, probe }: keeps the uploaded
 * CSV and queues its processing (parse, samples, checks against every candidate, a notice if it fails or has no
 * data on one), answering at once: 202 with the capture's id, its status ("queued") and the job's id. The capture's
 * page follows its status (GET …/captures/:captureId) to its results.
 */
export const POST = route<{ id: string }>({ action: "measurement.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const input = await parseBody(req, registerSchema);
  const upload = await getPendingUpload({
    workspaceId: caller.workspaceId,
    uploadId: input.uploadId,
    purpose: "capture",
  });
  const capture = await registerCapture(storage(), { ...input, project, caller, upload });
  let jobId: string | null;
  try {
    jobId = await queueCapture(capture.id);
  } catch (error) {
    await markUnqueued(capture.id);
    throw new AppError("unavailable:jobs", "The capture could not be queued for processing. Try again.", {
      cause: error,
    });
  }
  return json(
    { capture: { id: capture.id, name: capture.name, status: capture.status }, jobId },
    { status: 202 },
  );
});
