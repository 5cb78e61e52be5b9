import { route } from "@/lib/auth/guard";
import { can } from "@/lib/auth/permissions";
import { caseTrace, junctionTrace } from "@/lib/capture/process";
import { deleteCapture, getCapture, loadCaptureSamples } from "@/lib/capture/store";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";
import { loadCandidates, loadProject, loadWritableProject } from "@/lib/projects/projects";
import { powerFromVI } from "@/lib/soa/thermal-waveform";
import { storage } from "@/lib/storage";

type Params = { id: string; captureId: string };

/**
 * GET /api/projects/:id/captures/:captureId: the capture's summary and drawn trace, and for each candidate with a
 * Foster network its junction temperature through the capture (at the project's case temperature, heated through the
 * project's case path when it applies one, whose case temperature comes too; from the start the
 * check uses): peak, when, and a trace decimated on the same buckets as the capture's.
 */
export const GET = route<Params>({ action: "workspace.read" }, async (_req, caller, { id, captureId }) => {
  const project = await loadProject(caller, id);
  const row = await getCapture({ projectId: project.id, captureId });
  // The object keys stay on the server.
  const { objectKey, samplesKey, ...capture } = row;
  const candidates = await loadCandidates(project.id);
  const thermal = candidates.some((c) => c.part.foster?.length);
  const samples = thermal ? await loadCaptureSamples(storage(), row) : null;
  const p = samples ? powerFromVI(samples.v, samples.i) : null;
  // The case path heats the case from the same power when the project applies it (METHODS.md §14).
  const caseNetwork = project.applyCaseNetwork && project.caseNetwork?.length ? project.caseNetwork : null;
  return json({
    capture,
    caseTemp: project.caseTemp,
    case:
      samples && p && caseNetwork
        ? caseTrace(samples.t, p, caseNetwork, project.caseTemp, { start: row.start })
        : null,
    candidates: candidates.map(({ part }) => ({
      partId: part.id,
      partNumber: part.partNumber,
      maker: part.maker,
      tjMax: part.tjMax,
      junction:
        samples && p && part.foster?.length
          ? junctionTrace(samples.t, p, part.foster, project.caseTemp, { start: row.start, caseNetwork })
          : null,
    })),
  });
});

/** DELETE /api/projects/:id/captures/:captureId: by whoever uploaded it, or a lead or admin. */
export const DELETE = route<Params>(
  { action: "measurement.write" },
  async (_req, caller, { id, captureId }) => {
    const project = await loadWritableProject(caller, id);
    const capture = await getCapture({ projectId: project.id, captureId });
    if (capture.createdBy !== caller.user.id && !can(caller.role, "measurement.manage", caller.leadRights)) {
      throw new AppError(
        "forbidden:capture",
        "Only the person who uploaded a capture, or a lead, can delete it.",
      );
    }
    await deleteCapture(storage(), { capture, caller });
    return json({ status: "ok" });
  },
);
