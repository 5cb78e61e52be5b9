import { desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { projects } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { projectSchema } from "@/lib/projects/schema";
import { createProject } from "@/lib/projects/write";

/** GET /api/projects: the workspace's projects, newest first. */
export const GET = route({ action: "workspace.read" }, async (_req, caller) => {
  const rows = await db
    .select()
    .from(projects)
    .where(eq(projects.workspaceId, caller.workspaceId))
    .orderBy(desc(projects.updatedAt));
  return json({ projects: rows });
});

/** POST /api/projects: a new project; its owner defaults to the creator. */
export const POST = route({ action: "project.write" }, async (req, caller) => {
  const values = await parseBody(req, projectSchema);
  return json({ project: await createProject(caller, values) }, { status: 201 });
});
