import type { ReactNode } from "react";
import { DataTable, type DataTableProps } from "@/components/data-table";

/** A chart's figures as a compact table behind a disclosure whose summary says what it holds. */
export function ChartTable<T>({
  className,
  summary,
  ...table
}: { className: string; summary: ReactNode } & Omit<DataTableProps<T>, "density" | "className">) {
  return (
    <details className={className}>
      <summary className="cursor-pointer text-ink-muted select-none hover:text-ink">{summary}</summary>
      <div className="mt-2">
        <DataTable {...table} density="compact" className="max-h-80" />
      </div>
    </details>
  );
}
