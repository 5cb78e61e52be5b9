import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { captureMappingSchema } from "@/lib/capture/parse";
import { capturePulse, listCaptures, registerCapture } from "@/lib/capture/store";
import { json, parseBody } from "@/lib/http";
import { getPendingUpload } from "@/lib/library/curve-upload";
import { checkProject } from "@/lib/projects/check";
import { notifyFailingEvidence } from "@/lib/projects/notify";
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

/** GET /api/projects/:id/captures: the project's captures with their summaries, newest first. */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  return json({ captures: await listCaptures(project.id) });
});

/**
 * POST /api/projects/:id/captures { uploadId, name, mapping, start, note, boardSerial, probe }: parses the uploaded CSV
 * (streaming), stores its samples and summary, checks it against every candidate and e-mails the project's owner
 * if it fails or has no data on any of them. 201 with the capture's summary and its verdict per candidate.
 */
export const POST = route<{ id: string }>({ action: "measurement.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const input = await parseBody(req, registerSchema);
  const upload = await getPendingUpload({
    workspaceId: caller.workspaceId,
    uploadId: input.uploadId,
    purpose: "capture",
  });
  const { capture, samples } = await registerCapture(storage(), { ...input, project, caller, upload });
  const checked = await checkProject(project, {
    captures: async () => [capturePulse(project, capture, samples)],
  });
  const notified = await notifyFailingEvidence(project, checked, [capture.id]);
  const verdicts = Object.fromEntries(
    checked.candidates.map((c) => [c.partId, checked.results[c.partId]?.[capture.id] ?? null]),
  );
  return json(
    { capture: { id: capture.id, name: capture.name, summary: capture.summary }, verdicts, notified },
    { status: 201 },
  );
});
