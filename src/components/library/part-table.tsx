"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { ColumnDef, SortingState } from "@tanstack/react-table";
import Link from "next/link";
import type { ReactNode } from "react";
import { requestJson } from "@/components/api-client";
import { DataTable } from "@/components/data-table";
import { Button } from "@/components/form";
import { queryStatus } from "@/components/query-status";
import { useUrlState } from "@/components/use-url-state";
import { inUnit, money } from "@/lib/format";
import { technologyLabels } from "@/lib/library/technologies";

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
    meta: { className: `${dense} max-w-40 truncate`, headerClassName: dense },
  },
  {
    id: "maker",
    header: "Maker",
    cell: ({ row }) => <span title={row.original.maker}>{row.original.maker}</span>,
    meta: { className: `${dense} max-w-32 truncate`, headerClassName: dense },
  },
  {
    id: "technology",
    header: "Technology",
    cell: ({ row }) => technologyLabels[row.original.technology],
    meta: { className: dense },
  },
  { id: "package", header: "Package", cell: ({ row }) => row.original.package, meta: { className: dense } },
  {
    id: "vdsMax",
    header: () => <HeaderUnit symbol={<Sym main="V" sub="DSS" />} unit="V" />,
    cell: ({ row }) => inUnit(row.original.vdsMax),
    meta: { numeric: true, className: dense },
  },
  {
    id: "rdsOn",
    header: () => <HeaderUnit symbol={<Sym main="R" sub="DS(on)" />} unit="mΩ" />,
    cell: ({ row }) => inUnit(row.original.rdsOn, 1e-3),
    meta: { numeric: true, className: dense },
  },
  {
    id: "idMax",
    header: () => <HeaderUnit symbol={<Sym main="I" sub="D" />} unit="A" />,
    cell: ({ row }) => inUnit(row.original.idMax),
    meta: { numeric: true, className: dense },
    enableSorting: false,
  },
  {
    id: "tjMax",
    header: () => <HeaderUnit symbol={<Sym main="T" sub="j,max" />} unit="°C" />,
    cell: ({ row }) => inUnit(row.original.tjMax),
    meta: { numeric: true, className: dense },
    enableSorting: false,
  },
  {
    id: "thermal",
    header: "Thermal model",
    meta: { className: `${dense} text-ink-muted`, headerClassName: dense },
    cell: ({ row }) => (row.original.hasThermalModel ? "yes" : <span className="text-ink-faint">no</span>),
    enableSorting: false,
  },
  {
    id: "status",
    header: "Status",
    cell: ({ row }) => <PartStatus status={row.original.status} />,
    meta: { className: dense },
  },
  {
    id: "unitCost",
    header: "Unit cost",
    cell: ({ row }) => money(row.original.unitCost, row.original.currency),
    meta: { numeric: true, className: dense },
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
  const [params, setParams] = useUrlState();
  const state = readState(params);
  const query = useQuery({
    queryKey: ["parts", apiQuery(state)],
    queryFn: () => requestJson<PartPage>("GET", `/api/parts?${apiQuery(state)}`),
    placeholderData: keepPreviousData,
  });

  function update(change: Partial<LibraryState>) {
    const next = { ...state, page: 1, ...change };
    setParams(writeState(next));
  }

  const sorting: SortingState = [{ id: state.sort, desc: state.dir === "desc" }];
  const data = query.data;
  const total = data?.total ?? 0;
  const first = total === 0 ? 0 : (state.page - 1) * PAGE_SIZE + 1;
  const last = Math.min(total, state.page * PAGE_SIZE);
  const filtered = hasFilters(state);

  return (
    <div className="space-y-3">
      <PartFilters state={state} facets={data?.facets} onChange={update} />
      <DataTable
        label="Parts"
        columns={columns}
        data={data?.rows ?? []}
        getRowId={(row) => row.id}
        sorting={sorting}
        onSortingChange={([next]) => {
          if (next && sortKeys.includes(next.id as SortKey)) {
            update({ sort: next.id as SortKey, dir: next.desc ? "desc" : "asc" });
          }
        }}
        rowProps={() => ({ className: `hover:bg-surface ${query.isPlaceholderData ? "opacity-60" : ""}` })}
        status={queryStatus(query, "Loading parts…")}
        empty={
          filtered ? (
            <span className="inline-flex items-center gap-3">
              No parts match these filters.
              <Button size="sm" onClick={() => setParams(new URLSearchParams())}>
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
          )
        }
      />
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
