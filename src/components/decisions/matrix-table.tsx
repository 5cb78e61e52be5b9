"use client";

import { type MouseEvent, useCallback, useEffect, useMemo, useRef } from "react";
import { ScrollRegion } from "@/components/scroll-region";
import type { MatrixRow } from "@/lib/projects/matrix";
import { money, percent, pulseLine, resultLine, verdictWords } from "./format";
import type { CheckedPulse, MatrixData } from "./types";
import { VerdictMark, verdictClass } from "./verdict-mark";

export interface CellRef {
  partId: string;
  pulseId: string;
}

const head = "sticky top-0 border-b border-line bg-sunken px-3 text-xs font-medium text-ink-muted";
const rankCol = "sticky left-0 w-12 min-w-12";
const partCol = "sticky left-12 w-68 min-w-68 max-w-68 border-r border-line";
const body = "h-9 border-b border-line bg-panel group-hover/row:bg-surface";
const cellButton =
  "grid min-h-9 w-full grid-cols-[1fr_4.75rem] items-center gap-x-2 px-3 text-right whitespace-nowrap hover:bg-sunken " +
  "focus-visible:outline-offset-[-2px] data-selected:bg-accent-soft";

/**
 * The comparison matrix: candidates in rank order as rows, pulses as columns, each cell the utilisation and the
 * verdict in words and shape. Plain elements and one memoised body, so 20 × 200 cells render once and a selection
 * touches one cell's attribute; the header row and the rank and candidate columns stay put while it scrolls.
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
  // One handler for every cell, reading the cell from the button: the memoised body never holds a stale one.
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

  const tbody = useMemo(
    () => (
      <tbody ref={bodyRef}>
        {rows.map(({ row, candidate }) => {
          const byPulse = data.results[candidate.partId] ?? {};
          return (
            <tr key={candidate.partId} className="group/row" data-part={candidate.partId}>
              <td className={`${body} ${rankCol} z-10 px-3 text-right font-mono text-xs num text-ink-muted`}>
                {row.rank}
              </td>
              <th scope="row" className={`${body} ${partCol} z-10 px-3 text-left font-normal`}>
                <span className="flex min-w-0 items-baseline gap-2">
                  <span className="font-medium whitespace-nowrap">{candidate.partNumber}</span>
                  <span className="truncate text-xs text-ink-muted">{candidate.maker}</span>
                </span>
              </th>
              <td className={`${body} px-3 text-right font-mono text-xs whitespace-nowrap num`}>
                {money(candidate.unitCost, candidate.currency)}
              </td>
              <td className={`${body} border-r px-3 text-xs whitespace-nowrap`}>
                <span className="flex items-center justify-end gap-2">
                  <span className="font-mono num">{percent(row.worstUtilisation)}</span>
                  {VerdictMark({ verdict: row.worstVerdict, className: "w-[4.75rem]" })}
                </span>
              </td>
              {pulses.map((p) => {
                const result = byPulse[p.id];
                const verdict = result?.verdict ?? "no-data";
                return (
                  <td key={p.id} className={`${body} p-0 text-xs`}>
                    <button
                      type="button"
                      data-part={candidate.partId}
                      data-pulse={p.id}
                      onClick={onCell}
                      title={`${candidate.partNumber} × ${p.name}: ${resultLine(result)}`}
                      className={cellButton}
                    >
                      <span className="font-mono num">{percent(result?.utilisation)}</span>
                      <span className={verdictClass(verdict)}>{verdictWords[verdict]}</span>
                      {result?.stabilityVerdict === "fail" || result?.stabilityVerdict === "marginal" ? (
                        <span
                          className="col-span-2 -mt-1 pb-1 text-[10px] text-ink-muted"
                          data-testid="matrix-stability"
                        >
                          S {result.stability?.toFixed(2)}
                          {result.stabilityVerdict === "fail" ? " unstable" : ""}
                        </span>
                      ) : null}
                    </button>
                  </td>
                );
              })}
            </tr>
          );
        })}
      </tbody>
    ),
    [rows, pulses, data.results, onCell],
  );

  // The selection marks one button's attribute, so the memoised body is not rendered again.
  // biome-ignore lint/correctness/useExhaustiveDependencies: a new body (filter or data changed) needs the mark again
  useEffect(() => {
    const root = bodyRef.current;
    if (!root) return;
    root.querySelector("[data-selected]")?.removeAttribute("data-selected");
    if (!selected) return;
    const cell = root.querySelector(
      `button[data-part="${CSS.escape(selected.partId)}"][data-pulse="${CSS.escape(selected.pulseId)}"]`,
    );
    cell?.setAttribute("data-selected", "");
  }, [selected, tbody]);

  return (
    <ScrollRegion
      aria-busy={stale || undefined}
      className={`max-h-[min(40rem,75vh)] overflow-auto rounded-md border border-line bg-panel transition-opacity ${stale ? "opacity-60" : ""}`}
    >
      <table aria-label={label} className="w-max min-w-full border-separate border-spacing-0 text-sm">
        <thead>
          <tr>
            <th scope="col" className={`${head} ${rankCol} z-30 text-right`}>
              Rank
            </th>
            <th scope="col" className={`${head} ${partCol} z-30 text-left`}>
              Candidate
            </th>
            <th scope="col" className={`${head} z-20 text-right whitespace-nowrap`}>
              Unit cost
            </th>
            <th scope="col" className={`${head} z-20 border-r py-1.5 text-right whitespace-nowrap`}>
              Worst case
              <span className="block font-normal text-ink-faint">
                over all {data.pulses.length} {data.pulses.length === 1 ? "pulse" : "pulses"}
              </span>
            </th>
            {pulses.map((p) => (
              <th key={p.id} scope="col" className={`${head} z-20 py-1.5 text-right`} title={p.name}>
                <span className="ml-auto block max-w-[11rem] truncate text-ink">{p.name}</span>
                <span className="block font-normal whitespace-nowrap text-ink-faint">{pulseLine(p)}</span>
              </th>
            ))}
          </tr>
        </thead>
        {tbody}
      </table>
    </ScrollRegion>
  );
}
