import { type QueryClient, useQuery } from "@tanstack/react-query";
import { requestJson } from "@/components/api-client";
import type { ChartCurve, ChartFinding } from "@/components/soa-chart";
import type { CsvIssue } from "@/lib/csv/issues";
import type { MeasurementColumns } from "@/lib/csv/measurements";
import type { ProjectPulse } from "@/lib/projects/evaluate";
import type { PulseColumns, StoredShape } from "@/lib/projects/pulse-columns";
import type { BetweenCurves, Flag, PulseResult, Repeat, Verdict } from "@/lib/soa/types";

// The project screens' view of our route handlers: the JSON they answer with (dates as ISO text), their query
// keys, and the one invalidation every change of a project goes through.

export interface ProjectRecord {
  id: string;
  name: string;
  description: string | null;
  caseTemp: number;
  utilisationLimit: number;
  tjGuard: number;
  voltageLimit: number;
  betweenCurves: BetweenCurves;
  /** Case-to-ambient Foster network (METHODS.md §14) and whether checks heat the case through it. */
  caseNetwork?: { r: number; tau: number }[] | null;
  applyCaseNetwork?: boolean;
  ownerId: string | null;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface CandidatePart {
  id: string;
  partNumber: string;
  maker: string;
  package: string;
  vdsMax: number;
  tjMax: number;
  /** Avalanche breakdown voltage V_BR, when the part gives it. */
  avalancheBreakdown: number | null;
  status: "draft" | "verified";
  foster: unknown[] | null;
  unitCost: number | null;
  currency: string | null;
  archivedAt: string | null;
}

export interface FaultCaseRecord {
  id: string;
  name: string;
  /** A rectangle or triangle; an unclamped turn-off (V the supply, I the current cut); a fault sequence. */
  kind: "rect" | "triangle" | "avalanche" | "waveform";
  v: number;
  i: number;
  /** Null for an unclamped turn-off and a fault sequence. */
  duration: number | null;
  /** An unclamped turn-off's loop inductance, H. */
  inductance: number | null;
  /** A fault sequence's samples (SI). */
  samples: { t: number[]; v: number[]; i: number[] } | null;
  repeatPeriod: number | null;
  repeatCount: number | null;
  caseTemp: number | null;
  notes: string | null;
  origin: { builder: string; input: Record<string, unknown>; figures: Record<string, unknown> } | null;
  createdBy: string | null;
  createdAt: string;
}

export interface MeasuredRecord extends PulseColumns {
  id: string;
  label: string;
  note: string | null;
  boardSerial: string | null;
  probe: string | null;
  createdBy: string | null;
  createdAt: string;
}

export interface ProjectDetail {
  project: ProjectRecord;
  candidates: { part: CandidatePart; hasCurves: boolean }[];
  faultCases: FaultCaseRecord[];
  measuredPulses: MeasuredRecord[];
}

/** A pulse as the check's response carries it: the project's pulse without the engine's input and stored results. */
export type CheckedPulse = Omit<ProjectPulse, "pulse" | "stored">;

export interface CheckedCandidate {
  partId: string;
  partNumber: string;
  maker: string;
  status: "draft" | "verified";
  unitCost: number | null;
  currency: string | null;
  hasCurves: boolean;
  hasThermalModel: boolean;
  curveSetId: string | null;
  /** The widths of the active curve set's curves (absent in records frozen before they were kept). */
  widths?: (number | "DC")[];
}

export interface ProjectCheck {
  policy: {
    caseTemp: number;
    utilisationLimit: number;
    tjGuard: number;
    voltageLimit: number;
    betweenCurves: BetweenCurves;
  };
  candidates: CheckedCandidate[];
  pulses: CheckedPulse[];
  results: Record<string, Record<string, PulseResult>>;
  worstByPulse: Record<string, Verdict>;
  /** Captures being processed or rechecked: their results are not all here yet (absent in frozen records). */
  pendingCaptures?: string[];
}

export interface CandidateLimits {
  refCaseTemp: number;
  caseTemp: number;
  derating: number;
  curves: ChartCurve[];
  derated: ChartCurve[];
  findings: ChartFinding[];
  instability: { width: number; zth: number; points: [number, number][] } | null;
}

export interface PreviewRow {
  row: number;
  label: string;
  kind: StoredShape;
  v: number | null;
  i: number | null;
  duration: number | null;
  repeat?: Repeat;
  errors: CsvIssue[];
  verdicts: Record<string, PulseResult | null>;
}

export interface MeasurementPreview {
  candidates: { partId: string; partNumber: string; maker: string; hasCurves: boolean }[];
  rows: PreviewRow[];
  errors: CsvIssue[];
  hasHeader: boolean;
  columns: MeasurementColumns;
}

export type { Flag, PulseResult, Verdict };

export const projectKeys = {
  detail: (id: string) => ["project", id] as const,
  check: (id: string) => ["project-check", id] as const,
  limits: (partId: string, curveSetId: string | null, caseTemp: number, policy: string) =>
    ["project-limits", partId, curveSetId, caseTemp, policy] as const,
};

/** How long a check stays fresh: long enough for the server's answer to be used at hydration, no longer. */
export const checkFreshFor = 10_000;

export function useProject(projectId: string) {
  return useQuery({
    queryKey: projectKeys.detail(projectId),
    queryFn: () => requestJson<ProjectDetail>("GET", `/api/projects/${projectId}`),
  });
}

/**
 * The check is fresh for a few seconds only: the library may have changed since it was last seen. The page renders
 * it on the server, so it is not fetched again at hydration; a check older than that is fetched again on mount.
 * Captures still processed or rechecked are named in `pendingCaptures`, and the check is fetched again until there
 * are none.
 */
export function useProjectCheck(projectId: string) {
  return useQuery({
    queryKey: projectKeys.check(projectId),
    queryFn: () => requestJson<ProjectCheck>("GET", `/api/projects/${projectId}/check`),
    staleTime: checkFreshFor,
    // While a capture's job runs, ask again until its results are in.
    refetchInterval: (query) => (query.state.data?.pendingCaptures?.length ? 1500 : false),
  });
}

/** After any change to a project, its pulses or its candidates: refetch the project and its check. */
export function invalidateProject(client: QueryClient, projectId: string): Promise<void> {
  return Promise.all([
    client.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
    client.invalidateQueries({ queryKey: projectKeys.check(projectId) }),
  ]).then(() => undefined);
}
