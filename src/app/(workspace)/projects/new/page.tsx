import type { Metadata } from "next";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { emptyProject, ProjectForm } from "@/components/projects/project-form";
import { requireAction } from "@/lib/auth/page";
import { ownerChoices } from "@/lib/projects/owner-choices";

export const metadata: Metadata = { title: "New project" };

export default async function NewProjectPage() {
  const member = await requireAction("project.write");
  const owners = await ownerChoices(member.workspace.id, member.user.id);
  return (
    <div className="space-y-5">
      <TitleBar
        title="New project"
        context={
          <>
            <CrumbLink href="/projects">Projects</CrumbLink> · {member.workspace.name}
          </>
        }
      />
      <p className="text-sm text-ink-muted">
        Name the design and the case temperature to assume. Candidate parts, fault cases and bench
        measurements are added on the project&apos;s page next.
      </p>
      <ProjectForm defaults={emptyProject} owners={owners} />
    </div>
  );
}
