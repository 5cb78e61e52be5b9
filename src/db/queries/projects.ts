import "server-only";
import { count, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { projectCandidates, projects } from "@/db/schema";

/** The workspace's projects, most recently changed first, with how many candidates each compares. */
export async function listProjectRows(workspaceId: string) {
  const rows = await db
    .select()
    .from(projects)
    .where(eq(projects.workspaceId, workspaceId))
    .orderBy(desc(projects.updatedAt));
  const counts = rows.length
    ? await db
        .select({ projectId: projectCandidates.projectId, candidates: count() })
        .from(projectCandidates)
        .where(
          inArray(
            projectCandidates.projectId,
            rows.map((r) => r.id),
          ),
        )
        .groupBy(projectCandidates.projectId)
    : [];
  const byProject = new Map(counts.map((c) => [c.projectId, c.candidates]));
  return rows.map((r) => ({ ...r, candidates: byProject.get(r.id) ?? 0 }));
}
