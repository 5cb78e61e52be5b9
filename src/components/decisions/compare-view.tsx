"use client";

import Link from "next/link";
import { useDeferredValue, useMemo, useState } from "react";
import { messageOf } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { LoadingBox } from "@/components/loading-box";
import { Section } from "@/components/page-header";
import { StatBlocks } from "@/components/stat-blocks";
import { useUrlState } from "@/components/use-url-state";
import { CellDetails } from "./cell-details";
import { DecisionForm } from "./decision-form";
import { money, percent, plural, q } from "./format";
import { MatrixFilters } from "./matrix-filters";
import {
  bestPassing,
  filterFrom,
  type MatrixFilter,
  pulseCounts,
  rankAll,
  visiblePulses,
} from "./matrix-model";
import { type CellRef, MatrixTable } from "./matrix-table";
import { OverlayPanel } from "./overlay-panel";
import { useCheck, useDecisions } from "./queries";
import type { DecisionSummary, ProjectCheck } from "./types";

/**
 * The lead's comparison: key figures, the decision form when asked for (leads only), the ranked matrix with its
 * filters in the URL, the explanation of a chosen cell, and the overlay of every candidate's limit lines.
 */
export function CompareView({
  projectId,
  projectName,
  canSign,
}: {
  projectId: string;
  projectName: string;
  canSign: boolean;
}) {
  const check = useCheck(projectId);
  if (check.isPending) {
    return (
      <LoadingBox className="h-96">Checking the project: every pulse against every candidate…</LoadingBox>
    );
  }
  if (check.isError) {
    return (
      <p role="alert" className="text-sm text-fail">
        {messageOf(check.error)}
      </p>
    );
  }
  return <Comparison projectId={projectId} projectName={projectName} canSign={canSign} check={check.data} />;
}

function Comparison({
  projectId,
  projectName,
  canSign,
  check,
}: {
  projectId: string;
  projectName: string;
  canSign: boolean;
  check: ProjectCheck;
}) {
  const [params, setParams] = useUrlState();
  const filter = useMemo(() => filterFrom(params), [params]);
  const deciding = canSign && params.get("decide") === "1";
  const [selected, setSelected] = useState<CellRef | null>(null);
  const decisions = useDecisions(projectId);
  const ranking = useMemo(() => rankAll(check), [check]);
  const pulses = useSameList(useMemo(() => visiblePulses(check, filter), [check, filter]));
  // The filters answer at once; the matrix follows in a render React may interrupt.
  const shownPulses = useDeferredValue(pulses);
  const counts = pulseCounts(check.pulses);
  const best = bestPassing(ranking);
  const bestCandidate = check.candidates.find((c) => c.partId === best);
  const bestRow = ranking.find((r) => r.partId === best);
  const passing = ranking.filter((r) => r.passesAll).length;

  function setFilter(next: MatrixFilter) {
    setParams({ pulses: next.scope === "all" ? null : next.scope, failures: next.failuresOnly ? "1" : null });
  }

  const empty =
    check.candidates.length === 0
      ? "No candidates yet. Add the parts to compare on the project page."
      : check.pulses.length === 0
        ? "No fault cases or measured pulses yet. Add them on the project page to compare the candidates."
        : null;

  return (
    <div className="space-y-8">
      <StatBlocks
        items={[
          {
            label: "Candidates",
            value: check.candidates.length,
            note: `${passing} pass every pulse`,
          },
          {
            label: "Pulses",
            value: check.pulses.length,
            note: `${plural(counts.faultCases, "fault case")} · ${counts.measured} measured · ${plural(counts.captures, "capture")}`,
          },
          {
            label: "Best that passes all",
            value: bestCandidate ? bestCandidate.partNumber : "none",
            note: bestRow
              ? `worst utilisation ${percent(bestRow.worstUtilisation)} · ${money(bestCandidate!.unitCost, bestCandidate!.currency)}`
              : "every candidate has a marginal, fail or no data",
          },
          {
            label: "Case temperature",
            value: q(check.policy.caseTemp, "°C"),
            note: (
              <>
                limit {percent(check.policy.utilisationLimit)} · T<sub>j</sub> guard{" "}
                {`${q(check.policy.tjGuard, "")}\u2009K`} · voltage limit {percent(check.policy.voltageLimit)}
              </>
            ),
          },
          standingItem(projectId, check, decisions.data?.decisions, decisions.isPending),
        ]}
      />

      {deciding ? (
        <DecisionForm
          projectId={projectId}
          candidates={check.candidates}
          ranking={ranking}
          onCancel={() => setParams({ decide: null })}
        />
      ) : null}

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
              onChange={setFilter}
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
                  onClick={() => setFilter({ scope: "all", failuresOnly: false })}
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
            {selected ? (
              <div className="mt-3">
                <CellDetails
                  data={check}
                  partId={selected.partId}
                  pulseId={selected.pulseId}
                  onClose={() => setSelected(null)}
                />
              </div>
            ) : null}
          </>
        )}
        <Caution className="mt-3" />
      </Section>

      {empty ? null : (
        <Section
          id="overlay"
          title="Limits side by side"
          description="Every candidate's derated SOA limit for the chosen pulses, on one chart."
        >
          <OverlayPanel check={check} title={projectName} />
          <Caution className="mt-3" />
        </Section>
      )}
    </div>
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

/** The stat block of the standing decision: its part, who signed it and when, linking to the record. */
function standingItem(
  projectId: string,
  check: ProjectCheck,
  decisions: DecisionSummary[] | undefined,
  pending: boolean,
) {
  const label = "Standing decision";
  if (pending) return { label, value: <span className="text-ink-faint">…</span> };
  const standing = decisions?.find((d) => d.supersededBy === null);
  if (!standing) {
    return {
      label,
      value: <span className="text-ink-muted">none yet</span>,
      note: (
        <Link href={`/projects/${projectId}/decisions`} className="hover:text-accent hover:underline">
          {decisions?.length ? "see the history" : "no decision recorded"}
        </Link>
      ),
    };
  }
  const part = check.candidates.find((c) => c.partId === standing.chosenPartId);
  return {
    label,
    value: (
      <Link
        href={`/projects/${projectId}/decisions/${standing.id}`}
        className="block truncate hover:text-accent hover:underline"
        title={standing.chosenLabel}
      >
        {part?.partNumber ?? standing.chosenLabel}
      </Link>
    ),
    note: `${standing.signedByName}, ${standing.signedAt.slice(0, 10)}`,
  };
}
