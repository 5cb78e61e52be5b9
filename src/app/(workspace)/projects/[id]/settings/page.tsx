import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { PageSkeleton } from "@/app/(workspace)/_components/page-skeleton";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { Section } from "@/components/page-header";
import { ArchiveProject } from "@/components/projects/archive-project";
import { ProjectForm } from "@/components/projects/project-form";
import type { Project } from "@/db/schema";
import { type PageMember, requireAction } from "@/lib/auth/page";
import { editable, plainSpaces, q } from "@/lib/format";
import { ownerChoices } from "@/lib/projects/owner-choices";
import { findProject } from "@/lib/projects/projects";

export const metadata: Metadata = { title: "Project settings" };

export default async function ProjectSettingsPage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requireAction("project.write");
  const { id } = await params;
  const project = (await findProject({ workspaceId: member.workspace.id }, id)) ?? notFound();
  // Found (or 404 above, answered before anything streams): the rest loads behind a loading state.
  return (
    <Suspense fallback={<PageSkeleton>Loading the project settings…</PageSkeleton>}>
      <ProjectSettingsView member={member} project={project} />
    </Suspense>
  );
}

async function ProjectSettingsView({ member, project }: { member: PageMember; project: Project }) {
  const owners = await ownerChoices(member.workspace.id);
  return (
    <div className="space-y-8">
      <TitleBar
        title="Project settings"
        context={
          <>
            <CrumbLink href="/projects">Projects</CrumbLink> ·{" "}
            <CrumbLink href={`/projects/${project.id}`}>{project.name}</CrumbLink>
          </>
        }
      />
      <ProjectForm
        projectId={project.id}
        owners={owners}
        defaults={{
          name: project.name,
          description: project.description ?? "",
          caseTemp: editable(project.caseTemp, "plain"),
          utilisationLimit: editable(project.utilisationLimit * 100, "plain", 6),
          tjGuard: editable(project.tjGuard, "plain"),
          voltageLimit: editable(project.voltageLimit * 100, "plain", 6),
          betweenCurves: project.betweenCurves,
          ownerId: project.ownerId ?? "",
          caseNetwork: (project.caseNetwork ?? [])
            .map((t) => `${editable(t.r, "plain", 6)}, ${plainSpaces(q(t.tau, "s", 6))}`)
            .join("\n"),
          applyCaseNetwork: project.applyCaseNetwork,
        }}
      />
      <Section
        id="archive"
        title={project.archivedAt ? "Archived" : "Archive"}
        description={
          project.archivedAt
            ? "This project is archived: it is out of the projects list and kept as it was for the record."
            : "Archiving takes the project out of the projects list; nothing is deleted and it can be restored."
        }
      >
        <ArchiveProject projectId={project.id} archived={project.archivedAt !== null} />
      </Section>
    </div>
  );
}
