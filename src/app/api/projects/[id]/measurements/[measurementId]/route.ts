import { eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { measuredPulses } from "@/db/schema";
import { type MemberCaller, route } from "@/lib/auth/guard";
import { can } from "@/lib/auth/permissions";
import { measurementRowSchema } from "@/lib/csv/measurements";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { loadProjectRow, loadWritableProject } from "@/lib/projects/projects";
import { pulseColumns } from "@/lib/projects/pulse-columns";

/** A measured pulse of the project that the caller may change: their own, or any for a lead or admin. */
async function loadOwnMeasurement(caller: MemberCaller, projectId: string, measurementId: string) {
  const row = await loadProjectRow(measuredPulses, projectId, measurementId);
  if (row.createdBy !== caller.user.id && !can(caller.role, "measurement.manage", caller.leadRights)) {
    throw new AppError("forbidden:not-yours", "Only its author or a lead can change a measured pulse.");
  }
  return row;
}

/** PATCH /api/projects/:id/measurements/:measurementId: corrects a measured pulse (own, or any for leads). */
export const PATCH = route<{ id: string; measurementId: string }>(
  { action: "measurement.write" },
  async (req, caller, { id, measurementId }) => {
    const project = await loadWritableProject(caller, id);
    const existing = await loadOwnMeasurement(caller, project.id, measurementId);
    const values = await parseBody(req, measurementRowSchema);
    const row = await db.transaction(async (tx) => {
      const [updated] = await tx
        .update(measuredPulses)
        .set({ label: values.label, ...pulseColumns(values) })
        .where(eq(measuredPulses.id, existing.id))
        .returning();
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "measurement.updated",
          subjectType: "project",
          subjectId: project.id,
          details: { measurementId: updated.id },
        },
        tx,
      );
      return updated;
    });
    return json({ measurement: row });
  },
);

/** DELETE /api/projects/:id/measurements/:measurementId: own rows, or any for leads and admins. */
export const DELETE = route<{ id: string; measurementId: string }>(
  { action: "measurement.write" },
  async (_req, caller, { id, measurementId }) => {
    const project = await loadWritableProject(caller, id);
    const existing = await loadOwnMeasurement(caller, project.id, measurementId);
    await db.transaction(async (tx) => {
      await tx.delete(measuredPulses).where(eq(measuredPulses.id, existing.id));
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "measurement.deleted",
          subjectType: "project",
          subjectId: project.id,
          details: { measurementId: existing.id, label: existing.label },
        },
        tx,
      );
    });
    return json({ status: "ok" });
  },
);
