import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import {
  captures,
  curveSets,
  curves,
  decisions,
  faultCases,
  measuredPulses,
  type Part,
  parts,
  projectCandidates,
  projects,
  users,
} from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import type { PartLimits } from "@/lib/soa/types";
import { isUuid } from "@/lib/uuid";

/** The caller's workspace's project, or 404 (a project of another workspace does not exist for the caller). */
export async function loadProject(caller: Pick<MemberCaller, "workspaceId">, projectId: string) {
  const [project] = isUuid(projectId)
    ? await db
        .select()
        .from(projects)
        .where(and(eq(projects.workspaceId, caller.workspaceId), eq(projects.id, projectId)))
    : [];
  if (!project) throw new AppError("not_found:project", "No such project in this workspace.");
  return project;
}

/** The nested resources of a project, with the code and the name its 404 gives. */
const projectChildren = new Map<ProjectChild, [`not_found:${string}`, string]>([
  [faultCases, ["not_found:fault-case", "fault case"]],
  [measuredPulses, ["not_found:measurement", "measured pulse"]],
  [decisions, ["not_found:decision", "decision"]],
  [captures, ["not_found:capture", "capture"]],
]);
type ProjectChild = typeof faultCases | typeof measuredPulses | typeof decisions | typeof captures;

/** A fault case, measured pulse, decision or capture of the project, or a 404 (another project's row included). */
export async function loadProjectRow<T extends ProjectChild>(
  table: T,
  projectId: string,
  id: string,
): Promise<T["$inferSelect"]> {
  const child: ProjectChild = table;
  const [row] = isUuid(id)
    ? await db
        .select()
        .from(child)
        .where(and(eq(child.projectId, projectId), eq(child.id, id)))
    : [];
  const [code, name] = projectChildren.get(child)!;
  if (!row) throw new AppError(code, `No such ${name} in this project.`);
  // The row is of `table`: drizzle types a select from a union of tables as the union of their rows.
  return row as T["$inferSelect"];
}

/** The caller's workspace's project for a page, or null when there is none (the page then answers notFound()). */
export async function findProject(caller: Pick<MemberCaller, "workspaceId">, projectId: string) {
  return loadProject(caller, projectId).catch((error: unknown) => {
    if (error instanceof AppError) return null;
    throw error;
  });
}

/**
 * The project, for a change: an archived project is kept read-only for history, so any change to it (its settings,
 * candidates, pulses, evidence or decisions) answers 409 until it is restored.
 */
export async function loadWritableProject(caller: Pick<MemberCaller, "workspaceId">, projectId: string) {
  const project = await loadProject(caller, projectId);
  if (project.archivedAt) {
    throw new AppError("conflict:archived", "This project is archived. Restore it before changing it.");
  }
  return project;
}

export interface Candidate {
  part: Part;
  /** Who verified the part in the library, while it is verified. */
  verifiedByName: string | null;
  /** The part as the engine takes it, with its active curve set; null when it has no curves yet. */
  limits: PartLimits | null;
  curveSetId: string | null;
}

/** The engine's view of a part and its active curve set. */
export function partLimits(
  part: Part,
  set: { refCaseTemp: number; curves: PartLimits["soa"]["curves"] },
): PartLimits {
  return {
    vdsMax: part.vdsMax,
    tjMax: part.tjMax,
    ...(part.rdsOn !== null ? { rdsOn: part.rdsOn } : {}),
    ...(part.idPulseMax !== null ? { idPulseMax: part.idPulseMax } : {}),
    ...(part.rthJc !== null ? { rthJc: part.rthJc } : {}),
    ...(part.foster?.length ? { foster: part.foster } : {}),
    soa: { refCaseTemp: set.refCaseTemp, curves: set.curves },
    ...(part.transfer ? { transfer: { temps: part.transfer.temps, curves: part.transfer.curves } } : {}),
    ...(part.avalancheEnergy !== null
      ? {
          avalanche: {
            energy: part.avalancheEnergy,
            ...(part.avalancheCurrent !== null ? { current: part.avalancheCurrent } : {}),
            ...(part.avalancheBreakdown !== null ? { breakdown: part.avalancheBreakdown } : {}),
          },
        }
      : {}),
  };
}

/** The project's candidate parts with their active curves, in the order they were added. */
export async function loadCandidates(projectId: string): Promise<Candidate[]> {
  const rows = await db
    .select({ part: parts, verifiedByName: users.name })
    .from(projectCandidates)
    .innerJoin(parts, eq(parts.id, projectCandidates.partId))
    .leftJoin(users, eq(users.id, parts.verifiedBy))
    .where(eq(projectCandidates.projectId, projectId))
    .orderBy(projectCandidates.addedAt);
  if (rows.length === 0) return [];
  const sets = await db
    .select()
    .from(curveSets)
    .where(
      and(
        inArray(
          curveSets.partId,
          rows.map((r) => r.part.id),
        ),
        eq(curveSets.active, true),
      ),
    );
  const curveRows = sets.length
    ? await db
        .select()
        .from(curves)
        .where(
          inArray(
            curves.curveSetId,
            sets.map((s) => s.id),
          ),
        )
        .orderBy(curves.position)
    : [];
  return rows.map(({ part, verifiedByName: verifier }) => {
    const verifiedByName = part.status === "verified" ? verifier : null;
    const set = sets.find((s) => s.partId === part.id);
    if (!set) return { part, verifiedByName, limits: null, curveSetId: null };
    const setCurves = curveRows
      .filter((c) => c.curveSetId === set.id)
      .map((c) => ({ duration: c.duration ?? ("DC" as const), points: c.points }));
    return {
      part,
      verifiedByName,
      limits: partLimits(part, { refCaseTemp: set.refCaseTemp, curves: setCurves }),
      curveSetId: set.id,
    };
  });
}
