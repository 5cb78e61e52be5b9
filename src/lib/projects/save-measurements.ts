import "server-only";
import { z } from "zod";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { measuredPulses, type Project } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import {
  columnMappingSchema,
  MAX_MEASUREMENT_ROWS,
  measurementRowSchema,
  parseMeasurementPaste,
} from "@/lib/csv/measurements";
import { AppError } from "@/lib/errors";
import { checkProject } from "./check";
import { notifyFailingEvidence } from "./notify";
import { pulseColumns } from "./pulse-columns";

const optionalText = (max: number) =>
  z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().trim().max(max).optional());

/** What the save routes accept: the rows in SI units, and the bench setup they were measured on. */
export const saveMeasurementsSchema = z.object({
  rows: z.array(measurementRowSchema).min(1, { message: "No rows to save" }).max(MAX_MEASUREMENT_ROWS),
  note: optionalText(2000),
  boardSerial: optionalText(80),
  probe: optionalText(120),
});

/**
 * What a bench script may send instead of rows: the table as its instrument writes it, read by the same rules as
 * the paste (header names, units, decimal commas, repetition synonyms), with its own column mapping over the
 * header. A column nothing reads and the mapping does not leave out ("skip") refuses the whole request.
 */
export const saveBenchTextSchema = z.object({
  text: z.string().min(1, { message: "No table to read" }).max(500_000),
  mapping: columnMappingSchema.default({}),
  note: optionalText(2000),
  boardSerial: optionalText(80),
  probe: optionalText(120),
});

/** Reads a bench table into rows to save, or refuses it with every problem of the table and of its rows. */
export function benchTextRows(input: z.output<typeof saveBenchTextSchema>) {
  const parsed = parseMeasurementPaste(input.text, input.mapping);
  const issues = [...parsed.errors, ...parsed.rows.flatMap((row) => row.errors)];
  if (issues.length > 0) {
    throw new AppError("invalid:table", `The table was not saved: ${issues[0].message}`, {
      details: { issues, columns: parsed.columns },
    });
  }
  return saveMeasurementsSchema.parse({
    rows: parsed.rows.map(({ label, kind, v, i, duration, repeat }) => ({
      label,
      kind,
      v,
      i,
      duration,
      repeat,
    })),
    note: input.note,
    boardSerial: input.boardSerial,
    probe: input.probe,
  });
}

/**
 * Saves measured pulses in one transaction, attributed to the caller; then checks the project and e-mails its
 * owner once, listing every saved pulse that fails or has no data on any candidate. Returns the saved ids, how many
 * pulses that e-mail lists, and the verdicts of the saved pulses on every candidate.
 */
export async function saveMeasurements(
  caller: MemberCaller,
  project: Project,
  input: z.output<typeof saveMeasurementsSchema>,
) {
  const saved = await db.transaction(async (tx) => {
    const rows = await tx
      .insert(measuredPulses)
      .values(
        input.rows.map((r) => ({
          projectId: project.id,
          label: r.label,
          ...pulseColumns(r),
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
        details: { count: rows.length, boardSerial: input.boardSerial ?? null, via: caller.via },
      },
      tx,
    );
    return rows;
  });
  const ids = saved.map((r) => r.id);
  // Only the saved pulses are notified and answered: the project's captures need not be read back from storage.
  const checked = await checkProject(project, { captures: async () => [] });
  const notified = await notifyFailingEvidence(project, checked, ids);
  const verdicts = ids.map((id) => ({
    id,
    worst: checked.worstByPulse[id],
    byCandidate: Object.fromEntries(
      checked.candidates.map((c) => [c.partNumber, checked.results[c.partId]?.[id] ?? null]),
    ),
  }));
  return { saved: ids, notified, verdicts };
}
