import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadWritableProject } from "@/lib/projects/projects";
import { saveMeasurements, saveMeasurementsSchema } from "@/lib/projects/save-measurements";

/**
 * POST /api/projects/:id/measurements { rows, note, boardSerial, probe }: saves every row in one transaction,
 * attributed to the caller; the project's owner is e-mailed once for each saved pulse that fails or has no data.
 */
export const POST = route<{ id: string }>({ action: "measurement.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const input = await parseBody(req, saveMeasurementsSchema);
  return json(await saveMeasurements(caller, project, input), { status: 201 });
});
