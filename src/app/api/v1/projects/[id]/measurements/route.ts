import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadWritableProject } from "@/lib/projects/projects";
import {
  benchTextRows,
  saveBenchTextSchema,
  saveMeasurements,
  saveMeasurementsSchema,
} from "@/lib/projects/save-measurements";

type Body = z.output<typeof saveMeasurementsSchema> | z.output<typeof saveBenchTextSchema>;

/** Rows, or a bench table when the body carries `text`; each with its own messages, not a union's. */
const bodySchema = z.unknown().transform((raw, ctx): Body => {
  const schema =
    raw !== null && typeof raw === "object" && "text" in raw ? saveBenchTextSchema : saveMeasurementsSchema;
  const result = schema.safeParse(raw);
  if (result.success) return result.data;
  for (const issue of result.error.issues) {
    ctx.addIssue({ code: "custom", path: issue.path, message: issue.message });
  }
  return z.NEVER;
});

/**
 * POST /api/v1/projects/:id/measurements (Authorization: Bearer <API token>): a bench script posts measured
 * pulses, as rows in SI units or as its instrument's table with a column mapping, and gets each one's verdict on
 * every candidate back. Same rules as the app's own paste and save: no column is dropped unless mapped "skip".
 */
export const POST = route<{ id: string }>(
  { action: "measurement.write", bearer: true },
  async (req, caller, { id }) => {
    const project = await loadWritableProject(caller, id);
    const input = await parseBody(req, bodySchema);
    const rows = "text" in input ? benchTextRows(input) : input;
    return json(await saveMeasurements(caller, project, rows), { status: 201 });
  },
);
