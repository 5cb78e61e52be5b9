"use client";

import { useQueryClient } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { Fragment, type ReactNode, useState } from "react";
import { useRowDelete } from "@/components/confirm-delete";
import { actionsColumn, DataTable } from "@/components/data-table";
import { DisclosureChevron } from "@/components/disclosure-chevron";
import { Button } from "@/components/form";
import { Sym } from "@/components/library/symbols";
import { q, repeatOf, repeatText } from "@/lib/format";
import { builderName, shapeWords } from "@/lib/vocabulary";
import { type FaultCaseRecord, invalidateProject } from "../api";
import { figureLines } from "../builders/figures";
import { FaultCaseForm } from "./fault-case-form";

/** The project's fault cases; engineers edit or delete each from its row, and open it to see its origin. */
export function FaultCaseTable({
  projectId,
  faultCases,
  canWrite,
  projectCaseTemp,
}: {
  projectId: string;
  faultCases: FaultCaseRecord[];
  canWrite: boolean;
  projectCaseTemp: number;
}) {
  const queryClient = useQueryClient();
  const [editing, setEditing] = useState<string | null>(null);
  const [open, setOpen] = useState<string | null>(null);
  const remove = useRowDelete(
    (id) => `/api/projects/${projectId}/fault-cases/${id}`,
    () => invalidateProject(queryClient, projectId),
  );
  const columns = faultCaseColumns({
    open,
    toggle: (id) => setOpen(open === id ? null : id),
    projectCaseTemp,
    actions: canWrite
      ? (row) =>
          remove.action(
            row.id,
            row.name,
            row.kind === "rect" || row.kind === "triangle" ? (
              <Button size="sm" variant="quiet" onClick={() => setEditing(row.id)}>
                Edit
              </Button>
            ) : null,
          )
      : null,
  });

  return (
    <>
      <DataTable
        label="Fault cases"
        columns={columns}
        data={faultCases}
        getRowId={(row) => row.id}
        detail={(row) => (open === row.id ? <FaultCaseOrigin row={row} /> : null)}
        empty={
          canWrite
            ? "No fault cases yet. Build one from the circuit with a pulse builder below, or type it."
            : "No fault cases yet. An engineer adds the pulses the design must survive."
        }
      />
      {remove.failure}
      {editing ? (
        <div className="mt-4">
          <h3 className="mb-2 text-sm font-semibold">
            Edit {faultCases.find((f) => f.id === editing)?.name ?? "fault case"}
          </h3>
          <FaultCaseForm
            key={editing}
            projectId={projectId}
            editing={faultCases.find((f) => f.id === editing)}
            onDone={() => setEditing(null)}
          />
        </div>
      ) : null}
    </>
  );
}

const num = { numeric: true };

function faultCaseColumns({
  open,
  toggle,
  projectCaseTemp,
  actions,
}: {
  open: string | null;
  toggle: (id: string) => void;
  projectCaseTemp: number;
  actions: ((row: FaultCaseRecord) => ReactNode) | null;
}): ColumnDef<FaultCaseRecord>[] {
  const columns: ColumnDef<FaultCaseRecord>[] = [
    {
      id: "name",
      header: "Name",
      cell: ({ row: { original: row } }) => (
        <>
          <button
            type="button"
            aria-expanded={open === row.id}
            onClick={() => toggle(row.id)}
            className="inline-flex items-center gap-1.5 text-left font-medium hover:text-accent"
          >
            <DisclosureChevron open={open === row.id} />
            {row.name}
          </button>
          {row.origin ? (
            <span className="ml-2 text-xs text-ink-faint">
              from the {builderName(row.origin.builder)} builder
            </span>
          ) : null}
        </>
      ),
    },
    {
      id: "shape",
      header: "Shape",
      cell: ({ row }) =>
        row.original.kind === "waveform" ? "fault sequence" : shapeWords[row.original.kind],
      meta: { className: "text-ink-muted", headerClassName: "" },
    },
    {
      id: "v",
      header: () => <Sym main="V" sub="DS" />,
      cell: ({ row: { original: row } }) =>
        row.kind === "avalanche" ? (
          <span title="The supply; the drain rises to each candidate's breakdown voltage">
            {q(row.v, "V")} supply
          </span>
        ) : (
          q(row.v, "V")
        ),
      meta: num,
    },
    {
      id: "i",
      header: () => (
        <>
          <Sym main="I" sub="D" /> (peak)
        </>
      ),
      cell: ({ row }) => q(row.original.i, "A"),
      meta: num,
    },
    { id: "width", header: "Width", cell: ({ row }) => widthText(row.original), meta: num },
    {
      id: "repeat",
      header: "Repetition",
      cell: ({ row }) => repeatText(repeatOf(row.original)) ?? "single pulse",
      meta: { className: "text-ink-muted", headerClassName: "" },
    },
    {
      id: "caseTemp",
      header: () => <Sym main="T" sub="C" />,
      cell: ({ row: { original: row } }) =>
        row.caseTemp === null ? (
          <span className="text-ink-faint" title="The project's case temperature">
            {q(projectCaseTemp, "°C")}
          </span>
        ) : (
          q(row.caseTemp, "°C")
        ),
      meta: num,
    },
  ];
  if (actions) {
    columns.push(actionsColumn(actions, "w-40"));
  }
  return columns;
}

/** The width column: a pulse's width, an unclamped turn-off's inductance, a sequence's length. */
function widthText(row: FaultCaseRecord): string {
  if (row.kind === "avalanche") return `L ${q(row.inductance, "H")}`;
  if (row.kind === "waveform" && row.samples) {
    const { t } = row.samples;
    return `${q(t[t.length - 1] - t[0], "s")} in all`;
  }
  return q(row.duration, "s");
}

function FaultCaseOrigin({ row }: { row: FaultCaseRecord }) {
  const lines = row.origin ? figureLines(row.origin.builder, row.origin.input, row.origin.figures) : [];
  return (
    <div className="max-w-3xl space-y-2 whitespace-normal">
      {row.origin ? (
        <>
          <p className="font-medium">Built with the {builderName(row.origin.builder)} builder</p>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-xs">
            {lines.map((line) => (
              <Fragment key={line.key}>
                <dt className="text-ink-muted">{line.label}</dt>
                <dd className="num font-mono">{line.value}</dd>
              </Fragment>
            ))}
          </dl>
        </>
      ) : (
        <p className="text-ink-muted">Typed by hand.</p>
      )}
      {row.notes ? <p className="whitespace-pre-line text-ink-muted">{row.notes}</p> : null}
    </div>
  );
}
