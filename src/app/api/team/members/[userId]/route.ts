import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { countManagers, getMembership, lockedRole, lockWorkspace } from "@/db/queries/members";
import { memberships, projects, type Role } from "@/db/schema";
import { forgetCachedAuth } from "@/lib/auth/auth-memory";
import { type MemberCaller, route } from "@/lib/auth/guard";
import { can } from "@/lib/auth/permissions";
import { changeRoleSchema } from "@/lib/auth/schemas";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { isUuid } from "@/lib/uuid";

const manages = (role: Role) => can(role, "member.manage");

async function loadMember(caller: MemberCaller, userId: string) {
  const membership = isUuid(userId) ? await getMembership({ workspaceId: caller.workspaceId, userId }) : null;
  if (!membership) throw new AppError("not_found:member", "No such member in this workspace.");
  return membership;
}

/** The caller's own role, read under the lock: an admin demoted a moment ago may no longer manage members. */
async function assertStillManager(tx: Parameters<typeof lockWorkspace>[0], caller: MemberCaller) {
  const role = await lockedRole(tx, caller.workspaceId, caller.user.id);
  if (!role || !can(role, "member.manage")) {
    throw new AppError("forbidden:member.manage", "Your role in this workspace does not allow this.");
  }
}

/**
 * The member's role, read under the workspace lock: the last-admin rule is checked under it, so two admins demoting
 * or removing each other cannot both win.
 */
async function lockMember(tx: Parameters<typeof lockWorkspace>[0], caller: MemberCaller, userId: string) {
  await lockWorkspace(tx, caller.workspaceId);
  const current = await lockedRole(tx, caller.workspaceId, userId);
  if (!current) throw new AppError("not_found:member", "No such member in this workspace.");
  return current;
}

/**
 * PATCH /api/team/members/:userId: changes a member's role and/or lead rights (an admin may grant lead rights
 * to any member, themself included); the last admin keeps theirs. Answers the previous values, for undo.
 */
export const PATCH = route<{ userId: string }>(
  { action: "member.manage" },
  async (req, caller, { userId }) => {
    const member = await loadMember(caller, userId);
    const body = await parseBody(req, changeRoleSchema);
    const role = body.role ?? member.role;
    const leadRights = body.leadRights ?? member.leadRights;
    await db.transaction(async (tx) => {
      const current = await lockMember(tx, caller, userId);
      // The last member who may manage members (an admin) keeps that role.
      if (manages(current) && !manages(role) && (await countManagers(caller, tx)) <= 1) {
        throw new AppError(
          "conflict:last-admin",
          "A workspace needs at least one admin. Make someone else admin first.",
        );
      }
      await assertStillManager(tx, caller);
      await tx
        .update(memberships)
        .set({ role, leadRights })
        .where(and(eq(memberships.workspaceId, caller.workspaceId), eq(memberships.userId, userId)));
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "membership.role-changed",
          subjectType: "user",
          subjectId: userId,
          details: {
            from: current,
            to: role,
            leadRightsFrom: member.leadRights,
            leadRightsTo: leadRights,
          },
        },
        tx,
      );
    });
    forgetCachedAuth();
    return json({
      status: "ok",
      role,
      leadRights,
      previous: { role: member.role, leadRights: member.leadRights },
    });
  },
);

/**
 * DELETE /api/team/members/:userId: removes a member from the workspace, never the last admin. Projects the member
 * owned pass to the admin who removed them, so their failure notices reach someone who is still a member.
 */
export const DELETE = route<{ userId: string }>(
  { action: "member.manage" },
  async (_req, caller, { userId }) => {
    await loadMember(caller, userId);
    await db.transaction(async (tx) => {
      const current = await lockMember(tx, caller, userId);
      if (manages(current) && (await countManagers(caller, tx)) <= 1) {
        throw new AppError("conflict:last-admin", "The last admin cannot be removed.");
      }
      await assertStillManager(tx, caller);
      await tx
        .update(projects)
        .set({ ownerId: caller.user.id })
        .where(and(eq(projects.workspaceId, caller.workspaceId), eq(projects.ownerId, userId)));
      await tx
        .delete(memberships)
        .where(and(eq(memberships.workspaceId, caller.workspaceId), eq(memberships.userId, userId)));
      await recordAudit(
        {
          workspaceId: caller.workspaceId,
          actorId: caller.user.id,
          action: "membership.removed",
          subjectType: "user",
          subjectId: userId,
          details: { role: current },
        },
        tx,
      );
    });
    forgetCachedAuth();
    return json({ status: "ok" });
  },
);
