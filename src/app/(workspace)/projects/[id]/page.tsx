import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { type ComponentProps, Suspense } from "react";
import { linkButtonClass } from "@/components/form";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { LoadingBox } from "@/components/loading-box";
import { Prefetched } from "@/components/prefetched";
import { projectKeys } from "@/components/projects/api";
import { ProjectWorkspace } from "@/components/projects/project-workspace";
import type { Project } from "@/db/schema";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireMember } from "@/lib/auth/page";
import { checkProject } from "@/lib/projects/check";
import { projectDetail } from "@/lib/projects/detail";
import { findProject } from "@/lib/projects/projects";

export const metadata: Metadata = { title: "Project" };

export default async function ProjectPage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requireMember();
  const { id } = await params;
  const project = (await findProject({ workspaceId: member.workspace.id }, id)) ?? notFound();
  const members = await rememberedMembers(member.workspace.id);
  const owner = members.find((m) => m.userId === project.ownerId);
  const canWrite = member.can("project.write");

  return (
    <div className="space-y-6">
      <TitleBar
        title={project.name}
        context={
          <>
            <CrumbLink href="/projects">Projects</CrumbLink>
            {owner ? ` · owner ${owner.name}` : ""}
          </>
        }
        actions={
          <>
            <Link href={`/projects/${project.id}/compare`} className={linkButtonClass}>
              Compare and decide
            </Link>
            <Link href={`/projects/${project.id}/decisions`} className={linkButtonClass}>
              Decisions
            </Link>
            {canWrite ? (
              <Link href={`/projects/${project.id}/settings`} className={linkButtonClass}>
                Settings
              </Link>
            ) : null}
          </>
        }
      />
      {project.archivedAt ? (
        <p className="rounded-md border border-line border-l-2 border-l-nodata bg-sunken px-3 py-2 text-sm">
          This project is archived: it is out of the projects list and kept for the record.
        </p>
      ) : null}
      {project.description ? (
        <p className="max-w-3xl text-sm whitespace-pre-line text-ink-muted">{project.description}</p>
      ) : null}
      <Suspense
        fallback={
          <LoadingBox className="h-64">
            Loading the project: candidates, fault cases and measured pulses…
          </LoadingBox>
        }
      >
        <ProjectData
          project={project}
          viewer={{ id: member.user.id, managesMeasurements: member.can("measurement.manage") }}
          canWrite={canWrite}
          canMeasure={member.can("measurement.write")}
          people={members.map((m) => ({ id: m.userId, name: m.name }))}
        />
      </Suspense>
    </div>
  );
}

/**
 * The project and its check, loaded as their routes load them and handed to the client's queries, so nothing is
 * fetched after hydration. Streamed in the page's response below its title, which is sent before the check is done.
 */
async function ProjectData({
  project,
  ...props
}: { project: Project } & Omit<ComponentProps<typeof ProjectWorkspace>, "projectId">) {
  const { detail, candidates } = await projectDetail(project);
  const check = await checkProject(project, {
    candidates,
    faultCases: detail.faultCases,
    measured: detail.measuredPulses,
  });
  return (
    <Prefetched
      queries={[
        [projectKeys.detail(project.id), detail],
        [projectKeys.check(project.id), check],
      ]}
    >
      <ProjectWorkspace projectId={project.id} {...props} />
    </Prefetched>
  );
}
