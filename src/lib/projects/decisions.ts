import "server-only";
import { isDeepStrictEqual } from "node:util";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { type Decision, decisions, type Project, projects } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { DEFAULT_POLICY } from "@/lib/soa/policy";
import { METHODS_REVISION, revisionOf } from "@/lib/soa/revision";
import type { PartLimits, PulseResult, Verdict } from "@/lib/soa/types";
import { checkProject } from "./check";
import { rankCandidates } from "./matrix";
import { type Candidate, loadCandidates, loadProjectRow } from "./projects";

export type Checked = Awaited<ReturnType<typeof checkProject>>;

/** Everything a decision rested on, frozen as JSON: later library or project edits never change it. */
export interface DecisionSnapshot {
  takenAt: string;
  /** The revision of METHODS.md the evaluation was found under; absent in records of revision 1. */
  methodsRevision?: number;
  project: { id: string; name: string; description: string | null; caseTemp: number };
  policy: Checked["policy"];
  candidates: (Checked["candidates"][number] & {
    part: {
      package: string;
      technology: string;
      vdsMax: number;
      idPulseMax: number | null;
      rdsOn: number | null;
      tjMax: number;
      rthJc: number | null;
      datasheetRevision: string | null;
    };
    limits: PartLimits | null;
  })[];
  pulses: Checked["pulses"];
  results: Checked["results"];
  worstByPulse: Checked["worstByPulse"];
  ranking: ReturnType<typeof rankCandidates>;
}

export function buildSnapshot(project: Project, candidates: Candidate[], checked: Checked): DecisionSnapshot {
  return {
    takenAt: new Date().toISOString(),
    methodsRevision: METHODS_REVISION,
    project: {
      id: project.id,
      name: project.name,
      description: project.description,
      caseTemp: project.caseTemp,
    },
    policy: checked.policy,
    candidates: checked.candidates.map((c) => {
      const full = candidates.find((x) => x.part.id === c.partId)!;
      return {
        ...c,
        part: {
          package: full.part.package,
          technology: full.part.technology,
          vdsMax: full.part.vdsMax,
          idPulseMax: full.part.idPulseMax,
          rdsOn: full.part.rdsOn,
          tjMax: full.part.tjMax,
          rthJc: full.part.rthJc,
          datasheetRevision: full.part.datasheetRevision,
        },
        limits: full.limits,
      };
    }),
    pulses: checked.pulses,
    results: checked.results,
    worstByPulse: checked.worstByPulse,
    ranking: rankCandidates(
      checked.candidates,
      checked.pulses.map((p) => p.id),
      checked.results,
    ),
  };
}

/** The project's current check, and the snapshot it would freeze now. */
export async function snapshotNow(project: Project): Promise<DecisionSnapshot> {
  const { candidates, checked } = await checkNow(project);
  return buildSnapshot(project, candidates, checked);
}

/** The project's check with every processed capture's results current (stale ones are recomputed first). */
async function checkNow(project: Project) {
  const candidates = await loadCandidates(project.id);
  return { candidates, checked: await checkProject(project, { candidates, staleCaptures: "recompute" }) };
}

/**
 * Records a lead's decision with its frozen snapshot; the previous standing decision is superseded. Signatures of
 * one project run one at a time (the project row is locked), and a unique index keeps one standing decision per
 * project. A repeat of the same submission (same idempotency key), or the same choice and rationale as the standing
 * decision, answers 409 and records nothing.
 */
export async function signDecision(
  caller: MemberCaller,
  project: Project,
  input: { partId: string; rationale: string; idempotencyKey?: string },
): Promise<Decision> {
  const { candidates, checked } = await checkNow(project);
  // A decision frozen while a capture is still being processed would leave that evidence out.
  if (checked.pendingCaptures.length) {
    throw new AppError(
      "conflict:captures-pending",
      "A capture of this project is still being processed. Sign once its results are in.",
    );
  }
  const snapshot = buildSnapshot(project, candidates, checked);
  const chosen = snapshot.candidates.find((c) => c.partId === input.partId);
  if (!chosen) throw new AppError("invalid:candidate", "Choose one of the project's candidates.");
  const decisionId = crypto.randomUUID();
  return db.transaction(async (tx) => {
    await tx.select({ id: projects.id }).from(projects).where(eq(projects.id, project.id)).for("update");
    const [standing] = await tx
      .select({ id: decisions.id, chosenPartId: decisions.chosenPartId, rationale: decisions.rationale })
      .from(decisions)
      .where(and(eq(decisions.projectId, project.id), isNull(decisions.supersededBy)));
    if (input.idempotencyKey) {
      const [repeat] = await tx
        .select({ id: decisions.id })
        .from(decisions)
        .where(and(eq(decisions.projectId, project.id), eq(decisions.idempotencyKey, input.idempotencyKey)));
      if (repeat) throw duplicateDecision(repeat.id);
    }
    if (standing && standing.chosenPartId === chosen.partId && standing.rationale === input.rationale) {
      throw duplicateDecision(standing.id);
    }
    const signedAt = new Date();
    if (standing) {
      await tx
        .update(decisions)
        .set({ supersededBy: decisionId, supersededAt: signedAt })
        .where(eq(decisions.id, standing.id));
    }
    const [decision] = await tx
      .insert(decisions)
      .values({
        id: decisionId,
        workspaceId: caller.workspaceId,
        projectId: project.id,
        chosenPartId: chosen.partId,
        chosenLabel: `${chosen.maker} ${chosen.partNumber}`,
        rationale: input.rationale,
        snapshot,
        signedBy: caller.user.id,
        signedByName: caller.user.name,
        signedAt,
        idempotencyKey: input.idempotencyKey ?? null,
      })
      .returning();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "decision.signed",
        subjectType: "project",
        subjectId: project.id,
        details: { decisionId: decision.id, chosen: decision.chosenLabel },
      },
      tx,
    );
    return decision;
  });
}

