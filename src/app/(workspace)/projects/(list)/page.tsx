import type { Metadata } from "next";
import { TitleBar } from "@/components/library/title-bar";
import { NewProjectLink, ProjectList } from "@/components/projects/project-table";
import { listProjectRows } from "@/db/queries/projects";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireMember } from "@/lib/auth/page";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage() {
  const member = await requireMember();
  const [rows, members] = await Promise.all([
    listProjectRows(member.workspace.id),
    rememberedMembers(member.workspace.id),
  ]);
  const names = new Map(members.map((m) => [m.userId, m.name]));
  const canWrite = member.can("project.write");
  // Active and archived projects both: the list shows one or the other as the URL says, on the client.
  const shown = rows.map((r) => ({
    id: r.id,
    name: r.name,
    description: r.description,
    caseTemp: r.caseTemp,
    utilisationLimit: r.utilisationLimit,
    candidates: r.candidates,
    owner: r.ownerId ? (names.get(r.ownerId) ?? "a former member") : null,
    updatedAt: r.updatedAt,
    archived: r.archivedAt !== null,
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
      <ProjectList rows={shown} canWrite={canWrite} />
    </div>
  );
}
