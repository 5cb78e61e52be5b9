import type { Metadata } from "next";
import { PageHeader, Section } from "@/components/page-header";
import { StatBlocks } from "@/components/stat-blocks";
import { EmptyRow, Table, Th } from "@/components/table";
import { listPendingInvitations } from "@/db/queries/invitations";
import { listMembers } from "@/db/queries/members";
import { requireAction } from "@/lib/auth/page";
import { assignableRoles } from "@/lib/auth/permissions";
import { InvitationRow } from "./invitation-row";
import { InviteForm } from "./invite-form";
import { MemberRow } from "./member-row";
import { OutboxSection } from "./outbox-section";

export const metadata: Metadata = { title: "Team" };

export default async function TeamPage() {
  const member = await requireAction("member.invite");
  const workspaceId = member.workspace.id;
  const [members, invitations] = await Promise.all([
    listMembers({ workspaceId }),
    listPendingInvitations({ workspaceId }),
  ]);
  const mayManage = member.can("member.manage");
  const grantable = assignableRoles(member.role);
  const admins = members.filter((m) => m.role === "admin").length;

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
        <Table label="Members">
          <thead>
            <tr>
              <Th>Name</Th>
              <Th>E-mail</Th>
              <Th className="w-40">Role</Th>
              <Th numeric className="w-28">
                Joined (UTC)
              </Th>
              {mayManage ? (
                <Th className="w-56">
                  <span className="sr-only">Actions</span>
                </Th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <MemberRow
                key={m.userId}
                member={m}
                isSelf={m.userId === member.user.id}
                mayManage={mayManage}
                roleOptions={grantable}
              />
            ))}
          </tbody>
        </Table>
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
        <Table label="Pending invitations">
          <thead>
            <tr>
              <Th>E-mail</Th>
              <Th className="w-40">Role</Th>
              <Th className="w-48">Invited by</Th>
              <Th numeric className="w-28">
                Sent (UTC)
              </Th>
              <Th numeric className="w-28">
                Expires (UTC)
              </Th>
              <Th className="w-44">
                <span className="sr-only">Actions</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {invitations.length === 0 ? (
              <EmptyRow colSpan={6}>No pending invitations. Invite someone with the form above.</EmptyRow>
            ) : (
              invitations.map((invitation) => <InvitationRow key={invitation.id} invitation={invitation} />)
            )}
          </tbody>
        </Table>
      </Section>

      {mayManage ? <OutboxSection workspaceId={workspaceId} /> : null}
    </div>
  );
}
