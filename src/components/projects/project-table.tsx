import Link from "next/link";
import { DateText } from "@/components/date-text";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { q } from "./format";

export interface ProjectRow {
  id: string;
  name: string;
  description: string | null;
  caseTemp: number;
  utilisationLimit: number;
  candidates: number;
  owner: string | null;
  updatedAt: Date | string;
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
    <Table label={archived ? "Archived projects" : "Projects"}>
      <thead>
        <tr>
          <Th>Project</Th>
          <Th numeric className="w-32">
            Case temperature
          </Th>
          <Th numeric className="w-28">
            Utilisation limit
          </Th>
          <Th numeric className="w-24">
            Candidates
          </Th>
          <Th className="w-48">Owner</Th>
          <Th numeric className="w-28">
            Updated (UTC)
          </Th>
        </tr>
      </thead>
      <tbody>
        {rows.length === 0 ? (
          <EmptyRow colSpan={6}>
            {archived ? (
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
            )}
          </EmptyRow>
        ) : (
          rows.map((row) => (
            <Tr key={row.id}>
              <Td className="max-w-96">
                <Link
                  href={`/projects/${row.id}`}
                  className="font-medium text-ink hover:text-accent hover:underline"
                >
                  {row.name}
                </Link>
                {row.description ? (
                  <span className="ml-2 inline-block max-w-80 truncate align-bottom text-xs text-ink-faint">
                    {row.description.split("\n")[0]}
                  </span>
                ) : null}
              </Td>
              <Td numeric>{q(row.caseTemp, "°C")}</Td>
              <Td numeric>{Math.round(row.utilisationLimit * 100)}&thinsp;%</Td>
              <Td numeric>{row.candidates}</Td>
              <Td className="text-ink-muted">{row.owner ?? "—"}</Td>
              <Td numeric>
                <DateText value={row.updatedAt} />
              </Td>
            </Tr>
          ))
        )}
      </tbody>
    </Table>
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
