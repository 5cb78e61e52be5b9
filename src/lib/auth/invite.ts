import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { invitations, memberships, type Role, users, workspaces } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { enqueueMail, flushOutbox } from "@/lib/mail/outbox";
import { invitationMail } from "@/lib/mail/templates";
import { linkLifetimeMs } from "./accounts";
import type { MemberCaller } from "./guard";
import { assignableRoles, roleLabels } from "./permissions";
import { hashToken, randomToken } from "./tokens";

export function assertMayAssign(caller: MemberCaller, role: Role): void {
  if (!assignableRoles(caller.role).includes(role)) {
    throw new AppError(
      "forbidden:role",
      `A ${roleLabels[caller.role].toLowerCase()} cannot hand out the ${role} role.`,
    );
  }
}

/**
 * Creates (or renews) an invitation with a fresh single-use token and puts its e-mail in the outbox, in one
 * transaction: the new link and its e-mail exist together, and the outbox delivers it once mail works.
 */
export async function sendInvitation(
  caller: MemberCaller,
  input: { email: string; role: Role; replaceId?: string },
) {
  assertMayAssign(caller, input.role);
  const alreadyMember = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, caller.workspaceId), eq(users.email, input.email)));
  if (alreadyMember.length) throw new AppError("conflict:member", `${input.email} is already a member.`);

  const token = randomToken();
  const invitation = await db.transaction(async (tx) => {
    // One open invitation per address: a new one (or a resend) replaces any still pending.
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(
        and(
          eq(invitations.workspaceId, caller.workspaceId),
          eq(invitations.email, input.email),
          isNull(invitations.acceptedAt),
          isNull(invitations.revokedAt),
        ),
      );
    const [row] = await tx
      .insert(invitations)
      .values({
        workspaceId: caller.workspaceId,
        email: input.email,
        role: input.role,
        tokenHash: hashToken(token),
        invitedBy: caller.user.id,
        expiresAt: new Date(Date.now() + linkLifetimeMs),
      })
      .returning({ id: invitations.id, email: invitations.email, role: invitations.role });
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: input.replaceId ? "invitation.resent" : "invitation.created",
        subjectType: "invitation",
        subjectId: row.id,
        details: { email: input.email, role: input.role },
      },
      tx,
    );
    const [workspace] = await tx
      .select({ name: workspaces.name })
      .from(workspaces)
      .where(eq(workspaces.id, caller.workspaceId));
    await enqueueMail(
      invitationMail({
        to: input.email,
        workspaceName: workspace.name,
        inviterName: caller.user.name,
        role: roleLabels[input.role].toLowerCase(),
        link: `${env().APP_URL}/invite/${token}`,
      }),
      { kind: "invitation", workspaceId: caller.workspaceId },
      tx,
    );
    return row;
  });
  await flushOutbox();
  return invitation;
}
