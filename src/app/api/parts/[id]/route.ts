import { getActiveCurveSet, listCurveSets } from "@/db/queries/parts";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { partSchema } from "@/lib/library/part-schema";
import { loadPart, updatePart } from "@/lib/library/parts";

/** GET /api/parts/:id: the part, its curve sets (revisions) and the active set's curves and findings. */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const [curveSets, active] = await Promise.all([
    listCurveSets({ partId: part.id }),
    getActiveCurveSet({ partId: part.id }),
  ]);
  return json({ part, curveSets, activeCurveSet: active });
});

/** PATCH /api/parts/:id: edits the part; a change to a rating a check uses returns it to draft. */
export const PATCH = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const values = await parseBody(req, partSchema);
  return json({ part: await updatePart(caller, part, values) });
});
