import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { CompareActions } from "@/components/decisions/compare-actions";
import { CompareView } from "@/components/decisions/compare-view";
import { decisionKeys } from "@/components/decisions/types";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { LoadingBox } from "@/components/loading-box";
import { Prefetched } from "@/components/prefetched";
import { ProjectTrail } from "@/components/projects/project-trail";
import type { Project } from "@/db/schema";
import { requireMember } from "@/lib/auth/page";
import { checkProject } from "@/lib/projects/check";
import { listDecisions } from "@/lib/projects/decisions";
import { findProject } from "@/lib/projects/projects";

export const metadata: Metadata = { title: "Compare and decide" };

export default async function ComparePage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requireMember();
  const { id } = await params;
  const project = (await findProject({ workspaceId: member.workspace.id }, id)) ?? notFound();
  const canSign = member.can("decision.sign");

  return (
    <div className="space-y-6">
      <TitleBar
        title="Compare and decide"
        context={
          <>
            <ProjectTrail project={project} />
            {" · "}
            <CrumbLink href={`/projects/${project.id}/decisions`}>Decisions</CrumbLink>
          </>
        }
        actions={<CompareActions projectId={project.id} canSign={canSign} />}
      />
      <Suspense
        fallback={
          <LoadingBox className="h-96">Checking the project: every pulse against every candidate…</LoadingBox>
        }
      >
        <CompareData project={project} canSign={canSign} />
      </Suspense>
    </div>
  );
}

/**
 * The check and the decisions, loaded as their routes load them and handed to the client's queries, so nothing is
 * fetched after hydration. Streamed in the page's response below its title, which is sent before the check is done.
 */
async function CompareData({ project, canSign }: { project: Project; canSign: boolean }) {
  const [check, decisions] = await Promise.all([checkProject(project), listDecisions(project.id)]);
  return (
    <Prefetched
      queries={[
        [decisionKeys.check(project.id), check],
        [decisionKeys.decisions(project.id), { decisions }],
      ]}
    >
      <CompareView projectId={project.id} projectName={project.name} canSign={canSign} />
    </Prefetched>
  );
}
