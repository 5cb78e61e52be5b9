import {
  type Cell,
  type Column,
  type ColumnDef,
  type ColumnMeta,
  flexRender,
  getCoreRowModel,
  type Header,
  type Row,
  type RowData,
  type SortingState,
  useReactTable,
} from "@tanstack/react-table";
import {
  type CSSProperties,
  Fragment,
  type HTMLAttributes,
  type ReactNode,
  type Ref,
  type TdHTMLAttributes,
} from "react";
import { DateText } from "./date-text";
import { cellClass, type Density, EmptyRow, Table, Th } from "./table";

// Every data table: TanStack Table for the columns and rows, drawn one way (the parts in table.tsx), with sorting
// where the caller sorts, columns pinned at the left where the table scrolls sideways, sections, opened rows and
// the empty, loading and failed states.

declare module "@tanstack/react-table" {
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Figures: right-aligned, monospaced, tabular. */
    numeric?: boolean;
    /** Classes on each body cell (and on the header cell unless `headerClassName` is given). */
    className?: string;
    headerClassName?: string;
    /** The body cell names its row: a `<th scope="row">`. */
    rowHeader?: boolean;
    /** Attributes on each body cell (data-* for tests and styling, a title). */
    cellProps?: (row: TData) => TdHTMLAttributes<HTMLTableCellElement> & Record<`data-${string}`, unknown>;
    /** How many columns the body cell spans in this row: 0 when an earlier cell already covers it. */
    span?: (row: TData) => number;
  }
}

type RowAttributes = HTMLAttributes<HTMLTableRowElement> &
  Record<`data-${string}`, unknown> & { ref?: Ref<HTMLTableRowElement> };

export interface DataTableProps<T> {
  label: string;
  // biome-ignore lint/suspicious/noExplicitAny: column value types differ per column, as TanStack's own examples
  columns: ColumnDef<T, any>[];
  data: T[];
  getRowId: (row: T) => string;
  /** Shown in place of the rows when there are none. */
  empty?: ReactNode;
  /** Shown in place of the rows while they load or when they failed (wins over `empty`). */
  status?: ReactNode;
  /** Sorting done by the caller (the server): the current order and what a header click asks for. */
  sorting?: SortingState;
  onSortingChange?: (sorting: SortingState) => void;
  /** Columns pinned at the left edge while the table scrolls sideways (each needs a `size` in px). */
  pinned?: string[];
  density?: Density;
  /** Attributes of a row: data-* for tests, a ref, a class (a highlight). */
  rowProps?: (row: T) => RowAttributes;
  /** A row's sections start with a heading row: rows in `data` are already grouped. */
  sectionOf?: (row: T) => { id: string; title: ReactNode };
  /** Content of a full-width row under a row (an opened row's details), or null. */
  detail?: (row: T) => ReactNode;
  /** The detail row's id, for the button that opens it (aria-controls). */
  detailId?: (row: T) => string;
  /** The detail cell's background and padding (a note or an error under the row sets its own). */
  detailClassName?: string;
  /** The scroll box's size and the table's width (`w-max min-w-full` for a wide one). */
  className?: string;
  tableClassName?: string;
  busy?: boolean;
  bodyRef?: Ref<HTMLTableSectionElement>;
}

/**
 * The row actions column every table ends with: a hidden "Actions" header, the cell right-aligned, `headerWidth` a
 * width class for the header ("" for none).
 */
export function actionsColumn<T>(cell: (row: T) => ReactNode, headerWidth: string): ColumnDef<T> {
  return {
    id: "actions",
    header: () => <span className="sr-only">Actions</span>,
    cell: ({ row }) => cell(row.original),
    meta: { className: "text-right", headerClassName: headerWidth },
  };
}

/** A column of plain cells: `text` of each row; the header takes only `headerClassName` (no width by default). */
export function textColumn<T>(
  id: string,
  header: string,
  text: (row: T) => ReactNode,
  meta: ColumnMeta<T, unknown> = {},
): ColumnDef<T> {
  return {
    id,
    header,
    cell: ({ row }) => text(row.original),
    meta: { ...meta, headerClassName: meta.headerClassName ?? "" },
  };
}

/** A column of dates (UTC, tabular, right-aligned), with the time of day where `withTime`. */
export function dateColumn<T>(
  id: string,
  header: string,
  date: (row: T) => Date | string | null,
  { withTime = false, width = "w-28" }: { withTime?: boolean; width?: string } = {},
): ColumnDef<T> {
  return textColumn(id, header, (row) => <DateText value={date(row)} withTime={withTime} />, {
    numeric: true,
    headerClassName: width,
  });
}

