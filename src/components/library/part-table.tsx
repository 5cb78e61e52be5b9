"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import {
  type ColumnDef,
  flexRender,
  getCoreRowModel,
  type SortingState,
  useReactTable,
} from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import type { ReactNode } from "react";
import { messageOf } from "@/components/api-client";
import { Button } from "@/components/form";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { technologyLabels } from "@/lib/library/technologies";
import { callJson } from "./api";
import { costText, inUnit } from "./format";
import {
  apiQuery,
  hasFilters,
  type LibraryState,
  PAGE_SIZE,
  type PartPage,
  type PartRow,
  readState,
  type SortKey,
  sortKeys,
  writeState,
} from "./library-query";
import { PartFilters } from "./part-filters";
import { PartStatus } from "./part-status";
import { Sym } from "./symbols";

// Eleven columns fit the content width with a little less side padding than the shared table's.
const dense = "px-2.5!";

interface ColumnMeta {
  numeric?: boolean;
  className?: string;
}

const columns: ColumnDef<PartRow>[] = [
  {
    id: "partNumber",
    header: "Part number",
    cell: ({ row }) => (
      <Link
        href={`/library/${row.original.id}`}
        title={row.original.partNumber}
        className="font-medium text-accent hover:underline"
      >
        {row.original.partNumber}
      </Link>
    ),
    meta: { className: "max-w-40 truncate" },
  },
  {
    id: "maker",
    header: "Maker",
    cell: ({ row }) => <span title={row.original.maker}>{row.original.maker}</span>,
    meta: { className: "max-w-32 truncate" },
  },
  { id: "technology", header: "Technology", cell: ({ row }) => technologyLabels[row.original.technology] },
  { id: "package", header: "Package", cell: ({ row }) => row.original.package },
  {
    id: "vdsMax",
    header: () => <HeaderUnit symbol={<Sym main="V" sub="DSS" />} unit="V" />,
    cell: ({ row }) => inUnit(row.original.vdsMax),
    meta: { numeric: true },
  },
  {
    id: "rdsOn",
    header: () => <HeaderUnit symbol={<Sym main="R" sub="DS(on)" />} unit="mΩ" />,
    cell: ({ row }) => inUnit(row.original.rdsOn, 1e-3),
    meta: { numeric: true },
  },
  {
    id: "idMax",
    header: () => <HeaderUnit symbol={<Sym main="I" sub="D" />} unit="A" />,
    cell: ({ row }) => inUnit(row.original.idMax),
    meta: { numeric: true },
    enableSorting: false,
  },
  {
    id: "tjMax",
    header: () => <HeaderUnit symbol={<Sym main="T" sub="j,max" />} unit="°C" />,
    cell: ({ row }) => inUnit(row.original.tjMax),
    meta: { numeric: true },
    enableSorting: false,
  },
  {
    id: "thermal",
    header: "Thermal model",
    meta: { className: "text-ink-muted" },
    cell: ({ row }) => (row.original.hasThermalModel ? "yes" : <span className="text-ink-faint">no</span>),
    enableSorting: false,
  },
  { id: "status", header: "Status", cell: ({ row }) => <PartStatus status={row.original.status} /> },
  {
    id: "unitCost",
    header: "Unit cost",
    cell: ({ row }) => costText(row.original.unitCost, row.original.currency),
    meta: { numeric: true },
    enableSorting: false,
  },
];

function HeaderUnit({ symbol, unit }: { symbol: ReactNode; unit: string }) {
  return (
    <>
      {symbol} ({unit})
    </>
  );
}

/** The library: one page of parts from the server, sorted, searched and filtered, with all of it in the URL. */
export function PartTable({ canWrite }: { canWrite: boolean }) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const state = readState(params);
  const query = useQuery({
    queryKey: ["parts", apiQuery(state)],
    queryFn: () => callJson<PartPage>("GET", `/api/parts?${apiQuery(state)}`),
    placeholderData: keepPreviousData,
  });

  function update(change: Partial<LibraryState>) {
    const next = { ...state, page: 1, ...change };
    const search = writeState(next).toString();
    router.replace(search ? `${pathname}?${search}` : pathname, { scroll: false });
  }

  const sorting: SortingState = [{ id: state.sort, desc: state.dir === "desc" }];
  const table = useReactTable({
    data: query.data?.rows ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    sortDescFirst: false,
    state: { sorting },
    onSortingChange: (updater) => {
      const [first] = typeof updater === "function" ? updater(sorting) : updater;
      if (first && sortKeys.includes(first.id as SortKey)) {
        update({ sort: first.id as SortKey, dir: first.desc ? "desc" : "asc" });
      }
    },
  });

  const data = query.data;
  const total = data?.total ?? 0;
  const first = total === 0 ? 0 : (state.page - 1) * PAGE_SIZE + 1;
  const last = Math.min(total, state.page * PAGE_SIZE);
  const filtered = hasFilters(state);

  return (
    <div className="space-y-3">
      <PartFilters state={state} facets={data?.facets} onChange={update} />
      <Table label="Parts">
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta as ColumnMeta | undefined;
                const sorted = header.column.getIsSorted();
                const content = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <Th
                    key={header.id}
                    numeric={meta?.numeric}
                    className={dense}
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
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {query.isPending ? (
            <EmptyRow colSpan={columns.length}>Loading parts…</EmptyRow>
          ) : query.isError ? (
            <EmptyRow colSpan={columns.length}>
              <span role="alert" className="text-fail">
                {messageOf(query.error)}
              </span>
            </EmptyRow>
          ) : total === 0 ? (
            <EmptyRow colSpan={columns.length}>
              {filtered ? (
                <span className="inline-flex items-center gap-3">
                  No parts match these filters.
                  <Button size="sm" onClick={() => router.replace(pathname, { scroll: false })}>
                    Clear filters
                  </Button>
                </span>
              ) : (
                <span className="flex flex-col items-center gap-3">
                  <span className="text-base font-medium text-ink">No parts yet</span>
                  {canWrite ? (
                    <>
                      <span>Add a transistor with its ratings, then upload its SOA curves.</span>
                      <NewPartLink />
                    </>
                  ) : (
                    <span>An engineer adds parts to the library; they appear here.</span>
                  )}
                </span>
              )}
            </EmptyRow>
          ) : (
            table.getRowModel().rows.map((row) => (
              <Tr key={row.id} className={query.isPlaceholderData ? "opacity-60" : ""}>
                {row.getVisibleCells().map((cell) => {
                  const meta = cell.column.columnDef.meta as ColumnMeta | undefined;
                  return (
                    <Td key={cell.id} numeric={meta?.numeric} className={`${dense} ${meta?.className ?? ""}`}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </Td>
                  );
                })}
              </Tr>
            ))
          )}
        </tbody>
      </Table>
      <nav aria-label="Pages" className="flex items-center justify-between gap-3 text-sm text-ink-muted">
        <p className="num">
          {total === 0 ? "No parts" : `${first}–${last} of ${total} parts`}
          {state.archived ? " (archived)" : ""}
        </p>
        <div className="flex items-center gap-2">
          <Button size="sm" disabled={state.page <= 1} onClick={() => update({ page: state.page - 1 })}>
            Previous
          </Button>
          <Button size="sm" disabled={last >= total} onClick={() => update({ page: state.page + 1 })}>
            Next
          </Button>
        </div>
      </nav>
    </div>
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

export function NewPartLink() {
  return (
    <Link
      href="/library/new"
      className="inline-flex h-9 items-center rounded-md bg-accent px-4 text-sm font-medium text-white hover:bg-accent-strong"
    >
      New part
    </Link>
  );
}
