import type { ReactNode, ThHTMLAttributes } from "react";
import { messageOf } from "./api-client";
import { ScrollRegion } from "./scroll-region";

// The parts of every table (DESIGN.md): 32–36 px rows, a sticky header, numeric columns right-aligned in tabular
// figures, an empty state that says what to do next. `DataTable` (data-table.tsx) draws every data table with them.

/** Row height: `compact` for a table inside a disclosure (text-xs), `tall` for two-line cells. */
export type Density = "compact" | "normal" | "tall";

const heights: Record<Density, string> = {
  compact: "h-7 px-2 text-xs",
  normal: "h-9 px-3",
  tall: "h-11 px-3",
};

const scrollBox = "overflow-auto rounded-md border border-line bg-panel";

export function Table({
  label,
  children,
  className = "max-h-[min(34rem,70vh)]",
  tableClassName = "w-full",
  busy = false,
}: {
  label: string;
  children: ReactNode;
  /** The scroll box's size. */
  className?: string;
  tableClassName?: string;
  /** The rows are about to change: dimmed and marked busy until they do. */
  busy?: boolean;
}) {
  return (
    <ScrollRegion
      aria-busy={busy || undefined}
      className={`${scrollBox} transition-opacity ${busy ? "opacity-60" : ""} ${className}`}
    >
      <table aria-label={label} className={`border-separate border-spacing-0 text-sm ${tableClassName}`}>
        {children}
      </table>
    </ScrollRegion>
  );
}

export function Th({
  numeric = false,
  className = "",
  children,
  ...rest
}: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return (
    <th
      scope="col"
      className={`sticky top-0 z-10 h-8 border-b border-line bg-sunken px-3 text-xs font-medium whitespace-nowrap text-ink-muted ${numeric ? "text-right" : "text-left"} ${className}`}
      {...rest}
    >
      {children}
    </th>
  );
}

export function cellClass(density: Density, numeric: boolean): string {
  return `${heights[density]} border-b border-line align-middle whitespace-nowrap group-last/row:border-b-0 ${numeric ? "num text-right font-mono text-xs" : ""}`;
}

/** What to show when a table has no rows: say what to do next. */
export function EmptyRow({ colSpan, children }: { colSpan: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={colSpan} className="px-3 py-6 text-center text-sm text-ink-muted">
        {children}
      </td>
    </tr>
  );
}

/** A row's failed action said under it (a data table's detail, with `detailClassName="p-0"`); null with none. */
export function rowAlert(error: unknown, id?: string): ReactNode {
  if (!error) return null;
  return (
    <p id={id} role="alert" className="bg-sunken px-3 py-1.5 text-xs text-fail">
      {messageOf(error)}
    </p>
  );
}
