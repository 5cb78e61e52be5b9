import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { presignUpload } from "@/lib/library/curve-upload";
import { loadPart } from "@/lib/library/parts";
import { storage } from "@/lib/storage";

const ticketSchema = z.object({
  fileName: z.string().trim().min(1).max(200),
  size: z.number().int().min(1, { message: "The file is empty" }),
  purpose: z.enum(["curve-set", "zth"]),
});

/** POST /api/parts/:id/uploads: a presigned PUT URL so the browser sends the file straight to storage. */
export const POST = route<{ id: string }>({ action: "part.write" }, async (req, caller, { id }) => {
  const part = await loadPart(caller, id);
  const input = await parseBody(req, ticketSchema);
  const ticket = await presignUpload(storage(), {
    ...input,
    workspaceId: caller.workspaceId,
    userId: caller.user.id,
    owner: `parts/${part.id}`,
  });
  return json(ticket, { status: 201 });
});
