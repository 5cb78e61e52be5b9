import { and, desc, eq, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { auditEvents, users } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json } from "@/lib/http";
import { loadProject } from "@/lib/projects/projects";

/** GET /api/projects/:id/audit: the project's history (fault cases, measurements, decisions: who and when). */
export const GET = route<{ id: string }>({ action: "audit.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  const events = await db
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      details: auditEvents.details,
      createdAt: auditEvents.createdAt,
      actor: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(
      and(
        eq(auditEvents.workspaceId, caller.workspaceId),
        or(
          and(eq(auditEvents.subjectType, "project"), eq(auditEvents.subjectId, project.id)),
          sql`${auditEvents.details}->>'projectId' = ${project.id}`,
        ),
      ),
    )
    .orderBy(desc(auditEvents.createdAt))
    .limit(500);
  return json({ events });
});
