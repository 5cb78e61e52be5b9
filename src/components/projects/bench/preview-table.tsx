import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import { VerdictBadge } from "@/components/verdict-shape";
import { percent, repeatText } from "@/lib/format";
import type { MeasurementPreview } from "../api";
import { pulseFigureColumns } from "../pulse-columns";

/** Evidence beyond the part's ratings is kept and checked, and said so beside its verdict. */
function beyond(flags: readonly string[] | undefined): string | null {
  const words = [
    flags?.includes("over-voltage") ? "V above V(BR)DSS" : null,
    flags?.includes("over-current") ? "I above I_DM" : null,
  ].filter(Boolean);
  return words.length ? `beyond rating: ${words.join(", ")}` : null;
}

type PreviewRow = MeasurementPreview["rows"][number];

const num = { numeric: true };
const muted = { className: "text-ink-muted", headerClassName: "" };

const fixed: ColumnDef<PreviewRow>[] = [
  {
    id: "row",
    header: "Row",
    cell: ({ row }) => row.original.row,
    meta: { numeric: true, headerClassName: "w-14" },
  },
  { id: "label", header: "Label", cell: ({ row }) => row.original.label, meta: { className: "font-medium" } },
  {
    id: "shape",
    header: "Shape",
    cell: ({ row }) => (row.original.kind === "rect" ? "rect" : "triangle"),
    meta: muted,
  },
  ...pulseFigureColumns<PreviewRow>(num),
  {
    id: "repeat",
    header: "Repetition",
    cell: ({ row }) => repeatText(row.original.repeat) ?? "single",
    meta: muted,
  },
];

const isBad = (row: PreviewRow) => row.errors.length > 0;

/** A row that could not be read: what is wrong with it, across the verdict columns. */
function RowErrors({ row }: { row: PreviewRow }) {
  return (
    <ul className="space-y-0.5 py-1 text-xs">
      {row.errors.map((e) => (
        <li key={e.message}>
          {e.column ? <span className="font-mono">{e.column}: </span> : null}
          {e.reason}
        </li>
      ))}
    </ul>
  );
}

/** The first verdict column shows a bad row's errors over all the verdict columns. */
function errorsFirst(width: number, first: boolean) {
  return {
    span: (row: PreviewRow) => (isBad(row) ? (first ? width : 0) : 1),
    cellProps: (row: PreviewRow) =>
      isBad(row) ? { "data-row-error": true, className: "whitespace-normal text-fail" } : {},
  };
}

/** The pasted rows as read: each row's values, its verdict against every candidate, or what is wrong with it. */
export function PreviewTable({ preview }: { preview: MeasurementPreview }) {
  const { candidates, rows } = preview;
  const width = Math.max(1, candidates.length);
  const verdicts: ColumnDef<PreviewRow>[] = candidates.length
    ? candidates.map((c, k) => ({
        id: `part-${c.partId}`,
        header: c.partNumber,
        cell: ({ row }) =>
          isBad(row.original) ? (
            <RowErrors row={row.original} />
          ) : (
            <Verdict row={row.original} partId={c.partId} />
          ),
        meta: {
          ...errorsFirst(width, k === 0),
          cellProps: (row: PreviewRow) =>
            isBad(row)
              ? errorsFirst(width, k === 0).cellProps(row)
              : { "data-verdict": row.verdicts[c.partId]?.verdict ?? "no-data", "data-part": c.partNumber },
        },
      }))
    : [
        {
          id: "check",
          header: "Check",
          cell: ({ row }) =>
            isBad(row.original) ? <RowErrors row={row.original} /> : "no candidates to check against yet",
          meta: {
            ...errorsFirst(width, true),
            cellProps: (row: PreviewRow) =>
              isBad(row) ? errorsFirst(width, true).cellProps(row) : { className: "text-ink-muted" },
          },
        },
      ];
  return (
    <DataTable
      label="Preview of the pasted rows"
      columns={[...fixed, ...verdicts]}
      data={rows}
      getRowId={(row) => String(row.row)}
      rowProps={(row) => ({ className: `hover:bg-surface ${isBad(row) ? "bg-sunken" : ""}` })}
    />
  );
}

function Verdict({ row, partId }: { row: PreviewRow; partId: string }) {
  const result = row.verdicts[partId];
  return (
    <span className="inline-flex items-baseline gap-2">
      <VerdictBadge verdict={result?.verdict ?? "no-data"} />
      {result?.utilisation !== undefined && result.utilisation !== null ? (
        <span className="num font-mono text-xs text-ink-muted">{percent(result.utilisation)}</span>
      ) : null}
      {beyond(result?.flags) ? (
        <span className="text-xs text-fail" data-beyond-rating>
          {beyond(result?.flags)}
        </span>
      ) : null}
    </span>
  );
}
