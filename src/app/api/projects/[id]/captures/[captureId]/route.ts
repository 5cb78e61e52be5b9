import { route } from "@/lib/auth/guard";
import { can } from "@/lib/auth/permissions";
import { queueRechecks } from "@/lib/capture/job";
import { storedResults } from "@/lib/capture/results";
import { deleteCapture, getCapture } from "@/lib/capture/store";
import { AppError } from "@/lib/errors";
import { json } from "@/lib/http";
import { loadCandidates, loadProject, loadWritableProject } from "@/lib/projects/projects";
import { storage } from "@/lib/storage";

type Params = { id: string; captureId: string };

/**
 * GET /api/projects/:id/captures/:captureId: the capture's status ("queued", "processing", "done", "failed" with the
 * reason, what and where) and, once done, its summary and drawn trace and, per candidate, its stored result and
 * junction-temperature trace (at the project's case temperature, heated through the project's case path when it
 * applies one, whose case temperature comes too; from the start the check uses). Nothing is read
 * from storage or recomputed here: a result whose inputs changed since it was stored is answered as `stale` (no
 * result) and a recheck is queued.
 */
export const GET = route<Params>({ action: "workspace.read" }, async (_req, caller, { id, captureId }) => {
  const project = await loadProject(caller, id);
  const row = await getCapture({ projectId: project.id, captureId });
  // The object keys stay on the server.
  const { objectKey, samplesKey, ...capture } = row;
  const candidates = await loadCandidates(project.id);
  const stored = row.status === "done" ? await storedResults(project, candidates, row) : null;
  const stale = stored !== null && [...stored.values()].some((s) => !s.current);
  if (stale) queueRechecks([row.id]);
  return json({
    capture,
    caseTemp: project.caseTemp,
    // The case temperature through the capture when the project applies its case path (METHODS.md §14).
    case: [...(stored?.values() ?? [])].find((s) => s.current && s.caseTrace)?.caseTrace ?? null,
    stale,
    candidates: candidates.map(({ part }) => {
      const mine = stored?.get(part.id);
      const current = mine?.current === true;
      return {
        partId: part.id,
        partNumber: part.partNumber,
        maker: part.maker,
        tjMax: part.tjMax,
        stale: stored !== null && !current,
        result: current ? mine.result : null,
        junction: current ? mine.junction : null,
      };
    }),
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
