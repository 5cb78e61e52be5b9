import type { Metadata } from "next";
import Link from "next/link";
import { Caution } from "@/components/caution";
import { PageHeader, Section } from "@/components/page-header";
import { roleSummaries } from "@/components/role-text";
import { StatBlocks } from "@/components/stat-blocks";
import { listPendingInvitations } from "@/db/queries/invitations";
import { listMembers } from "@/db/queries/members";
import { requireMember } from "@/lib/auth/page";
import { roleLabels } from "@/lib/auth/permissions";
import { RoleAbilities } from "./role-abilities";

export const metadata: Metadata = { title: "Overview" };

export default async function OverviewPage() {
  const member = await requireMember();
  const workspaceId = member.workspace.id;
  const mayInvite = member.can("member.invite");
  const [members, invitations] = await Promise.all([
    listMembers({ workspaceId }),
    mayInvite ? listPendingInvitations({ workspaceId }) : Promise.resolve(null),
  ]);

  const stats = [
    { label: "Your role", value: roleLabels[member.role] },
    { label: "Members", value: members.length },
    ...(invitations ? [{ label: "Pending invitations", value: invitations.length }] : []),
    { label: "Your workspaces", value: member.workspaces.length },
  ];

  return (
    <div className="space-y-8">
      <PageHeader title="Overview" context={member.workspace.name} />
      <StatBlocks items={stats} />

      {mayInvite && members.length === 1 ? (
        <div className="flex items-center justify-between gap-4 rounded-md border border-line bg-accent-soft px-4 py-3">
          <p className="text-sm">
            You are the only member so far. Invite the engineers, technicians and leads who review designs
            with you.
          </p>
          <Link
            href="/team"
            className="inline-flex h-8 shrink-0 items-center rounded-md bg-accent px-3 text-sm font-medium text-white hover:bg-accent-strong"
          >
            Invite people
          </Link>
        </div>
      ) : null}

      <Section
        id="abilities"
        title={`What you can do here as ${roleLabels[member.role].toLowerCase()}`}
        description={roleSummaries[member.role]}
      >
        <RoleAbilities role={member.role} />
      </Section>

      <Caution className="border-t border-line pt-4" />
    </div>
  );
}