function duplicateDecision(existingId: string): AppError {
  return new AppError("conflict:decision", "This decision is already recorded.", {
    details: { decisionId: existingId },
  });
}

export function listDecisions(projectId: string) {
  return db
    .select({
      id: decisions.id,
      chosenPartId: decisions.chosenPartId,
      chosenLabel: decisions.chosenLabel,
      rationale: decisions.rationale,
      signedByName: decisions.signedByName,
      signedAt: decisions.signedAt,
      supersededBy: decisions.supersededBy,
      supersededAt: decisions.supersededAt,
    })
    .from(decisions)
    .where(eq(decisions.projectId, projectId))
    .orderBy(desc(decisions.signedAt));
}

export async function loadDecision(projectId: string, decisionId: string): Promise<Decision> {
  return loadProjectRow(decisions, projectId, decisionId);
}

export interface DriftItem {
  partId: string;
  pulseId: string;
  label: string;
  frozen: { verdict: Verdict; utilisation: number | null } | null;
  now: { verdict: Verdict; utilisation: number | null } | null;
}

export interface Drift {
  /** The methods' revision differs: verdicts may have changed because the rules did. */
  methodsChanged: { frozen: number; now: number } | null;
  policyChanged: boolean;
  caseTempChanged: { frozen: number; now: number } | null;
  curveSetsChanged: { partId: string; label: string }[];
  pulsesAdded: string[];
  pulsesRemoved: string[];
  results: DriftItem[];
}

const brief = (r: PulseResult | undefined) => (r ? { verdict: r.verdict, utilisation: r.utilisation } : null);

/** What would differ if the project were checked now: settings, curve versions, pulses, and changed results. */
export function computeDrift(frozen: DecisionSnapshot, now: DecisionSnapshot): Drift {
  const label = (partId: string, pulseId: string, snap: DecisionSnapshot) => {
    const c = snap.candidates.find((x) => x.partId === partId);
    const p = snap.pulses.find((x) => x.id === pulseId);
    return `${c?.partNumber ?? "removed part"} × ${p?.name ?? "removed pulse"}`;
  };
  const results: DriftItem[] = [];
  const partIds = new Set([...frozen.candidates, ...now.candidates].map((c) => c.partId));
  const pulseIds = new Set([...frozen.pulses, ...now.pulses].map((p) => p.id));
  for (const partId of partIds) {
    for (const pulseId of pulseIds) {
      const a = brief(frozen.results[partId]?.[pulseId]);
      const b = brief(now.results[partId]?.[pulseId]);
      if (!isDeepStrictEqual(a, b)) {
        results.push({ partId, pulseId, label: label(partId, pulseId, b ? now : frozen), frozen: a, now: b });
      }
    }
  }
  // A record made before a policy field existed was checked without it: compare it as that field's default.
  const { caseTemp: frozenTemp, ...frozenPolicy } = {
    ...frozen.policy,
    voltageLimit:
      (frozen.policy as Partial<DecisionSnapshot["policy"]>).voltageLimit ?? DEFAULT_POLICY.voltageLimit,
  };
  const { caseTemp: nowTemp, ...nowPolicy } = now.policy;
  const frozenRevision = revisionOf(frozen);
  const nowRevision = revisionOf(now);
  return {
    methodsChanged: frozenRevision !== nowRevision ? { frozen: frozenRevision, now: nowRevision } : null,
    policyChanged: !isDeepStrictEqual(frozenPolicy, nowPolicy),
    caseTempChanged: frozenTemp !== nowTemp ? { frozen: frozenTemp, now: nowTemp } : null,
    curveSetsChanged: frozen.candidates
      .filter((c) => {
        const current = now.candidates.find((x) => x.partId === c.partId);
        return current && !isDeepStrictEqual(current.limits, c.limits);
      })
      .map((c) => ({ partId: c.partId, label: `${c.maker} ${c.partNumber}` })),
    pulsesAdded: now.pulses.filter((p) => !frozen.pulses.some((f) => f.id === p.id)).map((p) => p.name),
    pulsesRemoved: frozen.pulses.filter((p) => !now.pulses.some((f) => f.id === p.id)).map((p) => p.name),
    results,
  };
}
