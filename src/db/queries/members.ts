import "server-only";
import { and, asc, count, eq } from "drizzle-orm";
import { db } from "@/db";
import { memberships, type Role, users, workspaces } from "@/db/schema";

export async function getMembership({ workspaceId, userId }: { workspaceId: string; userId: string }) {
  const [row] = await db
    .select({
      role: memberships.role,
      leadRights: memberships.leadRights,
      workspaceName: workspaces.name,
      workspaceId: workspaces.id,
    })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)));
  return row ?? null;
}

/** The workspaces a user belongs to, for the switcher. */
export function listUserWorkspaces({ userId }: { userId: string }) {
  return db
    .select({ id: workspaces.id, name: workspaces.name, role: memberships.role })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(workspaces.name));
}

export function listMembers({ workspaceId }: { workspaceId: string }) {
  return db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      leadRights: memberships.leadRights,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.workspaceId, workspaceId))
    .orderBy(asc(users.name));
}

export async function countAdmins({ workspaceId }: { workspaceId: string }): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "admin" satisfies Role)));
  return row?.n ?? 0;
}

export function findUserByEmail(email: string) {
  return db.query.users.findFirst({ where: eq(users.email, email.trim().toLowerCase()) });
}
