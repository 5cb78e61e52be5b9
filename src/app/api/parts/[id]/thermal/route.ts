import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { fosterSchema } from "@/lib/library/part-schema";
import { loadPart, setThermalModel } from "@/lib/library/parts";

/** PUT /api/parts/:id/thermal { terms: [{ r, tau }] }: the typed Foster network (junction to case). */
export const PUT = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const { terms } = await parseBody(req, fosterSchema);
  const updated = await setThermalModel(caller, part, terms, { kind: "typed" });
  return json({ foster: updated.foster, thermalSource: updated.thermalSource, status: updated.status });
});
