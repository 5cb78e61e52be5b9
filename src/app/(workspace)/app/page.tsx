import type { Metadata } from "next";
import Link from "next/link";
import { Caution } from "@/components/caution";
import { PageHeader, Section } from "@/components/page-header";
import { roleSummaries } from "@/components/role-text";
import { StatBlocks } from "@/components/stat-blocks";
import { listPendingInvitations } from "@/db/queries/invitations";
import { listPartsAwaitingVerification, listRecentProjects } from "@/db/queries/overview";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireMember } from "@/lib/auth/page";
import { roleHasLeadRights, roleLabels } from "@/lib/auth/permissions";
import { nextStep } from "./next-step";
import { RecentWork } from "./recent-work";
import { RoleAbilities } from "./role-abilities";
import { SampleProjectButton } from "./sample-project-button";

export const metadata: Metadata = { title: "Overview" };

export default async function OverviewPage() {
  const member = await requireMember();
  const workspaceId = member.workspace.id;
  const mayInvite = member.can("member.invite");
  const [members, invitations, recent, awaiting] = await Promise.all([
    rememberedMembers(workspaceId),
    mayInvite ? listPendingInvitations({ workspaceId }) : Promise.resolve(null),
    listRecentProjects({ workspaceId }),
    listPartsAwaitingVerification({ workspaceId }),
  ]);
  const openFindings = awaiting.reduce((sum, p) => sum + p.findings, 0);
  const step = nextStep(member, { projects: recent, awaiting });
  const roleName = `${roleLabels[member.role]}${member.leadRights && !roleHasLeadRights(member.role) ? " with lead rights" : ""}`;

  const stats = [
    { label: "Your role", value: roleName },
    { label: "Open projects", value: recent.length },
    { label: "Parts awaiting verification", value: awaiting.length },
    { label: "Open findings", value: openFindings },
    { label: "Members", value: members.length },
    ...(invitations ? [{ label: "Pending invitations", value: invitations.length }] : []),
  ];

  return (
    <div className="space-y-8">
      <PageHeader title="Overview" context={member.workspace.name} />
      <StatBlocks items={stats} />

      <section
        aria-labelledby="next-step"
        className="flex flex-col gap-3 rounded-md border border-line border-l-2 border-l-accent bg-panel px-4 py-3 sm:flex-row sm:items-center sm:justify-between"
      >
        <div>
          <h2 id="next-step" className="text-sm font-semibold">
            Next step
          </h2>
          <p className="mt-0.5 text-sm text-ink-muted">{step.text}</p>
        </div>
        {step.sample ? (
          <div className="flex shrink-0 flex-wrap items-start gap-2">
            <SampleProjectButton />
            <Link
              href="/projects/new"
              className="inline-flex h-9 items-center rounded-md border border-line-strong px-4 text-sm font-medium hover:bg-sunken max-md:min-h-11"
            >
              New project
            </Link>
          </div>
        ) : step.link ? (
          <Link
            href={step.link.href}
            className="inline-flex h-9 shrink-0 items-center self-start rounded-md bg-accent px-4 text-sm font-medium text-white hover:bg-accent-strong max-md:min-h-11 sm:self-auto"
          >
            {step.link.label}
          </Link>
        ) : null}
      </section>

      <RecentWork
        projects={recent}
        awaiting={awaiting}
        mayAddSample={member.can("project.write") && recent.length > 0}
      />

      {mayInvite && members.length === 1 ? (
        <div className="flex flex-col gap-3 rounded-md border border-line bg-accent-soft px-4 py-3 sm:flex-row sm:items-center sm:justify-between">
          <p className="text-sm">
            You are the only member so far. Invite the engineers, technicians and leads who review designs
            with you.
          </p>
          <Link
            href="/team"
            className="inline-flex h-8 shrink-0 items-center self-start rounded-md bg-accent px-3 text-sm font-medium text-white hover:bg-accent-strong max-md:min-h-11 sm:self-auto"
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
        <RoleAbilities role={member.role} leadRights={member.leadRights} />
      </Section>

      <Caution className="border-t border-line pt-4" />
    </div>
  );
}
