import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { MAX_TRANSFER_BYTES } from "@/lib/csv/transfer";
import { json, parseBody } from "@/lib/http";
import { loadPart } from "@/lib/library/parts";
import { clearTransfer, setTransfer } from "@/lib/library/transfer";

/** The transfer table as text (typed, pasted or read from a CSV file in the browser) and the file's name. */
const transferBodySchema = z.object({
  text: z.string().max(MAX_TRANSFER_BYTES, { message: "At most 256 KiB of text" }),
  fileName: z.string().trim().min(1).max(200).optional(),
});

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
