"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import { DateText } from "@/components/date-text";

export interface OutboxRow {
  id: string;
  kind: string;
  to: string;
  status: string;
  attempts: number;
  lastError: string | null;
  createdAt: Date | string;
}

const kindWords: Record<string, string> = {
  invitation: "Invitation",
  "failing-pulse": "Failing pulse",
  "password-reset": "Password reset",
  "verification-lapsed": "Verification lapsed",
};

const columns: ColumnDef<OutboxRow>[] = [
  {
    id: "kind",
    header: "What",
    cell: ({ row }) => kindWords[row.original.kind] ?? row.original.kind,
    meta: { headerClassName: "w-36" },
  },
  { id: "to", header: "To", cell: ({ row }) => row.original.to },
  {
    id: "state",
    header: "State",
    cell: ({ row }) => (row.original.status === "sent" ? "Sent" : "Waiting"),
    meta: { headerClassName: "w-28" },
  },
  {
    id: "tries",
    header: "Tries",
    cell: ({ row }) => row.original.attempts,
    meta: { numeric: true, headerClassName: "w-20" },
  },
  {
    id: "problem",
    header: "Last problem",
    cell: ({ row }) => (row.original.status === "sent" ? "" : (row.original.lastError ?? "")),
    meta: { headerClassName: "w-40" },
  },
  {
    id: "queued",
    header: "Queued (UTC)",
    cell: ({ row }) => <DateText value={row.original.createdAt} withTime />,
    meta: { numeric: true, headerClassName: "w-36" },
  },
];

/** The outbox's rows: what was sent to whom, whether it went, and how often it was tried. */
export function OutboxTable({ rows }: { rows: OutboxRow[] }) {
  return (
    <DataTable
      label="E-mail outbox"
      columns={columns}
      data={rows}
      getRowId={(row) => row.id}
      empty="No e-mail yet."
    />
  );
}
