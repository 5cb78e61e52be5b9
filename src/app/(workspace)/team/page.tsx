import type { Metadata } from "next";
import { PageHeader, Section } from "@/components/page-header";
import { StatBlocks } from "@/components/stat-blocks";
import { listPendingInvitations } from "@/db/queries/invitations";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireAction } from "@/lib/auth/page";
import { assignableRoles, can } from "@/lib/auth/permissions";
import { InvitationsTable } from "./invitations-table";
import { InviteForm } from "./invite-form";
import { MembersTable } from "./members-table";
import { OutboxSection } from "./outbox-section";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage() {
  const member = await requireAction("member.invite");
  const workspaceId = member.workspace.id;
  const [members, invitations] = await Promise.all([
    rememberedMembers(workspaceId),
    listPendingInvitations({ workspaceId }),
  ]);
  const mayManage = member.can("member.manage");
  const grantable = assignableRoles(member.role);
  const admins = members.filter((m) => can(m.role, "member.manage")).length;

  return (
    <div className="space-y-8">
      <PageHeader title="Team" context={member.workspace.name} />
      <StatBlocks
        items={[
          { label: "Members", value: members.length },
          { label: "Admins", value: admins },
          { label: "Pending invitations", value: invitations.length },
        ]}
      />

      <Section
        id="members"
        title="Members"
        description={
          mayManage
            ? "Change a role in its column (you confirm, and can undo); lead rights let any member, you included, verify parts and sign decisions. A workspace always keeps at least one admin."
            : "Only an admin changes roles or removes members."
        }
      >
        <MembersTable
          members={[...members]}
          selfId={member.user.id}
          mayManage={mayManage}
          roleOptions={grantable}
        />
      </Section>

      <Section
        id="invite"
        title="Invite someone"
        description="The invitation goes out by e-mail with a link to join."
      >
        <InviteForm roles={grantable} />
      </Section>

      <Section
        id="invitations"
        title="Pending invitations"
        description="Each link works once and expires 7 days after it was sent. Resending makes a new link."
      >
        <InvitationsTable invitations={invitations} />
      </Section>

      {mayManage ? <OutboxSection workspaceId={workspaceId} /> : null}
    </div>
  );
}
