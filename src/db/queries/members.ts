import "server-only";
import { and, asc, count, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { memberships, type Role, users, workspaces } from "@/db/schema";
import { noticeColumns } from "@/lib/auth/notice-preferences";
import { rolesAllowed } from "@/lib/auth/permissions";

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

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Locks the workspace's row for the rest of the transaction, so membership changes of one workspace run one at a
 * time: a count of admins read after it stays true until the transaction ends.
 */
export async function lockWorkspace(tx: Tx, workspaceId: string): Promise<void> {
  await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.id, workspaceId)).for("update");
}

/** The member's role read under the workspace lock, or null when they are no longer a member. */
export async function lockedRole(tx: Tx, workspaceId: string, userId: string): Promise<Role | null> {
  const [row] = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)));
  return row?.role ?? null;
}

/** How many members may manage members (`member.manage`): a workspace never drops to none. */
export async function countManagers(
  { workspaceId }: { workspaceId: string },
  client: Tx | typeof db = db,
): Promise<number> {
  const [row] = await client
    .select({ n: count() })
    .from(memberships)
    .where(
      and(eq(memberships.workspaceId, workspaceId), inArray(memberships.role, rolesAllowed("member.manage"))),
    );
  return row?.n ?? 0;
}

export function findUserByEmail(email: string) {
  return db.query.users.findFirst({ where: eq(users.email, email.trim().toLowerCase()) });
}

/**
 * Of these people, the current members of the workspace whose choice (the Account page) allows this optional
 * e-mail: a notice goes to no one else.
 */
export function noticeRecipients({
  workspaceId,
  userIds,
  notice,
}: {
  workspaceId: string;
  userIds: string[];
  notice: keyof typeof noticeColumns;
}) {
  return db
    .select({ id: users.id, email: users.email })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.workspaceId, workspaceId)))
    .where(and(inArray(users.id, userIds), eq(noticeColumns[notice], true)));
}
