"use client";

import { useQueries } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import dynamic from "next/dynamic";
import { type ReactNode, useMemo, useState } from "react";
import { AfterLoad } from "@/components/after-load";
import { messageOf, requestJson } from "@/components/api-client";

import { LoadingBox } from "@/components/loading-box";
import { useChartColours } from "@/components/soa-chart/chart-colours";
import { ChartTable } from "@/components/soa-chart/chart-table";
import { percent, q } from "@/lib/format";
import { verdictWords } from "@/lib/vocabulary";
import { pulseLine, readWidth } from "./format";
import { type LineGroup, lineGroups, MAX_CHOSEN, overlayLines, overlayMarkers } from "./overlay-model";
import { decisionKeys, type LimitsAnswer, type ProjectCheck } from "./types";
import { VerdictMark } from "./verdict-mark";

// The chart loads after the page has loaded (it sits below the matrix), in the browser only (it measures its width
// there).
const drawing = () => <LoadingBox className="h-[28rem]">Drawing the limit lines…</LoadingBox>;
const OverlayChart = dynamic(() => import("./overlay-chart").then((m) => m.OverlayChart), {
  ssr: false,
  loading: drawing,
});

/** The first pulse any candidate fails, else the first pulse: what the overlay opens with. */
function firstChoice(check: ProjectCheck): string[] {
  const failing = check.pulses.find((p) => check.worstByPulse[p.id] === "fail" && readWidth(p) !== null);
  const first = failing ?? check.pulses.find((p) => readWidth(p) !== null);
  return first ? [first.id] : [];
}

/**
 * Chosen pulses against every candidate's derated limit line for the width each pulse is read at, at its case
 * temperature, as the server's engine interpolates it (GET /api/parts/:id/limits).
 */
export function OverlayPanel({ check, title }: { check: ProjectCheck; title: string }) {
  const colours = useChartColours();
  const [chosen, setChosen] = useState<string[]>(() => firstChoice(check));
  const pulses = useMemo(
    () => check.pulses.filter((p) => chosen.includes(p.id) && readWidth(p) !== null),
    [check.pulses, chosen],
  );
  const groups = useMemo(() => lineGroups(pulses), [pulses]);
  const withCurves = check.candidates.filter((c) => c.hasCurves);
  const policy = check.policy.betweenCurves;
  const asks = withCurves.flatMap((c) => groups.map((g) => ({ candidate: c, group: g })));
  const answers = useQueries({
    queries: asks.map(({ candidate, group }) => ({
      queryKey: decisionKeys.line(
        candidate.partId,
        candidate.curveSetId,
        group.caseTemp,
        group.width,
        policy,
      ),
      queryFn: () =>
        requestJson<LimitsAnswer>(
          "GET",
          `/api/parts/${candidate.partId}/limits?${new URLSearchParams({
            caseTemp: String(group.caseTemp),
            width: String(group.width),
            policy,
          })}`,
        ),
      staleTime: 5 * 60_000,
    })),
  });
  const pending = answers.some((a) => a.isPending);
  const failed = answers.find((a) => a.isError);
  const pointsOf = (partId: string, group: LineGroup) =>
    answers[asks.findIndex((a) => a.candidate.partId === partId && a.group.key === group.key)]?.data
      ?.interpolated?.points;
  const lines = overlayLines(withCurves, groups, pointsOf, colours);
  const markers = overlayMarkers(check, pulses);
  const temps = [...new Set(groups.map((g) => g.caseTemp))];

  function toggle(id: string, on: boolean) {
    setChosen((current) => (on ? [...current, id] : current.filter((x) => x !== id)));
  }

  return (
    <div className="grid gap-4 lg:grid-cols-[17rem_1fr]">
      <fieldset className="min-w-0">
        <legend className="mb-1.5 text-xs text-ink-muted">
          Pulses on the chart (up to {MAX_CHOSEN}), worst verdict over the candidates
        </legend>
        <ul className="max-h-[26rem] space-y-0.5 overflow-auto rounded-md border border-line bg-panel p-1">
          {check.pulses.map((p) => {
            const on = chosen.includes(p.id);
            const usable = readWidth(p) !== null && p.v !== null && p.i !== null;
            return (
              <li key={p.id}>
                <label
                  className={`flex items-start gap-2 rounded px-2 py-1.5 text-sm has-checked:bg-accent-soft ${usable ? "cursor-pointer hover:bg-sunken" : "opacity-60"}`}
                >
                  <input
                    type="checkbox"
                    checked={on}
                    disabled={!usable || (!on && chosen.length >= MAX_CHOSEN)}
                    onChange={(e) => toggle(p.id, e.target.checked)}
                    className="mt-0.5 size-4 shrink-0 accent-accent"
                  />
                  <span className="min-w-0 flex-1">
                    <span className="flex items-baseline justify-between gap-2">
                      <span className="truncate font-medium">{p.name}</span>
                      <span className="shrink-0 text-xs">
                        {VerdictMark({ verdict: check.worstByPulse[p.id] ?? "no-data" })}
                      </span>
                    </span>
                    <span className="block truncate text-xs text-ink-muted">{pulseLine(p)}</span>
                  </span>
                </label>
              </li>
            );
          })}
        </ul>
      </fieldset>

      <div className="min-w-0 rounded-md border border-line bg-panel p-4">
        {withCurves.length === 0 ? (
          <Empty>No candidate has SOA curves yet, so there is no limit line to draw.</Empty>
        ) : pulses.length === 0 ? (
          <Empty>Choose one or more pulses at the left to draw every candidate&apos;s limit for them.</Empty>
        ) : failed ? (
          <p role="alert" className="text-sm text-fail">
            {messageOf(failed.error)}
          </p>
        ) : pending ? (
          drawing()
        ) : (
          <>
            <p className="mb-3 text-xs text-ink-muted">
              One line per candidate: its SOA limit for the width each pulse is read at (a falling triangle at
              half its width, a capture at its equal-energy width), derated for{" "}
              {temps.map((t) => q(t, "°C")).join(" and ")} case, single pulse.
              {pulses.some((p) => p.repeat)
                ? " A repeated pulse is judged against a lower limit than the single-pulse line drawn here."
                : ""}
            </p>
            <AfterLoad fallback={drawing()}>
              <OverlayChart
                title={title}
                heading={`Derated limits, ${temps.map((t) => q(t, "°C")).join(" / ")} case`}
                lines={lines}
                markers={markers}
              />
            </AfterLoad>
            <OverlayTable check={check} markers={markers} />
          </>
        )}
      </div>
    </div>
  );
}

