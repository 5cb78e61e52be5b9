import "server-only";
import type { Project } from "@/db/schema";
import { queueRechecks, recheckCapture } from "@/lib/capture/job";
import { captureStates } from "@/lib/capture/results";
import { storage } from "@/lib/storage";
import { evaluate, type ProjectPulse } from "./evaluate";
import { projectCaseNetwork, projectPolicy } from "./policy";
import { type Candidate, loadCandidates } from "./projects";
import { faultCasePulse, listFaultCases, listMeasuredPulses, measuredPulse } from "./pulses";

/** Every pulse of the project: fault cases first, then measured pulses, then the processed captures. */
/** What a caller has loaded already and passes on, so it is not read twice; and how stale captures are handled. */
interface LoadedAlready {
  captures?: () => Promise<ProjectPulse[]>;
  staleCaptures?: StaleCaptures;
  faultCases?: Awaited<ReturnType<typeof listFaultCases>>;
  measured?: Awaited<ReturnType<typeof listMeasuredPulses>>;
}

export async function loadProjectPulses(
  project: Project,
  candidates: Candidate[],
  extra: LoadedAlready = {},
): Promise<{ pulses: ProjectPulse[]; pendingCaptures: string[] }> {
  const [cases, measured, captured] = await Promise.all([
    extra.faultCases ?? listFaultCases(project.id),
    extra.measured ?? listMeasuredPulses(project.id),
    extra.captures
      ? extra.captures().then((pulses) => ({ pulses, pending: [] as string[] }))
      : currentCaptures(project, candidates, extra.staleCaptures ?? "queue"),
  ]);
  return {
    pulses: [
      ...cases.map((c) => faultCasePulse(project, c)),
      ...measured.map((m) => measuredPulse(project, m)),
      ...captured.pulses,
    ],
    pendingCaptures: captured.pending,
  };
}

/**
 * What to do with a capture whose stored results are stale: "queue" a recheck and leave its results out meanwhile
 * (naming it pending), or "recompute" it now, before answering (the comparison and a decision's snapshot).
 */
export type StaleCaptures = "queue" | "recompute";

/** The project's processed captures with their current stored results, and those still pending. */
async function currentCaptures(project: Project, candidates: Candidate[], stale: StaleCaptures) {
  let states = await captureStates(project, candidates);
  if (states.stale.length && stale === "recompute") {
    for (const id of states.stale) await recheckCapture(storage(), id);
    states = await captureStates(project, candidates);
  }
  queueRechecks(states.stale);
  return { pulses: states.pulses, pending: [...states.pending, ...states.stale] };
}

/**
 * Checks every pulse of a project against every candidate on the server, through the engine, at the project's
 * temperature (or a fault case's override) and margin policy. The answer carries what the results table, the
 * charts and the comparison need, and nothing of the pulses' raw samples.
 */
export async function checkProject(
  project: Project,
  extra: LoadedAlready & { candidates?: Candidate[] } = {},
) {
  const candidates = extra.candidates ?? (await loadCandidates(project.id));
  const { pulses, pendingCaptures } = await loadProjectPulses(project, candidates, extra);
  const evaluation = await evaluate(
    candidates.map((c) => ({ partId: c.part.id, limits: c.limits })),
    pulses,
    projectPolicy(project),
    projectCaseNetwork(project),
  );
  return {
    policy: {
      caseTemp: project.caseTemp,
      ...projectPolicy(project),
      caseNetwork: projectCaseNetwork(project) ?? null,
    },
    candidates: candidates.map((c) => ({
      partId: c.part.id,
      partNumber: c.part.partNumber,
      maker: c.part.maker,
      status: c.part.status,
      verifiedByName: c.verifiedByName,
      unitCost: c.part.unitCost,
      currency: c.part.currency,
      hasCurves: c.limits !== null,
      hasThermalModel: Boolean(c.part.foster?.length),
      curveSetId: c.curveSetId,
      /** The widths of the active curve set's curves, for saying which curves a reading used. */
      widths: c.limits?.soa.curves.map((curve) => curve.duration) ?? [],
    })),
    pulses: pulses.map(({ pulse: _pulse, stored: _stored, ...rest }) => rest),
    /** Captures being processed, or whose results are being recomputed: their results are not all here yet. */
    pendingCaptures,
    ...evaluation,
  };
}
