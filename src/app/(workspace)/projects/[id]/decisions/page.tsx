import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { PageSkeleton } from "@/app/(workspace)/_components/page-skeleton";
import { AuditList } from "@/components/decisions/audit-list";
import { DecisionHistory } from "@/components/decisions/decision-history";
import { linkButtonClass } from "@/components/form";
import { TitleBar } from "@/components/library/title-bar";
import { Section } from "@/components/page-header";
import { ProjectTrail } from "@/components/projects/project-trail";
import type { Project } from "@/db/schema";
import { type PageMember, requireMember } from "@/lib/auth/page";
import { listDecisions } from "@/lib/projects/decisions";
import { findProject } from "@/lib/projects/projects";

export const metadata: Metadata = { title: "Decisions" };

export default async function DecisionsPage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requireMember();
  const { id } = await params;
  const project = (await findProject({ workspaceId: member.workspace.id }, id)) ?? notFound();
  // Found (or 404 above, answered before anything streams): the rest loads behind a loading state.
  return (
    <Suspense fallback={<PageSkeleton>Loading the project's decisions…</PageSkeleton>}>
      <DecisionsView member={member} project={project} />
    </Suspense>
  );
}

async function DecisionsView({ member, project }: { member: PageMember; project: Project }) {
  const decisions = await listDecisions(project.id);
  const canSign = member.can("decision.sign");

  return (
    <div className="space-y-8">
      <TitleBar
        title="Decisions"
        context={<ProjectTrail project={project} />}
        actions={
          <Link href={`/projects/${project.id}/compare`} className={linkButtonClass}>
            Compare and decide
          </Link>
        }
      />

      <Section
        id="history"
        title="Decision history"
        description="Newest first. A decision is never edited: a later one supersedes it, and each keeps the evaluation it was signed on."
      >
        {decisions.length === 0 ? (
          <div className="rounded-md border border-line bg-panel px-4 py-8 text-center text-sm text-ink-muted">
            <p>No decision has been recorded for this project yet.</p>
            <p className="mt-2">
              {canSign ? (
                <Link
                  href={`/projects/${project.id}/compare?decide=1`}
                  className="text-accent underline underline-offset-2"
                >
                  Compare the candidates and record the decision
                </Link>
              ) : (
                "A lead records it from the comparison of the candidates."
              )}
            </p>
          </div>
        ) : (
          <DecisionHistory projectId={project.id} decisions={decisions} />
        )}
      </Section>

      {member.can("audit.read") ? (
        <Section
          id="audit"
          title="Project history"
          description="Who changed the project's fault cases, measurements, candidates and decisions, and when."
        >
          <AuditList projectId={project.id} />
        </Section>
      ) : null}
    </div>
  );
}