function Empty({ children }: { children: ReactNode }) {
  return <p className="rounded-md bg-sunken px-4 py-10 text-center text-sm text-ink-muted">{children}</p>;
}

type Marker = ReturnType<typeof overlayMarkers>[number];
type MarkerRow = Marker["byCandidate"][number] & { marker: Marker; first: boolean };

const overlayColumns: ColumnDef<MarkerRow>[] = [
  {
    id: "pulse",
    header: "Pulse",
    cell: ({ row: { original: r } }) =>
      r.first ? (
        `${r.marker.name} (${q(r.marker.v, "V")}, ${q(r.marker.i, "A")})`
      ) : (
        <span className="sr-only">{r.marker.name}</span>
      ),
    meta: { rowHeader: true },
  },
  { id: "candidate", header: "Candidate", cell: ({ row }) => row.original.partNumber },
  {
    id: "allowed",
    header: "Allowed current",
    cell: ({ row }) => q(row.original.allowed, "A"),
    meta: { numeric: true },
  },
  {
    id: "utilisation",
    header: "Utilisation",
    cell: ({ row }) => percent(row.original.utilisation),
    meta: { numeric: true },
  },
  { id: "verdict", header: "Verdict", cell: ({ row }) => verdictWords[row.original.verdict] },
];

/** The chart's text alternative: each chosen pulse against each candidate's allowed current. */
function OverlayTable({ check, markers }: { check: ProjectCheck; markers: Marker[] }) {
  const rows = markers.flatMap((marker) =>
    marker.byCandidate.map((b, k) => ({ ...b, marker, first: k === 0 })),
  );
  return (
    <ChartTable
      className="mt-2 text-sm"
      summary={
        <>
          Show the chart as a table ({markers.length} {markers.length === 1 ? "pulse" : "pulses"} ×{" "}
          {check.candidates.length} candidates)
        </>
      }
      label="Chosen pulses by candidate"
      columns={overlayColumns}
      data={rows}
      getRowId={(r) => `${r.marker.id}-${r.partNumber}`}
    />
  );
}
