import type { Metadata } from "next";
import Link from "next/link";
import { TitleBar } from "@/components/library/title-bar";
import { NewProjectLink, ProjectTable } from "@/components/projects/project-table";
import { listProjectRows } from "@/db/queries/projects";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireMember } from "@/lib/auth/page";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage({
  searchParams,
}: {
  searchParams: Promise<{ archived?: string }>;
}) {
  const member = await requireMember();
  const showArchived = (await searchParams).archived === "true";
  const [rows, members] = await Promise.all([
    listProjectRows(member.workspace.id),
    rememberedMembers(member.workspace.id),
  ]);
  const names = new Map(members.map((m) => [m.userId, m.name]));
  const canWrite = member.can("project.write");
  const archived = rows.filter((r) => r.archivedAt !== null).length;
  const shown = rows
    .filter((r) => (r.archivedAt !== null) === showArchived)
    .map((r) => ({
      id: r.id,
      name: r.name,
      description: r.description,
      caseTemp: r.caseTemp,
      utilisationLimit: r.utilisationLimit,
      candidates: r.candidates,
      owner: r.ownerId ? (names.get(r.ownerId) ?? "a former member") : null,
      updatedAt: r.updatedAt,
    }));

  return (
    <div className="space-y-5">
      <TitleBar
        title="Projects"
        context={member.workspace.name}
        actions={canWrite ? <NewProjectLink /> : null}
      />
      <p className="text-sm text-ink-muted">
        A project is one design under review: the case temperature it runs at, a margin policy, the candidate
        parts and every pulse they must survive, calculated or measured on the bench.
      </p>
      <ProjectTable rows={shown} canWrite={canWrite} archived={showArchived} />
      {archived > 0 || showArchived ? (
        <p className="text-sm text-ink-muted">
          {showArchived ? (
            <Link href="/projects" className="text-accent underline underline-offset-2">
              Back to the active projects
            </Link>
          ) : (
            <Link href="/projects?archived=true" className="text-accent underline underline-offset-2">
              Show {archived} archived {archived === 1 ? "project" : "projects"}
            </Link>
          )}
        </p>
      ) : null}
    </div>
  );
}
