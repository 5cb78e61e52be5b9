"use client";

import { useQueryClient } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { useRowDelete } from "@/components/confirm-delete";
import { actionsColumn, DataTable } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { VerdictBadge } from "@/components/verdict-shape";
import { repeatOf, repeatText } from "@/lib/format";
import { invalidateProject, type MeasuredRecord, type ProjectCheck } from "../api";
import type { Person, Viewer } from "../project-workspace";
import { pulseFigureColumns } from "../pulse-columns";
import { recordedBy } from "../recorded-by";

const num = { numeric: true };
const muted = { className: "text-ink-muted", headerClassName: "" };

function benchText(row: MeasuredRecord): string {
  return [row.boardSerial && `board ${row.boardSerial}`, row.probe, row.note].filter(Boolean).join(" · ");
}

/**
 * The measured pulses saved so far, newest last, with who logged each and when, the bench setup, and the worst
 * verdict over the candidates (each opens in the results). Authors delete their own rows; leads and admins any.
 */
export function MeasuredTable({
  projectId,
  rows,
  check,
  viewer,
  canMeasure,
  people,
}: {
  projectId: string;
  rows: MeasuredRecord[];
  check: ProjectCheck | undefined;
  viewer: Viewer;
  canMeasure: boolean;
  people: Person[];
}) {
  const queryClient = useQueryClient();
  const recorded = recordedBy(viewer, people);
  const remove = useRowDelete(
    (id) => `/api/projects/${projectId}/measurements/${id}`,
    () => invalidateProject(queryClient, projectId),
  );
  const columns: ColumnDef<MeasuredRecord>[] = [
    {
      id: "label",
      header: "Label",
      cell: ({ row: { original: row } }) => (
        <>
          <Link href={`/projects/${projectId}?pulse=${row.id}`} className="hover:text-accent hover:underline">
            {row.label}
          </Link>
          <span className="ml-2 text-xs font-normal text-ink-faint">
            {row.kind === "rect" ? "rect" : "triangle"}
          </span>
        </>
      ),
      meta: { className: "font-medium", headerClassName: "" },
    },
    ...pulseFigureColumns<MeasuredRecord>(num),
    {
      id: "repeat",
      header: "Repetition",
      cell: ({ row }) => repeatText(repeatOf(row.original)) ?? "single",
      meta: muted,
    },
    {
      id: "worst",
      header: "Worst verdict",
      cell: ({ row }) => {
        const worst = check?.worstByPulse[row.original.id];
        return worst ? <VerdictBadge verdict={worst} /> : <span className="text-ink-faint">—</span>;
      },
    },
    {
      id: "bench",
      header: "Bench",
      cell: ({ row }) => benchText(row.original) || "—",
      meta: {
        className: "max-w-56 truncate text-ink-muted",
        headerClassName: "",
        cellProps: (row) => ({ title: benchText(row) || undefined }),
      },
    },
    { id: "who", header: "Logged by", cell: ({ row }) => recorded.who(row.original.createdBy), meta: muted },
    {
      id: "when",
      header: "When (UTC)",
      cell: ({ row }) => <DateText value={row.original.createdAt} withTime />,
      meta: num,
    },
  ];
  if (canMeasure) {
    columns.push(
      actionsColumn(
        (row) => (recorded.mayDelete(row.createdBy) ? remove.action(row.id, row.label) : null),
        "w-32",
      ),
    );
  }

  return (
    <>
      <DataTable
        label="Measured pulses"
        columns={columns}
        data={rows}
        getRowId={(row) => row.id}
        empty={
          canMeasure
            ? "No measured pulses yet. Paste the bench's rows above and preview them."
            : "No measured pulses yet. Technicians log what the bench measured here."
        }
      />
      {remove.failure}
    </>
  );
}
