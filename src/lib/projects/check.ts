import "server-only";
import type { Project } from "@/db/schema";
import { captureProjectPulses } from "@/lib/capture/store";
import { storage } from "@/lib/storage";
import { evaluate, type ProjectPulse } from "./evaluate";
import { type Candidate, loadCandidates } from "./projects";
import { faultCasePulse, listFaultCases, listMeasuredPulses, measuredPulse } from "./pulses";

/** The project's margin policy in the engine's terms. */
export function projectPolicy(project: Project) {
  return {
    utilisationLimit: project.utilisationLimit,
    tjGuard: project.tjGuard,
    voltageLimit: project.voltageLimit,
    betweenCurves: project.betweenCurves,
  } as const;
}

/**
 * The case path the checks heat the case through (METHODS.md §14): the project's case-to-ambient network when it
 * is to be applied, else none (the case held at its temperature).
 */
export function projectCaseNetwork(project: Project) {
  return project.applyCaseNetwork && project.caseNetwork?.length ? project.caseNetwork : undefined;
}

/** Every pulse of the project: fault cases first, then measured pulses, then captures. */
export async function loadProjectPulses(
  project: Project,
  extra: { captures?: () => Promise<ProjectPulse[]> } = {},
): Promise<ProjectPulse[]> {
  const [cases, measured, captured] = await Promise.all([
    listFaultCases(project.id),
    listMeasuredPulses(project.id),
    // Captures are read back from storage only when there are any; a caller may pass its own loader.
    (extra.captures ?? (() => captureProjectPulses(storage(), project)))(),
  ]);
  return [
    ...cases.map((c) => faultCasePulse(project, c)),
    ...measured.map((m) => measuredPulse(project, m)),
    ...captured,
  ];
}

/**
 * Checks every pulse of a project against every candidate on the server, through the engine, at the project's
 * temperature (or a fault case's override) and margin policy. The answer carries what the results table, the
 * charts and the comparison need, and nothing of the pulses' raw samples.
 */
export async function checkProject(
  project: Project,
  extra: { captures?: () => Promise<ProjectPulse[]>; candidates?: Candidate[] } = {},
) {
  const [candidates, pulses] = await Promise.all([
    extra.candidates ?? loadCandidates(project.id),
    loadProjectPulses(project, extra),
  ]);
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
    pulses: pulses.map(({ pulse: _pulse, ...rest }) => rest),
    ...evaluation,
  };
}
