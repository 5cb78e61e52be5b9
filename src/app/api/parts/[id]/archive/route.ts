import { z } from "zod";
import { setArchived } from "@/lib/archive";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadPart } from "@/lib/library/parts";

/** POST /api/parts/:id/archive { archived }: hides a part from the library (kept for history) or brings it back. */
export const POST = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const { archived } = await parseBody(req, z.object({ archived: z.boolean() }));
  await setArchived(caller, "part", part.id, archived);
  return json({ status: "ok", archived });
});
