"use client";

import { useQuery } from "@tanstack/react-query";
import dynamic from "next/dynamic";
import { AfterLoad } from "@/components/after-load";
import { messageOf, requestJson } from "@/components/api-client";

import { LoadingBox } from "@/components/loading-box";
import type { ChartPulse } from "@/components/soa-chart";
import { InstabilityNote } from "@/components/soa-chart/instability-note";
import { factor, percent, q, repeatText } from "@/lib/format";
import { shapeWords } from "@/lib/vocabulary";
import { type CandidateLimits, type CheckedCandidate, type ProjectCheck, projectKeys } from "../api";

// The chart stack loads after the page has loaded (the charts sit below the results table), in the browser only
// (it measures its width there).
const drawing = () => <LoadingBox className="h-[26rem]">Drawing the limit lines…</LoadingBox>;
const SoaChart = dynamic(() => import("@/components/soa-chart").then((m) => m.SoaChart), {
  ssr: false,
  loading: drawing,
});

/**
 * The chart's markers for one candidate: every pulse with a point, in its verdict's shape, labelled by width; a
 * capture at the sample that decided its verdict on this candidate.
 */
export function chartPulses(check: ProjectCheck, partId: string): ChartPulse[] {
  const results = check.results[partId] ?? {};
  return check.pulses.flatMap((p) => {
    // An unclamped turn-off is no point on the curves: its energy is read against the avalanche rating.
    if (p.kind === "avalanche") return [];
    const result = results[p.id];
    // A capture is drawn at its binding sample for this candidate (METHODS.md §6), else at its peak-power sample.
    const at = result?.at ?? null;
    const v = at?.v ?? p.v;
    const i = at?.i ?? p.i;
    if (v === null || i === null || !(v > 0 && i > 0)) return [];
    const words = [
      at
        ? `binding sample at ${q(at.t, "s")}, read at ${at.width === null ? "unlimited width (DC)" : q(at.width, "s")}`
        : `${q(p.duration, "s")} ${shapeWords[p.kind]}`,
      repeatText(p.repeat),
      result?.utilisation !== undefined && result.utilisation !== null
        ? `utilisation ${percent(result.utilisation)}`
        : null,
      p.caseTemp !== check.policy.caseTemp ? `checked at ${q(p.caseTemp, "°C")}` : null,
    ].filter(Boolean);
    return [
      {
        id: p.id,
        v,
        i,
        verdict: result?.verdict ?? "no-data",
        label: `${p.name}: ${words.join(", ")}`,
      },
    ];
  });
}

/**
 * The pulse whose stability factor is highest on this candidate, and the width it was read at: the chart draws the
 * instability boundary for that width (METHODS.md §12), the one that matters most for this part.
 */
export function stabilityFocus(check: ProjectCheck, partId: string) {
  let best: { name: string; width: number; stability: number } | null = null;
  for (const p of check.pulses) {
    const result = check.results[partId]?.[p.id];
    const width = result?.at?.width ?? result?.equivalentWidth ?? p.duration;
    if (result?.stability == null || width === null || !(width > 0)) continue;
    if (!best || result.stability > best.stability)
      best = { name: p.name, width, stability: result.stability };
  }
  return best;
}

/** One candidate's SOA chart at the project's case temperature, with every pulse of the project on it. */
export function CandidateChart({ candidate, check }: { candidate: CheckedCandidate; check: ProjectCheck }) {
  const { caseTemp, betweenCurves } = check.policy;
  const focus = stabilityFocus(check, candidate.partId);
  const search = new URLSearchParams({ caseTemp: String(caseTemp), policy: betweenCurves });
  if (focus) search.set("width", `${focus.width}s`);
  const limits = useQuery({
    queryKey: [
      ...projectKeys.limits(candidate.partId, candidate.curveSetId, caseTemp, betweenCurves),
      focus?.width ?? null,
    ],
    queryFn: () => requestJson<CandidateLimits>("GET", `/api/parts/${candidate.partId}/limits?${search}`),
    enabled: candidate.hasCurves,
  });
  const data = limits.data;
  return (
    <section
      aria-labelledby={`chart-${candidate.partId}`}
      className="min-w-0 rounded-md border border-line bg-panel p-4"
    >
      <h3 id={`chart-${candidate.partId}`} className="text-sm font-semibold">
        {candidate.partNumber} <span className="font-normal text-ink-muted">{candidate.maker}</span>
      </h3>
      <p className="mb-3 text-xs text-ink-muted">
        {data && data.derating < 1
          ? `Dashed: curves derated ×${factor(data.derating)} for ${q(caseTemp, "°C")} case. Hover a marker for its pulse.`
          : `Curves at ${q(data?.refCaseTemp ?? 25, "°C")} case. Hover a marker for its pulse.`}
      </p>
      {!candidate.hasCurves ? (
        <p className="rounded-md bg-sunken px-4 py-8 text-center text-sm text-ink-muted">
          No SOA curves yet: every verdict for this part is &ldquo;no data&rdquo;.
        </p>
      ) : limits.isError ? (
        <p role="alert" className="text-sm text-fail">
          {messageOf(limits.error)}
        </p>
      ) : !data ? (
        drawing()
      ) : (
        <AfterLoad fallback={drawing()}>
          <SoaChart
            title={candidate.partNumber}
            curves={data.curves}
            refCaseTemp={data.refCaseTemp}
            derated={
              data.derating < 1
                ? { caseTemp: data.caseTemp, factor: data.derating, curves: data.derated }
                : null
            }
            pulses={chartPulses(check, candidate.partId)}
            instability={data.instability}
          />
        </AfterLoad>
      )}
      {focus && data?.instability ? (
        <div className="mt-2 space-y-1">
          <p className="text-xs text-ink-muted">
            Boundary drawn for {focus.name}, the pulse with the highest stability factor on this part (S ={" "}
            {factor(focus.stability)}).
          </p>
          <InstabilityNote width={focus.width} zth={data.instability.zth} hasTransfer hasThermal />
        </div>
      ) : null}
    </section>
  );
}
