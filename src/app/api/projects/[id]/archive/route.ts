import { z } from "zod";
import { setArchived } from "@/lib/archive";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadProject } from "@/lib/projects/projects";

/** POST /api/projects/:id/archive { archived }: archives a project (kept read-only for history) or restores it. */
export const POST = route<{ id: string }>({ action: "project.write" }, async (req, caller, { id }) => {
  const project = await loadProject(caller, id);
  const { archived } = await parseBody(req, z.object({ archived: z.boolean() }));
  await setArchived(caller, "project", project.id, archived);
  return json({ status: "ok", archived });
});
