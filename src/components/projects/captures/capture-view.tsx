"use client";

import type { ReactNode } from "react";
import { messageOf } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { Sym } from "@/components/library/symbols";
import { UploadProgress } from "@/components/library/upload-progress";
import { LoadingBox } from "@/components/loading-box";
import { explainFlag } from "@/lib/soa/explain";
import type { ProjectCheck } from "../api";
import { q } from "../format";
import { type CaptureStatus, useCapture } from "./capture-api";
import { CaptureVerdicts, verdictOf } from "./capture-verdicts";
import { TraceCharts, type TracePanel } from "./trace-charts";

const junctionStyles = [
  { stroke: "var(--color-accent)", dash: undefined },
  { stroke: "var(--color-ink)", dash: "6 3" },
  { stroke: "var(--color-ink-muted)", dash: "2 2" },
  { stroke: "var(--color-accent-strong)", dash: "9 3 2 3" },
];

function startWords(start: "rest" | "steady" | null): string {
  if (start === "rest") return "rest (as stated at upload)";
  if (start === "steady") return "the first sample's level, settled (as stated at upload)";
  return "rest, or from the first sample's level where the record begins mid-pulse";
}

function Figure({ label, value, note }: { label: ReactNode; value: string; note?: string }) {
  return (
    <div className="rounded-md border border-line bg-panel px-3 py-2">
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd className="num mt-0.5 font-mono text-sm">{value}</dd>
      {note ? <dd className="text-xs text-ink-faint">{note}</dd> : null}
    </div>
  );
}

/** A capture on its way to results: queued or being processed, and why the last try failed when it is retried. */
function CaptureProgress({ status, error }: { status: "queued" | "processing"; error?: string | null }) {
  return (
    <div className="space-y-2" data-testid="capture-status" data-status={status}>
      <UploadProgress
        label={
          status === "queued"
            ? "Queued: waiting for a worker to read the samples and check them…"
            : "Processing: reading the samples, computing power, energy and junction temperature, checking every candidate…"
        }
        fraction={null}
      />
      {error ? <p className="text-xs text-ink-muted">{error}</p> : null}
    </div>
  );
}

/**
 * One capture: while its job runs, its progress; if it failed, what failed and where; then its figures, its
 * verdict against every candidate (stored when its job finished), and V, I, P and T_j against a shared time axis.
 */
