"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { type MouseEvent, useCallback, useEffect, useMemo, useRef } from "react";
import { DataTable } from "@/components/data-table";
import { factor, money, percent } from "@/lib/format";
import type { MatrixRow } from "@/lib/projects/matrix";
import { verdictWords } from "@/lib/vocabulary";
import { pulseLine, resultLine } from "./format";
import type { CheckedPulse, MatrixData } from "./types";
import { VerdictMark, verdictClass } from "./verdict-mark";

export interface CellRef {
  partId: string;
  pulseId: string;
}

const cellButton =
  "grid min-h-9 w-full grid-cols-[1fr_4.75rem] items-center gap-x-2 px-3 text-right whitespace-nowrap hover:bg-sunken " +
  "focus-visible:outline-offset-[-2px] data-selected:bg-accent-soft";

type Candidate = MatrixData["candidates"][number];
interface RankedRow {
  row: MatrixRow;
  candidate: Candidate;
}

function matrixColumns(
  data: MatrixData,
  pulses: CheckedPulse[],
  onCell: (event: MouseEvent<HTMLButtonElement>) => void,
): ColumnDef<RankedRow>[] {
  const count = data.pulses.length;
  return [
    {
      id: "rank",
      header: "Rank",
      size: 48,
      cell: ({ row }) => row.original.row.rank,
      meta: { numeric: true, className: "w-12 min-w-12 text-ink-muted", headerClassName: "w-12 min-w-12" },
    },
    {
      id: "candidate",
      header: "Candidate",
      size: 272,
      cell: ({ row: { original: r } }) => (
        <span className="flex min-w-0 items-baseline gap-2">
          <span className="font-medium whitespace-nowrap">{r.candidate.partNumber}</span>
          <span className="truncate text-xs text-ink-muted">{r.candidate.maker}</span>
        </span>
      ),
      meta: { rowHeader: true, className: "w-68 min-w-68 max-w-68 border-r" },
    },
    {
      id: "unitCost",
      header: "Unit cost",
      cell: ({ row: { original: r } }) => money(r.candidate.unitCost, r.candidate.currency),
      meta: { numeric: true },
    },
    {
      id: "worst",
      header: () => (
        <>
          Worst case
          <span className="block font-normal text-ink-faint">
            over all {count} {count === 1 ? "pulse" : "pulses"}
          </span>
        </>
      ),
      cell: ({ row: { original: r } }) => (
        <span className="flex items-center justify-end gap-2">
          <span className="font-mono num">{percent(r.row.worstUtilisation)}</span>
          {VerdictMark({ verdict: r.row.worstVerdict, className: "w-[4.75rem]" })}
        </span>
      ),
      meta: { className: "border-r text-xs", headerClassName: "border-r py-1.5 text-right" },
    },
    ...pulses.map(
      (p): ColumnDef<RankedRow> => ({
        id: `pulse-${p.id}`,
        header: () => (
          <span title={p.name}>
            <span className="ml-auto block max-w-[11rem] truncate text-ink">{p.name}</span>
            <span className="block font-normal whitespace-nowrap text-ink-faint">{pulseLine(p)}</span>
          </span>
        ),
        cell: ({ row: { original: r } }) => {
          const result = data.results[r.candidate.partId]?.[p.id];
          const verdict = result?.verdict ?? "no-data";
          return (
            <button
              type="button"
              data-part={r.candidate.partId}
              data-pulse={p.id}
              onClick={onCell}
              title={`${r.candidate.partNumber} × ${p.name}: ${resultLine(result)}`}
              className={cellButton}
            >
              <span className="font-mono num">{percent(result?.utilisation)}</span>
              <span className={verdictClass(verdict)}>{verdictWords[verdict]}</span>
              {result?.stabilityVerdict === "fail" || result?.stabilityVerdict === "marginal" ? (
                <span
                  className="col-span-2 -mt-1 pb-1 text-[10px] text-ink-muted"
                  data-testid="matrix-stability"
                >
                  S {factor(result.stability)}
                  {result.stabilityVerdict === "fail" ? " unstable" : ""}
                </span>
              ) : null}
            </button>
          );
        },
        meta: { className: "px-0! text-xs", headerClassName: "py-1.5 text-right" },
      }),
    ),
  ];
}

/**
 * The comparison matrix: candidates in rank order as rows, pulses as columns, each cell the utilisation and the
 * verdict in words and shape. The table is memoised, so 20 × 200 cells render once and a selection touches one
 * cell's attribute; the header row and the rank and candidate columns stay put while it scrolls.
 */
export function MatrixTable({
  label,
  data,
  ranking,
  pulses,
  selected,
  onSelect,
  stale = false,
}: {
  label: string;
  data: MatrixData;
  ranking: MatrixRow[];
  pulses: CheckedPulse[];
  selected?: CellRef | null;
  onSelect?: (cell: CellRef) => void;
  /** The columns are about to change: dimmed until they do. */
  stale?: boolean;
}) {
  const bodyRef = useRef<HTMLTableSectionElement>(null);
  const select = useRef(onSelect);
  useEffect(() => {
    select.current = onSelect;
  });
  // One handler for every cell, reading the cell from the button: the memoised table never holds a stale one.
  const onCell = useCallback((event: MouseEvent<HTMLButtonElement>) => {
    const { part, pulse } = event.currentTarget.dataset;
    if (part && pulse) select.current?.({ partId: part, pulseId: pulse });
  }, []);
  const rows = useMemo(() => {
    const byId = new Map(data.candidates.map((c) => [c.partId, c]));
    return ranking.flatMap((r) => {
      const candidate = byId.get(r.partId);
      return candidate ? [{ row: r, candidate }] : [];
    });
  }, [data.candidates, ranking]);
  const columns = useMemo(() => matrixColumns(data, pulses, onCell), [data, pulses, onCell]);

  const table = useMemo(
    () => (
      <DataTable
        label={label}
        columns={columns}
        data={rows}
        getRowId={(r) => r.candidate.partId}
        pinned={["rank", "candidate"]}
        rowProps={(r) => ({ "data-part": r.candidate.partId })}
        className="max-h-[min(40rem,75vh)]"
        tableClassName="w-max min-w-full"
        busy={stale}
        bodyRef={bodyRef}
      />
    ),
    [label, columns, rows, stale],
  );

  // The selection marks one button's attribute, so the memoised table is not rendered again.
  // biome-ignore lint/correctness/useExhaustiveDependencies: a new table (filter or data changed) needs the mark again
  useEffect(() => {
    const root = bodyRef.current;
    if (!root) return;
    root.querySelector("[data-selected]")?.removeAttribute("data-selected");
    if (!selected) return;
    const cell = root.querySelector(
      `button[data-part="${CSS.escape(selected.partId)}"][data-pulse="${CSS.escape(selected.pulseId)}"]`,
    );
    cell?.setAttribute("data-selected", "");
  }, [selected, table]);

  return table;
}
