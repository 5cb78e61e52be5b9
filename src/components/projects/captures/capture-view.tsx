"use client";

import { messageOf } from "@/components/api-client";
import { UploadProgress } from "@/components/library/upload-progress";
import { LoadingBox } from "@/components/loading-box";
import type { ProjectCheck } from "../api";
import { type CaptureStatus, useCapture } from "./capture-api";
import { CaptureFigures } from "./capture-figures";
import { bindingMarks, tracePanels, type VerdictOf } from "./capture-traces";
import { CaptureVerdicts } from "./capture-verdicts";
import { TraceCharts } from "./trace-charts";

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
  const { capture, candidates } = detail.data;
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
  const byPart = new Map(candidates.map((c) => [c.partId, c]));
  const verdictOf: VerdictOf = (partId) => {
    const c = byPart.get(partId);
    return c?.stale ? undefined : (c?.result ?? null);
  };

  return (
    <div className="space-y-5" data-testid="capture-view" data-status="done">
      {detail.data.stale && capture.error ? (
        <p role="alert" className="text-sm text-fail">
          {capture.error}
        </p>
      ) : null}
      <CaptureFigures summary={summary} />
      <CaptureVerdicts
        detail={detail.data}
        verdictOf={verdictOf}
        utilisationLimit={check?.policy.utilisationLimit ?? 0.8}
      />
      <TraceCharts
        key={capture.id}
        panels={tracePanels(trace, candidates, detail.data.case ?? null)}
        span={[summary.tStart, summary.tEnd]}
        marks={bindingMarks(candidates, verdictOf)}
      />
    </div>
  );
}
