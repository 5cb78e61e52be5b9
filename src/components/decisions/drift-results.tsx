"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import { percent } from "@/lib/format";
import type { Verdict } from "@/lib/soa/types";
import type { Drift } from "./types";
import { VerdictMark } from "./verdict-mark";

type Changed = Drift["results"][number];

function Outcome({ value }: { value: { verdict: Verdict; utilisation: number | null } | null }) {
  if (!value) return <span className="text-ink-faint">not checked</span>;
  return (
    <span className="inline-flex items-center gap-2">
      <span className="font-mono num">{percent(value.utilisation)}</span>
      {VerdictMark({ verdict: value.verdict })}
    </span>
  );
}

const columns: ColumnDef<Changed>[] = [
  {
    id: "label",
    header: "Candidate × pulse",
    cell: ({ row }) => row.original.label,
    meta: { rowHeader: true },
  },
  {
    id: "frozen",
    header: "Frozen",
    cell: ({ row }) => <Outcome value={row.original.frozen} />,
    meta: { className: "text-xs", headerClassName: "" },
  },
  {
    id: "now",
    header: "Now",
    cell: ({ row }) => <Outcome value={row.original.now} />,
    meta: { className: "text-xs", headerClassName: "" },
  },
];

/** The results whose verdict or utilisation moved since the decision was frozen. */
export function DriftResults({ results }: { results: Changed[] }) {
  return (
    <DataTable
      label="Results that changed"
      columns={columns}
      data={results}
      getRowId={(r) => `${r.partId}-${r.pulseId}`}
      className="max-h-80"
    />
  );
}
