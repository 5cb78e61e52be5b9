import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadProject } from "@/lib/projects/projects";
import { saveMeasurements, saveMeasurementsSchema } from "@/lib/projects/save-measurements";

/**
 * POST /api/v1/projects/:id/measurements (Authorization: Bearer <API token>): a bench script posts measured
 * pulses (SI units) and gets each one's verdict on every candidate back. Same rules as the app's own save.
 */
export const POST = route<{ id: string }>(
  { action: "measurement.write", bearer: true },
  async (req, caller, { id }) => {
    const project = await loadProject(caller, id);
    const input = await parseBody(req, saveMeasurementsSchema);
    return json(await saveMeasurements(caller, project, input), { status: 201 });
  },
);
