import { useQuery } from "@tanstack/react-query";
import { requestJson } from "@/components/api-client";

import type { CaptureSummary } from "@/db/schema";
import type { PulseResult } from "@/lib/soa/types";

// The capture routes' answers as the browser sees them (dates as text, NaN as null).

type Pair = [number | null, number | null];

/** Where a capture's processing job stands. */
export type CaptureStatus = "queued" | "processing" | "done" | "failed";

export interface CaptureListItem {
  id: string;
  name: string;
  fileName: string;
  size: number;
  /** Null until its job has processed it. */
  summary: CaptureSummary | null;
  status: CaptureStatus;
  /** Why processing failed (what and where), or why the last try did while it is retried. */
  error: string | null;
  attempts: number;
  /** What came before the record, as stated at upload; null: the engine decided from the data. */
  start: "rest" | "steady" | null;
  note: string | null;
  boardSerial: string | null;
  probe: string | null;
  createdBy: string | null;
  createdAt: string;
}

export interface CaptureDetail {
  capture: CaptureListItem & { trace: { t: number[]; v: Pair[]; i: Pair[]; p: Pair[] } | null };
  caseTemp: number;
  /** The case temperature through the capture when the project's case path applies (METHODS.md §14). */
  case?: { tjPeak: number; tPeak: number | null; trace: { t: number[]; y: Pair[] } } | null;
  /** Some candidate's stored result rests on inputs that have changed since: it is being recomputed. */
  stale: boolean;
  candidates: {
    partId: string;
    partNumber: string;
    maker: string;
    tjMax: number;
    stale: boolean;
    /** The stored, current result; null while not processed, stale, or without curves. */
    result: PulseResult | null;
    junction: { tjPeak: number; tPeak: number | null; trace: { t: number[]; y: Pair[] } } | null;
  }[];
}

/** The upload's answer: the capture is queued, its job does the rest. */
export interface RegisteredCapture {
  capture: { id: string; name: string; status: CaptureStatus };
  jobId: string | null;
}

/** Whether a capture is still on its way to results. */
export function inProgress(status: CaptureStatus): boolean {
  return status === "queued" || status === "processing";
}

/** How often a page asks again while a capture's job runs, ms. */
const FOLLOW_MS = 1000;

export const captureKeys = {
  list: (projectId: string) => ["project-captures", projectId] as const,
  detail: (projectId: string, captureId: string) => ["project-capture", projectId, captureId] as const,
};

export function useCaptures(projectId: string) {
  return useQuery({
    queryKey: captureKeys.list(projectId),
    queryFn: () => requestJson<{ captures: CaptureListItem[] }>("GET", `/api/projects/${projectId}/captures`),
    refetchInterval: (query) =>
      query.state.data?.captures.some((c) => inProgress(c.status)) ? FOLLOW_MS : false,
  });
}

export function useCapture(projectId: string, captureId: string | null) {
  return useQuery({
    queryKey: captureKeys.detail(projectId, captureId ?? ""),
    queryFn: () => requestJson<CaptureDetail>("GET", `/api/projects/${projectId}/captures/${captureId}`),
    enabled: captureId !== null,
    refetchInterval: (query) => {
      const data = query.state.data;
      // A recheck that gave up says why (capture.error): the page then stops waiting for it.
      const rechecking = data?.stale && data.capture.error === null;
      return data && (inProgress(data.capture.status) || rechecking) ? FOLLOW_MS : false;
    },
  });
}
