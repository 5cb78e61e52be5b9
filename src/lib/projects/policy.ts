import type { Project } from "@/db/schema";

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
