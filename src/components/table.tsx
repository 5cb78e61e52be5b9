import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from "react";
import { ScrollRegion } from "./scroll-region";

// Dense tables (DESIGN.md): 36 px rows, a sticky header, numeric columns right-aligned.

export function Table({ label, children }: { label: string; children: ReactNode }) {
  return (
    <ScrollRegion className="max-h-[min(34rem,70vh)] overflow-auto rounded-md border border-line bg-panel">
      <table aria-label={label} className="w-full border-separate border-spacing-0 text-sm">
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

export function Td({
  numeric = false,
  className = "",
  children,
  ...rest
}: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return (
    <td
      className={`h-9 border-b border-line px-3 align-middle whitespace-nowrap group-last/row:border-b-0 ${numeric ? "num text-right font-mono text-xs" : ""} ${className}`}
      {...rest}
    >
      {children}
    </td>
  );
}

/** A body row; hover lightens it, and its row actions stay visible for keyboard users. */
export function Tr({ children, className = "" }: { children: ReactNode; className?: string }) {
  return <tr className={`group/row hover:bg-surface ${className}`}>{children}</tr>;
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
