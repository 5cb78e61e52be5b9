import { useQuery } from "@tanstack/react-query";
import { callJson } from "@/components/library/api";
import type { CaptureSummary } from "@/db/schema";
import type { PulseResult } from "@/lib/soa/types";

// The capture routes' answers as the browser sees them (dates as text, NaN as null).

type Pair = [number | null, number | null];

export interface CaptureListItem {
  id: string;
  name: string;
  fileName: string;
  size: number;
  summary: CaptureSummary;
  /** What came before the record, as stated at upload; null: the engine decided from the data. */
  start: "rest" | "steady" | null;
  note: string | null;
  boardSerial: string | null;
  probe: string | null;
  createdBy: string | null;
  createdAt: string;
}

export interface CaptureDetail {
  capture: CaptureListItem & { trace: { t: number[]; v: Pair[]; i: Pair[]; p: Pair[] } };
  caseTemp: number;
  /** The case temperature through the capture when the project's case path applies (METHODS.md §14). */
  case?: { tjPeak: number; tPeak: number | null; trace: { t: number[]; y: Pair[] } } | null;
  candidates: {
    partId: string;
    partNumber: string;
    maker: string;
    tjMax: number;
    junction: { tjPeak: number; tPeak: number | null; trace: { t: number[]; y: Pair[] } } | null;
  }[];
}

export interface RegisteredCapture {
  capture: { id: string; name: string; summary: CaptureSummary };
  verdicts: Record<string, PulseResult | null>;
  notified: number;
}

export const captureKeys = {
  list: (projectId: string) => ["project-captures", projectId] as const,
  detail: (projectId: string, captureId: string) => ["project-capture", projectId, captureId] as const,
};

export function useCaptures(projectId: string) {
  return useQuery({
    queryKey: captureKeys.list(projectId),
    queryFn: () => callJson<{ captures: CaptureListItem[] }>("GET", `/api/projects/${projectId}/captures`),
  });
}

export function useCapture(projectId: string, captureId: string | null) {
  return useQuery({
    queryKey: captureKeys.detail(projectId, captureId ?? ""),
    queryFn: () => callJson<CaptureDetail>("GET", `/api/projects/${projectId}/captures/${captureId}`),
    enabled: captureId !== null,
  });
}
