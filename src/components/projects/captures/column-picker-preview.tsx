import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import type { CapturePreview } from "@/lib/capture/parse";
import { q } from "@/lib/format";
import { columnName, type PickerInput } from "./column-picker-form";

// What the column picker shows of the file: how it was read, the lines skipped, the problems, the first rows with
// the picked columns marked, and the first sample as it will be read.

/** The file's name, separator, header and data lines, the skipped preamble and the preview's problems. */
export function PreviewSummary({ fileName, preview }: { fileName: string; preview: CapturePreview }) {
  return (
    <div>
      <p className="text-sm">
        <span className="font-medium">{fileName}</span>{" "}
        <span className="text-ink-muted">
          · separated by {preview.delimiter === "\t" ? "tabs" : `“${preview.delimiter}”`}
          {preview.decimalComma ? ", decimal commas" : ""}
          {preview.headerRow !== null ? `, header on line ${preview.headerRow + 1}` : ", no header"}
          {preview.dataRow !== null ? `, data from line ${preview.dataRow + 1}` : ""}
        </span>
      </p>
      {preview.preamble.length ? (
        <details className="mt-1 text-xs text-ink-muted">
          <summary className="cursor-pointer">
            {preview.preamble.length} {preview.preamble.length === 1 ? "line" : "lines"} before the data are
            skipped
          </summary>
          <pre className="mt-1 max-h-32 overflow-auto rounded bg-sunken p-2 font-mono">
            {preview.preamble.join("\n")}
          </pre>
        </details>
      ) : null}
      {preview.problems.length ? (
        <ul className="mt-2 list-disc pl-5 text-sm text-fail">
          {preview.problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

interface PreviewRow {
  /** The row's line in the preview (0 = the first data row). */
  n: number;
  cells: string[];
}

/** The file's first rows; the columns picked as time, voltage and current are marked t, V and I. */
export function PreviewTable({ preview, chosen }: { preview: CapturePreview; chosen: PickerInput | null }) {
  const role = (index: number) =>
    chosen?.time === index ? "t" : chosen?.voltage === index ? "V" : chosen?.current === index ? "I" : null;
  const columns: ColumnDef<PreviewRow>[] = preview.columns.map((c) => {
    const picked = role(c.index);
    return {
      id: String(c.index),
      header: () => (
        <>
          {picked ? <span className="mr-1.5 rounded bg-accent px-1 text-white">{picked}</span> : null}
          {columnName(preview, c.index)}
        </>
      ),
      cell: ({ row }) => row.original.cells[c.index] ?? "",
      meta: {
        numeric: true,
        headerClassName: picked ? "bg-accent-soft! text-accent-strong!" : "",
      },
    };
  });
  return (
    <DataTable
      label="First rows of the file"
      columns={columns}
      data={preview.rows.map((cells, n) => ({ n, cells }))}
      getRowId={(row) => String(row.n)}
      density="compact"
      className="max-h-64"
    />
  );
}

function cellNumber(cell: string | undefined, decimalComma: boolean): number {
  if (cell === undefined || cell === "") return Number.NaN;
  return Number(decimalComma ? cell.replace(",", ".") : cell);
}

/** The first data row read with the picked columns, unit, scales and offsets: a wrong probe factor shows here. */
export function FirstSample({ preview, chosen }: { preview: CapturePreview; chosen: PickerInput }) {
  const first = (column: number) => cellNumber(preview.rows[0]?.[column], preview.decimalComma);
  return (
    <p className="text-xs text-ink-muted" data-testid="capture-as-read">
      First sample as it will be read:{" "}
      <span className="num font-mono text-ink">
        t = {q(first(chosen.time) * chosen.timeScale, "s")}, V<sub>DS</sub> ={" "}
        {q(first(chosen.voltage) * chosen.vScale + chosen.vOffset, "V")}, I<sub>D</sub> ={" "}
        {q(first(chosen.current) * chosen.iScale + chosen.iOffset, "A")}
      </span>
    </p>
  );
}
