import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { columnMappingSchema, parseMeasurementPaste } from "@/lib/csv/measurements";
import { json, parseBody } from "@/lib/http";
import { previewVerdicts } from "@/lib/projects/measurements";
import { loadProject } from "@/lib/projects/projects";

/**
 * POST /api/projects/:id/measurements/preview { text, mapping? }: parses pasted rows (with the user's column
 * mapping over the header) and checks each valid one against every candidate, saving nothing: the technician sees
 * every row's problems and verdicts, and every column's reading, before saving.
 */
export const POST = route<{ id: string }>({ action: "measurement.write" }, async (req, caller, { id }) => {
  const project = await loadProject(caller, id);
  const { text, mapping } = await parseBody(
    req,
    z.object({ text: z.string().max(500_000), mapping: columnMappingSchema.default({}) }),
    { maxBytes: 4 * 1024 * 1024 },
  );
  const parsed = parseMeasurementPaste(text, mapping);
  const preview = await previewVerdicts(project, parsed.rows);
  return json({ ...preview, errors: parsed.errors, hasHeader: parsed.hasHeader, columns: parsed.columns });
});
