import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import type { CsvIssue } from "@/lib/csv/issues";
import { progress } from "@/lib/format";

/** Long work in words with a bar: "Uploading… 45 %", then "Checking the curves…". */
export function UploadProgress({ label, fraction }: { label: string; fraction: number | null }) {
  const percent = fraction === null ? null : Math.round(fraction * 100);
  return (
    <div className="space-y-1.5" data-testid="upload-progress">
      <p className="text-sm text-ink" aria-live="polite">
        {label}
        {fraction === null ? "" : ` ${progress(fraction)}`}
      </p>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        className="h-1.5 overflow-hidden rounded-full bg-sunken"
      >
        <div
          className={`h-full rounded-full bg-accent transition-[width] ${percent === null ? "w-1/3 animate-pulse" : ""}`}
          style={percent === null ? undefined : { width: `${percent}%` }}
        />
      </div>
    </div>
  );
}

const issueColumns: ColumnDef<CsvIssue & { key: number }>[] = [
  {
    id: "row",
    header: "Row",
    cell: ({ row }) => row.original.row ?? "—",
    meta: { numeric: true, headerClassName: "w-16" },
  },
  {
    id: "column",
    header: "Column",
    cell: ({ row }) => row.original.column ?? "—",
    meta: { className: "font-mono text-xs", headerClassName: "" },
  },
  { id: "reason", header: "Reason", cell: ({ row }) => row.original.reason },
];

/** The rows a CSV was rejected for: row, column and reason, as a spreadsheet would point at them. */
export function IssueTable({ issues, label }: { issues: CsvIssue[]; label: string }) {
  // The server's list, shown once and never reordered: its position is its key.
  const rows = issues.map((issue, key) => ({ ...issue, key }));
  return (
    <DataTable
      label={label}
      columns={issueColumns}
      data={rows}
      getRowId={(issue) => String(issue.key)}
      className="max-h-72"
    />
  );
}
