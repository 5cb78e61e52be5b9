import "server-only";
import { eq } from "drizzle-orm";
import type { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getMembership } from "@/db/queries/members";
import { projects } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { can } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import { pulseColumns } from "./pulse-columns";
import type { anyFaultCaseSchema, projectSchema } from "./schema";

type ProjectValues = z.output<typeof projectSchema>;

/** The owner must be a member of the workspace whose role may own a project (`project.own`). */
export async function assertOwner(caller: MemberCaller, ownerId: string | null | undefined): Promise<void> {
  if (!ownerId) return;
  const membership = await getMembership({ workspaceId: caller.workspaceId, userId: ownerId });
  if (!membership || !can(membership.role, "project.own")) {
    throw new AppError("invalid:owner", "The owner must be an engineer, lead or admin of this workspace.", {
      details: { fieldErrors: { ownerId: ["Choose an engineer, lead or admin of this workspace"] } },
    });
  }
}

export async function createProject(caller: MemberCaller, values: ProjectValues) {
  await assertOwner(caller, values.ownerId);
  return db.transaction(async (tx) => {
    const [project] = await tx
      .insert(projects)
      .values({ ...values, ownerId: values.ownerId ?? caller.user.id, workspaceId: caller.workspaceId })
      .returning();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "project.created",
        subjectType: "project",
        subjectId: project.id,
        details: { name: project.name },
      },
      tx,
    );
    return project;
  });
}

export async function updateProject(caller: MemberCaller, projectId: string, values: ProjectValues) {
  await assertOwner(caller, values.ownerId);
  return db.transaction(async (tx) => {
    const [project] = await tx
      .update(projects)
      .set({ ...values, ownerId: values.ownerId ?? null, updatedAt: new Date() })
      .where(eq(projects.id, projectId))
      .returning();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "project.updated",
        subjectType: "project",
        subjectId: project.id,
        details: {
          caseTemp: project.caseTemp,
          utilisationLimit: project.utilisationLimit,
          tjGuard: project.tjGuard,
          voltageLimit: project.voltageLimit,
          betweenCurves: project.betweenCurves,
        },
      },
      tx,
    );
    return project;
  });
}

type FaultCaseValues = z.output<typeof anyFaultCaseSchema>;

/** The peak-power sample of a sequence: the (V, I) shown for it. */
function peakSample(samples: { v: number[]; i: number[] }): { v: number; i: number } {
  let best = 0;
  for (let n = 1; n < samples.v.length; n++) {
    if (samples.v[n] * samples.i[n] > samples.v[best] * samples.i[best]) best = n;
  }
  return { v: samples.v[best], i: samples.i[best] };
}

/** Database columns of a fault case from the form's or a builder's values (see the table's shape rule). */
export function faultCaseColumns(values: FaultCaseValues) {
  const common = {
    name: values.name,
    caseTemp: values.caseTemp ?? null,
    notes: values.notes ?? null,
    origin: values.origin ?? null,
  };
  const none = { duration: null, inductance: null, samples: null, repeatPeriod: null, repeatCount: null };
  if (values.kind === "avalanche") {
    return {
      ...common,
      ...none,
      kind: values.kind,
      v: values.supply,
      i: values.current,
      inductance: values.inductance,
    };
  }
  if (values.kind === "waveform") {
    return { ...common, ...none, kind: values.kind, ...peakSample(values.samples), samples: values.samples };
  }
  return { ...common, ...none, ...pulseColumns(values) };
}
