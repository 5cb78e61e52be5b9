import { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { measuredPulses } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { MAX_MEASUREMENT_ROWS, measurementRowSchema } from "@/lib/csv/measurements";
import { json, parseBody } from "@/lib/http";
import { checkProject } from "@/lib/projects/check";
import { notifyFailingEvidence } from "@/lib/projects/notify";
import { loadProject } from "@/lib/projects/projects";

const optionalText = (max: number) =>
  z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().trim().max(max).optional());

const saveSchema = z.object({
  rows: z.array(measurementRowSchema).min(1, { message: "No rows to save" }).max(MAX_MEASUREMENT_ROWS),
  note: optionalText(2000),
  boardSerial: optionalText(80),
  probe: optionalText(120),
});

/**
 * POST /api/projects/:id/measurements { rows, note, boardSerial, probe }: saves every row in one transaction,
 * attributed to the caller; then the project's owner is e-mailed once for each saved pulse that fails or has no
 * data on any candidate.
 */
export const POST = route<{ id: string }>({ action: "measurement.write" }, async (req, caller, { id }) => {
  const project = await loadProject(caller, id);
  const input = await parseBody(req, saveSchema);
  const saved = await db.transaction(async (tx) => {
    const rows = await tx
      .insert(measuredPulses)
      .values(
        input.rows.map((r) => ({
          projectId: project.id,
          label: r.label,
          kind: r.kind,
          v: r.v,
          i: r.i,
          duration: r.duration,
          repeatPeriod: r.repeat?.period ?? null,
          repeatCount: r.repeat?.count ?? null,
          note: input.note ?? null,
          boardSerial: input.boardSerial ?? null,
          probe: input.probe ?? null,
          createdBy: caller.user.id,
        })),
      )
      .returning({ id: measuredPulses.id });
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "measurements.added",
        subjectType: "project",
        subjectId: project.id,
        details: { count: rows.length, boardSerial: input.boardSerial ?? null },
      },
      tx,
    );
    return rows;
  });
  const ids = saved.map((r) => r.id);
  const checked = await checkProject(project);
  const notified = await notifyFailingEvidence(project, checked, ids);
  return json({ saved: ids, notified }, { status: 201 });
});
