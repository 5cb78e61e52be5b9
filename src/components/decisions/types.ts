import type { Decision } from "@/db/schema";
import type { Checked, DecisionSnapshot, Drift } from "@/lib/projects/decisions";
import type { MatrixRow } from "@/lib/projects/matrix";

// The comparison and decision screens' view of our route handlers, derived from the server's own types (type
// imports only: nothing of the server reaches the browser). Dates arrive as ISO text.

type Json<T> = {
  [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K];
};

export type ProjectCheck = Checked;
export type CheckedCandidate = Checked["candidates"][number];
export type CheckedPulse = Checked["pulses"][number];
export type PulseSource = CheckedPulse["source"];
export type { DecisionSnapshot, Drift, MatrixRow };

/** What a matrix needs, from the live check or from a decision's frozen snapshot. */
export interface MatrixData {
  candidates: Pick<
    CheckedCandidate,
    "partId" | "partNumber" | "maker" | "unitCost" | "currency" | "hasCurves"
  >[];
  pulses: CheckedPulse[];
  results: Checked["results"];
}

export type DecisionSummary = Json<
  Pick<
    Decision,
    | "id"
    | "chosenPartId"
    | "chosenLabel"
    | "rationale"
    | "signedByName"
    | "signedAt"
    | "supersededBy"
    | "supersededAt"
  >
>;

export interface AuditEvent {
  id: string;
  action: string;
  details: Record<string, unknown>;
  createdAt: string;
  actor: string | null;
}

export interface LimitsAnswer {
  derating: number;
  caseTemp: number;
  interpolated: { width: number; points: [number, number][]; flags: string[] } | null;
}

export const decisionKeys = {
  check: (projectId: string) => ["compare-check", projectId] as const,
  decisions: (projectId: string) => ["decisions", projectId] as const,
  audit: (projectId: string) => ["project-audit", projectId] as const,
  line: (partId: string, curveSetId: string | null, caseTemp: number, width: number, policy: string) =>
    ["candidate-line", partId, curveSetId, caseTemp, width, policy] as const,
};