export function CaptureView({
  projectId,
  captureId,
  check,
  registered,
}: {
  projectId: string;
  captureId: string;
  check: ProjectCheck | undefined;
  /** The status the upload answered with, shown until the capture's own answer arrives. */
  registered: CaptureStatus | null;
}) {
  const detail = useCapture(projectId, captureId);
  if (detail.isPending) {
    if (registered === "queued" || registered === "processing")
      return <CaptureProgress status={registered} />;
    return <LoadingBox className="h-96">Loading the waveforms of the capture…</LoadingBox>;
  }
  if (detail.isError) {
    return (
      <p role="alert" className="text-sm text-fail">
        {messageOf(detail.error)}
      </p>
    );
  }
  const { capture, candidates, caseTemp } = detail.data;
  const { summary, trace } = capture;
  if (capture.status === "failed") {
    return (
      <div role="alert" className="space-y-1 text-sm" data-testid="capture-status" data-status="failed">
        <p className="font-medium text-fail">This capture could not be processed.</p>
        <p>{capture.error ?? "Its job failed."}</p>
        <p className="text-xs text-ink-muted">
          Fix the file or its columns and upload it again; delete this one.
        </p>
      </div>
    );
  }
  if (capture.status !== "done" || !summary || !trace) {
    return (
      <CaptureProgress
        status={capture.status === "processing" ? "processing" : "queued"}
        error={capture.error}
      />
    );
  }
  const eq = summary.equivalent;
  const byPart = new Map(candidates.map((c) => [c.partId, c]));
  const resultOf = (partId: string) => verdictOf(byPart.get(partId));

  const panels: TracePanel[] = [
    {
      key: "v",
      symbol: { main: "V", sub: "DS" },
      name: "V_DS",
      unit: "V",
      series: [{ key: "v", label: "V_DS", t: trace.t, y: trace.v, stroke: "var(--color-accent)" }],
    },
    {
      key: "i",
      symbol: { main: "I", sub: "D" },
      name: "I_D",
      unit: "A",
      series: [{ key: "i", label: "I_D", t: trace.t, y: trace.i, stroke: "var(--color-accent)" }],
    },
    {
      key: "p",
      symbol: { main: "P" },
      name: "P",
      unit: "W",
      series: [{ key: "p", label: "P", t: trace.t, y: trace.p, stroke: "var(--color-accent)" }],
    },
  ];
  const junctions = candidates.filter((c) => c.junction !== null);
  const heatedCase = detail.data.case ?? null;
  if (junctions.length) {
    panels.push({
      key: "tj",
      symbol: { main: "T", sub: "j" },
      name: heatedCase ? "T_j and the case T_C" : "T_j",
      unit: "°C",
      series: [
        ...junctions.map((c, k) => ({
          key: `tj-${c.partId}`,
          label: c.partNumber,
          t: c.junction!.trace.t,
          y: c.junction!.trace.y,
          ...junctionStyles[k % junctionStyles.length],
        })),
        // The case heated through the project's case path: the junction traces above include its rise.
        ...(heatedCase
          ? [
              {
                key: "case",
                label: "T_C, case path",
                t: heatedCase.trace.t,
                y: heatedCase.trace.y,
                stroke: "var(--color-marginal)",
                dash: "4 2",
              },
            ]
          : []),
      ],
    });
  }

  return (
    <div className="space-y-5" data-testid="capture-view" data-status="done">
      {detail.data.stale && capture.error ? (
        <p role="alert" className="text-sm text-fail">
          {capture.error}
        </p>
      ) : null}
      <dl className="grid grid-cols-[repeat(auto-fill,minmax(8rem,1fr))] gap-2">
        <Figure
          label="Samples"
          value={summary.samples.toLocaleString("en-GB")}
          note={summary.uniform ? "uniform time step" : "uneven time step"}
        />
        <Figure label="Length" value={q(summary.tEnd - summary.tStart, "s")} />
        <Figure
          label={
            <>
              Highest <Sym main="V" sub="DS" />
            </>
          }
          value={q(summary.vMax, "V")}
        />
        <Figure
          label={
            <>
              Highest |<Sym main="I" sub="D" />|
            </>
          }
          value={q(summary.iMaxAbs, "A")}
        />
        <Figure label="Peak power" value={q(summary.pPeak, "W")} note={`at ${q(summary.tPeak, "s")}`} />
        <Figure label="Energy" value={q(summary.energy, "J")} />
        <Figure
          label="Equal-energy rectangle"
          value={eq.ok ? q(eq.duration, "s") : "none"}
          note={
            eq.ok
              ? `at ${q(eq.v, "V")} × ${q(eq.i, "A")}`
              : explainFlag(eq.flag as Parameters<typeof explainFlag>[0])
          }
        />
      </dl>

      <div>
        <CaptureVerdicts
          name={capture.name}
          candidates={candidates}
          limit={check?.policy.utilisationLimit ?? 0.8}
        />
        <p className="mt-2 text-xs text-ink-muted">
          Every sample is read on the curves at its own voltage and at its own width (the record&apos;s energy
          over its power, at most the record&apos;s length); the binding sample, marked on the traces, decided
          the curve verdict. The junction temperature runs from {startWords(capture.start)} at{" "}
          {q(caseTemp, "°C")} case through every sample, between samples included, where the part has a
          thermal model.
          {heatedCase
            ? ` The project's case path heats the case from the same power (dashed T_C, up to ${q(heatedCase.tjPeak, "°C")}); each junction trace includes that rise. Driving the case path with the full power overstates the case rise, so this is conservative.`
            : null}
        </p>
        <Caution className="mt-2" />
      </div>

      <TraceCharts
        key={capture.id}
        panels={panels}
        span={[summary.tStart, summary.tEnd]}
        marks={candidates.flatMap((c) => {
          const result = resultOf(c.partId);
          if (!result?.at) return [];
          return [
            {
              key: c.partId,
              t: result.at.t,
              verdict: result.verdict,
              label: `${c.partNumber}: binding sample, ${q(result.at.v, "V")} × ${q(result.at.i, "A")}`,
            },
          ];
        })}
      />
    </div>
  );
}
