import type { Metadata } from "next";
import Link from "next/link";
import { TitleBar } from "@/components/library/title-bar";
import { emptyProject, ProjectForm } from "@/components/projects/project-form";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireAction } from "@/lib/auth/page";
import { can, roleLabels } from "@/lib/auth/permissions";

export const metadata: Metadata = { title: "New project" };

export default async function NewProjectPage() {
  const member = await requireAction("project.write");
  const members = await rememberedMembers(member.workspace.id);
  const owners = members
    .filter((m) => can(m.role, "project.own") && m.userId !== member.user.id)
    .map((m) => ({ id: m.userId, name: m.name, role: roleLabels[m.role].toLowerCase() }));
  return (
    <div className="space-y-5">
      <TitleBar
        title="New project"
        context={
          <>
            <Link href="/projects" className="hover:text-ink hover:underline">
              Projects
            </Link>{" "}
            · {member.workspace.name}
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
