import type { ColumnDef } from "@tanstack/react-table";
import type { ReactNode } from "react";
import { actionsColumn } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { VerdictBadge } from "@/components/verdict-shape";
import { count, fileSize, q } from "@/lib/format";
import type { PanelProps } from "../project-workspace";
import type { CaptureListItem } from "./capture-api";

// The captures list's columns for the shared DataTable: name (opens the capture), its figures, worst verdict or
// progress, who uploaded it and when, and the delete action where the viewer may.

const num = { numeric: true };

export function captureColumns({
  check,
  selected,
  open,
  who,
  actions,
}: {
  check: PanelProps["check"];
  selected: string | null;
  open: (id: string) => void;
  who: (c: CaptureListItem) => string;
  actions: ((c: CaptureListItem) => ReactNode) | null;
}): ColumnDef<CaptureListItem>[] {
  const columns: ColumnDef<CaptureListItem>[] = [
    {
      id: "name",
      header: "Name",
      cell: ({ row: { original: c } }) => (
        <>
          <button
            type="button"
            aria-current={c.id === selected ? "true" : undefined}
            onClick={() => open(c.id)}
            className="font-medium hover:text-accent hover:underline"
          >
            {c.name}
          </button>
          <span className="ml-2 text-xs text-ink-faint">
            {c.fileName}, {fileSize(c.size)}
          </span>
        </>
      ),
    },
    {
      id: "samples",
      header: "Samples",
      cell: ({ row: { original: c } }) => (c.summary ? count(c.summary.samples) : "—"),
      meta: num,
    },
    {
      id: "peak",
      header: "Peak power",
      cell: ({ row: { original: c } }) => (c.summary ? q(c.summary.pPeak, "W") : "—"),
      meta: num,
    },
    {
      id: "energy",
      header: "Energy",
      cell: ({ row: { original: c } }) => (c.summary ? q(c.summary.energy, "J") : "—"),
      meta: num,
    },
    {
      id: "equivalent",
      header: "Equal-energy rectangle",
      cell: ({ row: { original: c } }) => {
        const eq = c.summary?.equivalent;
        return !eq ? "—" : eq.ok ? `${q(eq.v, "V")} × ${q(eq.i, "A")}, ${q(eq.duration, "s")}` : "none";
      },
      meta: num,
    },
    {
      id: "worst",
      header: "Worst verdict",
      cell: ({ row: { original: c } }) => {
        const worst = check?.worstByPulse[c.id];
        return c.status !== "done" ? (
          <StatusWord status={c.status} />
        ) : worst ? (
          <VerdictBadge verdict={worst} />
        ) : (
          <span className="text-ink-faint">—</span>
        );
      },
    },
    {
      id: "who",
      header: "Uploaded by",
      cell: ({ row }) => who(row.original),
      meta: { className: "text-ink-muted", headerClassName: "" },
    },
    {
      id: "when",
      header: "When (UTC)",
      cell: ({ row }) => <DateText value={row.original.createdAt} withTime />,
      meta: num,
    },
  ];
  if (actions) {
    columns.push(actionsColumn(actions, "w-32"));
  }
  return columns;
}

/** A capture not (yet) done, in words. */
function StatusWord({ status }: { status: CaptureListItem["status"] }) {
  const words = { queued: "queued", processing: "processing…", failed: "failed", done: "done" } as const;
  return (
    <span className={status === "failed" ? "text-fail" : "text-ink-muted"} data-capture-status={status}>
      {words[status]}
    </span>
  );
}
