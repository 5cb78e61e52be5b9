"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { type ReactNode, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { actionsColumn, DataTable } from "@/components/data-table";
import { Button, FormMessage } from "@/components/form";
import { Section } from "@/components/page-header";
import { money, q } from "@/lib/format";
import { invalidateProject, type ProjectDetail } from "../api";
import { PartPicker } from "./part-picker";

type Candidate = ProjectDetail["candidates"][number];

const muted = { className: "text-ink-muted", headerClassName: "" };

function candidateColumns(action: ((part: Candidate["part"]) => ReactNode) | null): ColumnDef<Candidate>[] {
  const columns: ColumnDef<Candidate>[] = [
    {
      id: "part",
      header: "Part",
      cell: ({ row: { original: c } }) => (
        <Link href={`/library/${c.part.id}`} className="font-medium hover:text-accent hover:underline">
          {c.part.partNumber}
        </Link>
      ),
    },
    { id: "maker", header: "Maker", cell: ({ row }) => row.original.part.maker, meta: muted },
    { id: "package", header: "Package", cell: ({ row }) => row.original.part.package, meta: muted },
    {
      id: "vdsMax",
      header: () => (
        <>
          V<sub>DSS</sub>
        </>
      ),
      cell: ({ row }) => q(row.original.part.vdsMax, "V"),
      meta: { numeric: true },
    },
    {
      id: "status",
      header: "Library status",
      cell: ({ row: { original: c } }) => `${c.part.status}${c.part.archivedAt ? ", archived" : ""}`,
      meta: muted,
    },
    {
      id: "data",
      header: "Data",
      cell: ({ row: { original: c } }) =>
        `${c.hasCurves ? "SOA curves" : "no SOA curves yet"}${c.part.foster?.length ? " · thermal model" : ""}`,
      meta: muted,
    },
    {
      id: "unitCost",
      header: "Unit cost",
      cell: ({ row: { original: c } }) => money(c.part.unitCost, c.part.currency),
      meta: { numeric: true },
    },
  ];
  if (action) {
    columns.push(actionsColumn((row) => action(row.part), "w-28"));
  }
  return columns;
}

/** The parts this project compares: a list with remove, and the library search to add one (project.write). */
export function CandidatesPanel({
  projectId,
  candidates,
  canWrite,
}: {
  projectId: string;
  candidates: ProjectDetail["candidates"];
  canWrite: boolean;
}) {
  const queryClient = useQueryClient();
  const [done, setDone] = useState<string | null>(null);
  const add = useMutation({
    mutationFn: (part: { id: string; partNumber: string }) =>
      requestJson("POST", `/api/projects/${projectId}/candidates`, { partId: part.id }),
    onSuccess: async (_data, part) => {
      setDone(`${part.partNumber} added; the results below include it.`);
      await invalidateProject(queryClient, projectId);
    },
  });
  const remove = useMutation({
    mutationFn: (part: { id: string; partNumber: string }) =>
      requestJson("DELETE", `/api/projects/${projectId}/candidates/${part.id}`),
    onSuccess: async (_data, part) => {
      setDone(`${part.partNumber} removed from the candidates.`);
      await invalidateProject(queryClient, projectId);
    },
  });
  const error = add.error ?? remove.error;

  return (
    <Section
      id="candidates"
      title="Candidates"
      description="The library parts this design could use; every pulse is checked against each."
      aside={
        canWrite ? (
          <PartPicker
            exclude={new Set(candidates.map((c) => c.part.id))}
            busy={add.isPending}
            onPick={(part) => {
              setDone(null);
              add.mutate(part);
            }}
          />
        ) : null
      }
    >
      <DataTable
        label="Candidates"
        columns={candidateColumns(
          canWrite
            ? (part) => (
                <Button
                  size="sm"
                  variant="quiet"
                  pending={remove.isPending && remove.variables?.id === part.id}
                  onClick={() => {
                    setDone(null);
                    remove.mutate({ id: part.id, partNumber: part.partNumber });
                  }}
                  aria-label={`Remove ${part.partNumber}`}
                >
                  Remove
                </Button>
              )
            : null,
        )}
        data={candidates}
        getRowId={(c) => c.part.id}
        empty={
          canWrite
            ? "No candidates yet. Search the library at the right and add the parts to compare."
            : "No candidates yet. An engineer adds the parts to compare."
        }
      />
      {error ? <FormMessage tone="error">{messageOf(error)}</FormMessage> : null}
      {done && !error ? (
        <p role="status" className="mt-2 text-xs text-ink-muted">
          {done}
        </p>
      ) : null}
    </Section>
  );
}
