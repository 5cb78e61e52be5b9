"use client";

import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { useUrlState } from "@/components/use-url-state";
import { q, settingPercent } from "@/lib/format";

export interface ProjectRow {
  id: string;
  name: string;
  description: string | null;
  caseTemp: number;
  utilisationLimit: number;
  candidates: number;
  owner: string | null;
  updatedAt: Date | string;
  archived: boolean;
}

const columns: ColumnDef<ProjectRow>[] = [
  {
    id: "name",
    header: "Project",
    cell: ({ row: { original: row } }) => (
      <>
        <Link href={`/projects/${row.id}`} className="font-medium text-ink hover:text-accent hover:underline">
          {row.name}
        </Link>
        {row.description ? (
          <span className="ml-2 inline-block max-w-80 truncate align-bottom text-xs text-ink-faint">
            {row.description.split("\n")[0]}
          </span>
        ) : null}
      </>
    ),
    meta: { className: "max-w-96", headerClassName: "" },
  },
  {
    id: "caseTemp",
    header: "Case temperature",
    cell: ({ row }) => q(row.original.caseTemp, "°C"),
    meta: { numeric: true, headerClassName: "w-32" },
  },
  {
    id: "utilisationLimit",
    header: "Utilisation limit",
    cell: ({ row }) => settingPercent(row.original.utilisationLimit),
    meta: { numeric: true, headerClassName: "w-28" },
  },
  {
    id: "candidates",
    header: "Candidates",
    cell: ({ row }) => row.original.candidates,
    meta: { numeric: true, headerClassName: "w-24" },
  },
  {
    id: "owner",
    header: "Owner",
    cell: ({ row }) => row.original.owner ?? "—",
    meta: { className: "text-ink-muted", headerClassName: "w-48" },
  },
  {
    id: "updatedAt",
    header: "Updated (UTC)",
    cell: ({ row }) => <DateText value={row.original.updatedAt} />,
    meta: { numeric: true, headerClassName: "w-28" },
  },
];

/**
 * The projects, active or archived as the URL's `archived=true` says (kept by useUrlState, as the library's
 * filters are; a new history entry, so Back returns to the other list), with the switch between the two.
 */
export function ProjectList({ rows, canWrite }: { rows: ProjectRow[]; canWrite: boolean }) {
  const [params, setParams] = useUrlState();
  const showArchived = params.get("archived") === "true";
  const archived = rows.filter((r) => r.archived).length;
  return (
    <>
      <ProjectTable
        rows={rows.filter((r) => r.archived === showArchived)}
        canWrite={canWrite}
        archived={showArchived}
      />
      {archived > 0 || showArchived ? (
        <p className="text-sm text-ink-muted">
          <button
            type="button"
            className="text-accent underline underline-offset-2"
            onClick={() => setParams({ archived: showArchived ? null : "true" }, { push: true })}
          >
            {showArchived
              ? "Back to the active projects"
              : `Show ${archived} archived ${archived === 1 ? "project" : "projects"}`}
          </button>
        </p>
      ) : null}
    </>
  );
}

/** The projects list: each name opens the project; an empty list says what to do next. */
export function ProjectTable({
  rows,
  canWrite,
  archived,
}: {
  rows: ProjectRow[];
  canWrite: boolean;
  archived: boolean;
}) {
  return (
    <DataTable
      label={archived ? "Archived projects" : "Projects"}
      columns={columns}
      data={rows}
      getRowId={(row) => row.id}
      empty={
        archived ? (
          "No archived projects."
        ) : (
          <span className="flex flex-col items-center gap-3">
            <span className="text-base font-medium text-ink">No projects yet</span>
            {canWrite ? (
              <>
                <span>
                  Start one for the design you are reviewing, then add candidate parts and fault cases.
                </span>
                <NewProjectLink />
              </>
            ) : (
              <span>An engineer starts a project; you can then log bench measurements in it.</span>
            )}
          </span>
        )
      }
    />
  );
}

export function NewProjectLink() {
  return (
    <Link
      href="/projects/new"
      className="inline-flex h-9 items-center rounded-md bg-accent px-4 text-sm font-medium text-white hover:bg-accent-strong"
    >
      New project
    </Link>
  );
}
