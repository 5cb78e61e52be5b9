"use client";

import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { messageOf } from "@/components/api-client";
import { DataTable } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { LoadingBox } from "@/components/loading-box";
import { auditWords } from "./audit-words";
import { useAudit } from "./queries";

/** The project's history for leads and admins: who did what, and when, newest first. */
export function AuditList({ projectId }: { projectId: string }) {
  const audit = useAudit(projectId);
  if (audit.isPending) return <LoadingBox className="h-40">Loading the record of changes…</LoadingBox>;
  if (audit.isError) {
    return (
      <p role="alert" className="text-sm text-fail">
        {messageOf(audit.error)}
      </p>
    );
  }
  return (
    <DataTable
      label="Project history"
      columns={columnsFor(projectId)}
      data={audit.data.events}
      getRowId={(event) => event.id}
      empty="Nothing recorded for this project yet."
    />
  );
}

type AuditEvent = NonNullable<ReturnType<typeof useAudit>["data"]>["events"][number];

function columnsFor(projectId: string): ColumnDef<AuditEvent>[] {
  return [
    {
      id: "when",
      header: "When (UTC)",
      cell: ({ row }) => <DateText value={row.original.createdAt} withTime />,
      meta: { headerClassName: "w-40" },
    },
    {
      id: "who",
      header: "Who",
      cell: ({ row }) => row.original.actor ?? <span className="text-ink-faint">removed account</span>,
      meta: { headerClassName: "w-48" },
    },
    {
      id: "what",
      header: "What",
      cell: ({ row: { original: event } }) => {
        const decisionId = typeof event.details?.decisionId === "string" ? event.details.decisionId : null;
        return (
          <>
            {auditWords(event)}
            {decisionId ? (
              <>
                {" · "}
                <Link
                  href={`/projects/${projectId}/decisions/${decisionId}`}
                  className="text-accent underline underline-offset-2"
                >
                  open the record
                </Link>
              </>
            ) : null}
          </>
        );
      },
      meta: { className: "whitespace-normal", headerClassName: "" },
    },
  ];
}
