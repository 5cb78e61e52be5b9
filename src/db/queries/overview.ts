import "server-only";
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { curveSets, parts, projects } from "@/db/schema";

/** The overview's recent work: the open projects changed last. */
export function listRecentProjects({ workspaceId, limit = 5 }: { workspaceId: string; limit?: number }) {
  return db
    .select({ id: projects.id, name: projects.name, updatedAt: projects.updatedAt })
    .from(projects)
    .where(and(eq(projects.workspaceId, workspaceId), isNull(projects.archivedAt)))
    .orderBy(desc(projects.updatedAt))
    .limit(limit);
}

/**
 * Library parts still in draft (awaiting a lead's verification), with the findings of their active curve set:
 * the open findings a verifier must accept or have fixed.
 */
export function listPartsAwaitingVerification({ workspaceId }: { workspaceId: string }) {
  return db
    .select({
      id: parts.id,
      partNumber: parts.partNumber,
      maker: parts.maker,
      findings: sql<number>`coalesce(jsonb_array_length(${curveSets.findings}), 0)`.mapWith(Number),
    })
    .from(parts)
    .leftJoin(curveSets, and(eq(curveSets.partId, parts.id), eq(curveSets.active, true)))
    .where(and(eq(parts.workspaceId, workspaceId), eq(parts.status, "draft"), isNull(parts.archivedAt)))
    .orderBy(desc(parts.updatedAt));
}
