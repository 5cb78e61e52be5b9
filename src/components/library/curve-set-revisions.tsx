"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import { type ReactNode, useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { actionsColumn, DataTable } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { Button } from "@/components/form";
import { fileSize } from "@/lib/format";
import { CURVE_FORMS } from "@/lib/vocabulary";

export interface CurveSetRow {
  id: string;
  fileName: string;
  size: number;
  shape: string;
  active: boolean;
  createdAt: Date | string;
  uploadedBy: string | null;
}

function revisionColumns(
  partId: string,
  activate: (set: CurveSetRow) => ReactNode,
): ColumnDef<CurveSetRow>[] {
  return [
    {
      id: "file",
      header: "File",
      cell: ({ row }) => row.original.fileName,
      meta: {
        className: "max-w-64 truncate font-medium",
        headerClassName: "",
        cellProps: (set) => ({ title: set.fileName }),
      },
    },
    {
      id: "form",
      header: "Form",
      cell: ({ row }) => (row.original.shape === "paired" ? CURVE_FORMS.paired : CURVE_FORMS.long),
      meta: { className: "text-ink-muted", headerClassName: "" },
    },
    { id: "size", header: "Size", cell: ({ row }) => fileSize(row.original.size), meta: { numeric: true } },
    {
      id: "uploadedBy",
      header: "Uploaded by",
      cell: ({ row }) => row.original.uploadedBy ?? <span className="text-ink-faint">—</span>,
    },
    {
      id: "uploaded",
      header: "Uploaded (UTC)",
      cell: ({ row }) => <DateText value={row.original.createdAt} withTime />,
      meta: { numeric: true },
    },
    {
      id: "state",
      header: "State",
      cell: ({ row }) =>
        row.original.active ? (
          <span className="inline-flex items-center gap-1.5 text-accent">
            <svg width="8" height="8" viewBox="0 0 8 8" aria-hidden="true">
              <circle cx="4" cy="4" r="3.5" fill="currentColor" />
            </svg>
            active
          </span>
        ) : (
          <span className="text-ink-faint">earlier</span>
        ),
    },
    actionsColumn(
      (set) => (
        <span className="inline-flex items-center gap-2">
          <a
            href={`/api/parts/${partId}/curve-sets/${set.id}/file`}
            className="text-sm text-accent hover:underline"
            aria-label={`Download the original ${set.fileName}`}
          >
            Download original
          </a>
          {activate(set)}
        </span>
      ),
      "",
    ),
  ];
}

/** Every curve set the part has had (datasheet revisions), newest first; one is active. */
export function CurveSetRevisions({
  partId,
  sets,
  canWrite,
}: {
  partId: string;
  sets: CurveSetRow[];
  canWrite: boolean;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [refreshing, startTransition] = useTransition();
  const activate = useMutation({
    mutationFn: (setId: string) => requestJson("POST", `/api/parts/${partId}/curve-sets/${setId}/activate`),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: ["part-limits", partId] });
      startTransition(() => router.refresh());
    },
  });
  return (
    <div className="space-y-2">
      <DataTable
        label="Curve-set revisions"
        columns={revisionColumns(partId, (set) =>
          canWrite && !set.active ? (
            <Button
              size="sm"
              pending={(activate.isPending && activate.variables === set.id) || refreshing}
              onClick={() => activate.mutate(set.id)}
            >
              Make active
            </Button>
          ) : null,
        )}
        data={sets}
        getRowId={(set) => set.id}
        empty="No curve sets yet."
      />
      {activate.isError ? (
        <p role="alert" className="text-sm text-fail">
          {messageOf(activate.error)}
        </p>
      ) : null}
    </div>
  );
}
