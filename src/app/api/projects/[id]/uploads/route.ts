import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { MAX_CAPTURE_BYTES } from "@/lib/capture/parse";
import { json, parseBody } from "@/lib/http";
import { presignUpload } from "@/lib/library/curve-upload";
import { loadWritableProject } from "@/lib/projects/projects";
import { storage } from "@/lib/storage";

const ticketSchema = z.object({
  fileName: z.string().trim().min(1).max(200),
  size: z.number().int().min(1, { message: "The file is empty" }),
  purpose: z.literal("capture"),
});

/** POST /api/projects/:id/uploads { fileName, size, purpose }: a presigned PUT URL for a scope capture CSV. */
export const POST = route<{ id: string }>({ action: "measurement.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const input = await parseBody(req, ticketSchema);
  const ticket = await presignUpload(storage(), {
    ...input,
    workspaceId: caller.workspaceId,
    userId: caller.user.id,
    owner: `projects/${project.id}`,
    maxBytes: MAX_CAPTURE_BYTES,
  });
  return json(ticket, { status: 201 });
});
