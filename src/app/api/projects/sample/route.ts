import { route } from "@/lib/auth/guard";
import { addSampleProject } from "@/lib/demo/sample-project";
import { json } from "@/lib/http";
import { storage } from "@/lib/storage";

/** POST /api/projects/sample: adds the invented sample project (and its sample parts) to the workspace. */
export const POST = route({ action: "project.write" }, async (_req, caller) => {
  const project = await addSampleProject(storage(), {
    workspaceId: caller.workspaceId,
    userId: caller.user.id,
    userName: caller.user.name,
  });
  return json({ project }, { status: 201 });
});
