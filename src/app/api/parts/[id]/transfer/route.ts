import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadPart } from "@/lib/library/parts";
import { clearTransfer, setTransfer } from "@/lib/library/transfer";
import { transferBodySchema } from "./schema";

/** PUT /api/parts/:id/transfer { text, fileName? }: the part's transfer characteristics at two temperatures. */
export const PUT = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const body = await parseBody(req, transferBodySchema);
  const { part: updated, findings } = await setTransfer(caller, part, body);
  return json({ transfer: updated.transfer, findings, status: updated.status });
});

/** DELETE /api/parts/:id/transfer: removes them. */
export const DELETE = route<{ id: string }>({ action: "part.write" }, async (_req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const updated = await clearTransfer(caller, part);
  return json({ transfer: updated.transfer, status: updated.status });
});
