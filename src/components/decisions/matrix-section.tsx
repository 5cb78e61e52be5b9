"use client";

import Link from "next/link";
import { useDeferredValue, useMemo, useState } from "react";
import { Caution } from "@/components/caution";
import { Section } from "@/components/page-header";
import { plural } from "@/lib/format";
import type { MatrixRow } from "@/lib/projects/matrix";
import { SelectedCellDetails } from "./cell-details";
import { MatrixFilters } from "./matrix-filters";
import { type MatrixFilter, pulseCounts, visiblePulses } from "./matrix-model";
import { type CellRef, MatrixTable } from "./matrix-table";
import type { ProjectCheck } from "./types";

/**
 * The ranked matrix of candidates against the pulses the filter shows, or why there is none, and the
 * explanation of the cell chosen in it.
 */
export function MatrixSection({
  projectId,
  check,
  ranking,
  empty,
  filter,
  onFilter,
}: {
  projectId: string;
  check: ProjectCheck;
  ranking: MatrixRow[];
  /** Why there is nothing to compare yet, or null. */
  empty: string | null;
  filter: MatrixFilter;
  onFilter: (filter: MatrixFilter) => void;
}) {
  const [selected, setSelected] = useState<CellRef | null>(null);
  const pulses = useSameList(useMemo(() => visiblePulses(check, filter), [check, filter]));
  // The filters answer at once; the matrix follows in a render React may interrupt.
  const shownPulses = useDeferredValue(pulses);
  const counts = pulseCounts(check.pulses);

  return (
    <Section
      id="matrix"
      title="Candidates against every pulse"
      description="Ranked: parts that pass every pulse first, by worst-case utilisation, then unit cost. Select a cell to see how it was found."
      aside={
        empty ? null : (
          <MatrixFilters
            filter={filter}
            counts={{
              all: check.pulses.length,
              "fault-cases": counts.faultCases,
              measured: counts.measured + counts.captures,
            }}
            onChange={onFilter}
          />
        )
      }
    >
      {empty ? (
        <p className="rounded-md border border-line bg-panel px-4 py-8 text-center text-sm text-ink-muted">
          {empty}{" "}
          <Link href={`/projects/${projectId}`} className="text-accent underline underline-offset-2">
            Open the project
          </Link>
        </p>
      ) : (
        <>
          <MatrixTable
            label="Comparison matrix"
            data={check}
            ranking={ranking}
            pulses={shownPulses}
            stale={shownPulses !== pulses}
            selected={selected}
            onSelect={setSelected}
          />
          {pulses.length === 0 ? (
            <p className="mt-2 text-sm text-ink-muted">
              No pulse matches the filter{filter.failuresOnly ? ": no candidate fails any of them" : ""}.{" "}
              <button
                type="button"
                className="text-accent underline underline-offset-2"
                onClick={() => onFilter({ scope: "all", failuresOnly: false })}
              >
                Show all pulses
              </button>
            </p>
          ) : (
            <p className="mt-2 text-xs text-ink-muted">
              Showing {pulses.length} of {plural(check.pulses.length, "pulse")}; rank and worst case always
              weigh them all.
            </p>
          )}
          <SelectedCellDetails data={check} selected={selected} onClose={() => setSelected(null)} />
        </>
      )}
      <Caution className="mt-3" />
    </Section>
  );
}

/**
 * The previous list while the new one holds the same items in the same order: a filter change that shows the
 * same columns leaves the memoised matrix body alone.
 */
function useSameList<T>(next: T[]): T[] {
  const [kept, setKept] = useState(next);
  const same = next.length === kept.length && next.every((item, k) => item === kept[k]);
  if (!same) setKept(next);
  return same ? kept : next;
}