/** A data table: the columns are TanStack column definitions, drawn one way everywhere. */
export function DataTable<T>({
  label,
  columns,
  data,
  getRowId,
  empty,
  status,
  sorting,
  onSortingChange,
  pinned,
  density = "normal",
  rowProps,
  sectionOf,
  detail,
  detailId,
  detailClassName = "bg-surface px-3 py-3 text-sm",
  className,
  tableClassName,
  busy,
  bodyRef,
}: DataTableProps<T>) {
  const table = useReactTable({
    data,
    columns,
    getRowId: (row) => getRowId(row),
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    enableSorting: Boolean(onSortingChange),
    enableSortingRemoval: false,
    sortDescFirst: false,
    enablePinning: Boolean(pinned),
    state: { sorting: sorting ?? [], columnPinning: { left: pinned ?? [] } },
    onSortingChange: (updater) => {
      const current = sorting ?? [];
      onSortingChange?.(typeof updater === "function" ? updater(current) : updater);
    },
  });
  const width = table.getVisibleLeafColumns().length;
  const rows = table.getRowModel().rows;
  return (
    <Table label={label} className={className} tableClassName={tableClassName} busy={busy}>
      <thead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <HeaderCell key={header.id} header={header} compact={density === "compact"} />
            ))}
          </tr>
        ))}
      </thead>
      <tbody ref={bodyRef}>
        {status !== undefined && status !== null ? (
          <EmptyRow colSpan={width}>{status}</EmptyRow>
        ) : rows.length === 0 && empty !== undefined ? (
          <EmptyRow colSpan={width}>{empty}</EmptyRow>
        ) : (
          rows.map((row, k) => {
            const section = sectionOf?.(row.original);
            const previous = k > 0 && sectionOf ? sectionOf(rows[k - 1].original).id : null;
            const opened = detail?.(row.original);
            return (
              <Fragment key={row.id}>
                {section && section.id !== previous ? (
                  <tr>
                    <th
                      scope="colgroup"
                      colSpan={width}
                      className="sticky left-0 h-7 border-b border-line bg-surface px-3 text-left text-xs font-semibold text-ink-muted"
                    >
                      {section.title}
                    </th>
                  </tr>
                ) : null}
                <BodyRow row={row} density={density} attributes={rowProps?.(row.original)} />
                {opened ? (
                  <tr id={detailId?.(row.original)}>
                    <td colSpan={width} className={`border-b border-line ${detailClassName}`}>
                      {opened}
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            );
          })
        )}
      </tbody>
    </Table>
  );
}

function pinStyle<T>(column: Column<T>): CSSProperties | undefined {
  return column.getIsPinned() === "left" ? { left: column.getStart("left") } : undefined;
}

function HeaderCell<T>({ header, compact }: { header: Header<T, unknown>; compact: boolean }) {
  const meta = header.column.columnDef.meta;
  const sorted = header.column.getIsSorted();
  const pinnedLeft = header.column.getIsPinned() === "left";
  const content = header.isPlaceholder
    ? null
    : flexRender(header.column.columnDef.header, header.getContext());
  return (
    <Th
      numeric={meta?.numeric}
      style={pinStyle(header.column)}
      className={`${pinnedLeft ? "z-30!" : ""} ${compact ? "h-7! px-2!" : ""} ${meta?.headerClassName ?? meta?.className ?? ""}`}
      aria-sort={sorted ? (sorted === "asc" ? "ascending" : "descending") : undefined}
    >
      {header.column.getCanSort() ? (
        <button
          type="button"
          onClick={header.column.getToggleSortingHandler()}
          className={`inline-flex items-center gap-1 hover:text-ink ${sorted ? "text-ink" : ""}`}
        >
          {content}
          <SortMark sorted={sorted} />
        </button>
      ) : (
        content
      )}
    </Th>
  );
}

function BodyRow<T>({
  row,
  density,
  attributes,
}: {
  row: Row<T>;
  density: Density;
  attributes: RowAttributes | undefined;
}) {
  const { className = "hover:bg-surface", ...rest } = attributes ?? {};
  return (
    <tr className={`group/row ${className}`} {...rest}>
      {row.getVisibleCells().map((cell) => (
        <BodyCell key={cell.id} cell={cell} density={density} />
      ))}
    </tr>
  );
}

function BodyCell<T>({ cell, density }: { cell: Cell<T, unknown>; density: Density }) {
  const meta = cell.column.columnDef.meta;
  const pinnedLeft = cell.column.getIsPinned() === "left";
  const span = meta?.span?.(cell.row.original) ?? 1;
  if (span === 0) return null;
  const Tag = meta?.rowHeader ? "th" : "td";
  // A pinned cell covers what scrolls under it, so it takes the row's colour (a highlight or the hover).
  const pin = pinnedLeft
    ? "sticky z-[5] bg-panel group-hover/row:bg-surface group-data-highlighted/row:bg-accent-soft"
    : "";
  const { className: extra = "", ...props } = meta?.cellProps?.(cell.row.original) ?? {};
  return (
    <Tag
      scope={meta?.rowHeader ? "row" : undefined}
      colSpan={span > 1 ? span : undefined}
      style={pinStyle(cell.column)}
      className={`${cellClass(density, Boolean(meta?.numeric))} ${meta?.rowHeader ? "text-left font-normal" : ""} ${pin} ${meta?.className ?? ""} ${extra}`}
      {...props}
    >
      {flexRender(cell.column.columnDef.cell, cell.getContext())}
    </Tag>
  );
}

function SortMark({ sorted }: { sorted: false | "asc" | "desc" }) {
  return (
    <svg width="8" height="10" viewBox="0 0 8 10" aria-hidden="true" className={sorted ? "" : "opacity-30"}>
      <path d="M4 1l3 3.2H1z" fill={sorted === "asc" || !sorted ? "currentColor" : "none"} />
      <path d="M4 9L1 5.8h6z" fill={sorted === "desc" || !sorted ? "currentColor" : "none"} />
    </svg>
  );
}
