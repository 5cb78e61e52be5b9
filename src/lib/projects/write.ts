import "server-only";
import { eq } from "drizzle-orm";
import type { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getMembership } from "@/db/queries/members";
import { projects } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import type { faultCaseSchema, projectSchema } from "./schema";

type ProjectValues = z.output<typeof projectSchema>;

/** The owner engineer must be a member of the workspace (any role that writes projects). */
export async function assertOwner(caller: MemberCaller, ownerId: string | null | undefined): Promise<void> {
  if (!ownerId) return;
  const membership = await getMembership({ workspaceId: caller.workspaceId, userId: ownerId });
  if (!membership || membership.role === "technician") {
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

type FaultCaseValues = z.output<typeof faultCaseSchema>;

/** Database columns of a fault case from the form's values. */
export function faultCaseColumns(values: FaultCaseValues) {
  return {
    name: values.name,
    kind: values.kind,
    v: values.v,
    i: values.i,
    duration: values.duration,
    repeatPeriod: values.repeat?.period ?? null,
    repeatCount: values.repeat?.count ?? null,
    caseTemp: values.caseTemp ?? null,
    notes: values.notes ?? null,
    origin: values.origin ?? null,
  };
}
