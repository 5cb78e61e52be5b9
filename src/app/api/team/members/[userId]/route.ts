import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { countAdmins, getMembership } from "@/db/queries/members";
import { memberships } from "@/db/schema";
import { type MemberCaller, route } from "@/lib/auth/guard";
import { changeRoleSchema } from "@/lib/auth/schemas";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";
import { isUuid } from "@/lib/uuid";

async function loadMember(caller: MemberCaller, userId: string) {
  const membership = isUuid(userId) ? await getMembership({ workspaceId: caller.workspaceId, userId }) : null;
  if (!membership) throw new AppError("not_found:member", "No such member in this workspace.");
  return membership;
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
    if (member.role === "admin" && role !== "admin" && (await countAdmins(caller)) <= 1) {
      throw new AppError(
        "conflict:last-admin",
        "A workspace needs at least one admin. Make someone else admin first.",
      );
    }
    await db.transaction(async (tx) => {
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
            from: member.role,
            to: role,
            leadRightsFrom: member.leadRights,
            leadRightsTo: leadRights,
          },
        },
        tx,
      );
    });
    return json({
      status: "ok",
      role,
      leadRights,
      previous: { role: member.role, leadRights: member.leadRights },
    });
  },
);

/** DELETE /api/team/members/:userId: removes a member from the workspace, never the last admin. */
export const DELETE = route<{ userId: string }>(
  { action: "member.manage" },
  async (_req, caller, { userId }) => {
    const member = await loadMember(caller, userId);
    if (member.role === "admin" && (await countAdmins(caller)) <= 1) {
      throw new AppError("conflict:last-admin", "The last admin cannot be removed.");
    }
    await db.transaction(async (tx) => {
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
          details: { role: member.role },
        },
        tx,
      );
    });
    return json({ status: "ok" });
  },
);
