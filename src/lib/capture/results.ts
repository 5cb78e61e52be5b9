import "server-only";
import { createHash } from "node:crypto";
import { and, asc, eq, inArray, notInArray } from "drizzle-orm";
import { db } from "@/db";
import {
  type Capture,
  type CaptureStatus,
  captureResults,
  captures,
  type Project,
  type StoredJunction,
} from "@/db/schema";
import { evaluate, type ProjectPulse } from "@/lib/projects/evaluate";
import { projectCaseNetwork, projectPolicy } from "@/lib/projects/policy";
import type { Candidate } from "@/lib/projects/projects";
import type { PulseResult } from "@/lib/soa/types";
import type { CaptureSamples } from "./parse-stream";
import { caseTrace, junctionTrace } from "./process";
import { capturePulse } from "./store";

// A capture's results per candidate are computed by its job and stored; reading them never reloads the samples.
// They must not go stale silently, so each stored result carries a fingerprint of every input it rests on, and a
// reader compares it with the fingerprint of the current inputs: a candidate added (no row), a part, its curves or
// its thermal model changed, the project's temperature, policy or case path changed, all show as a mismatch. A
// stale result is never shown as current: the project's check leaves it out and names the capture as pending, and
// a recheck job recomputes it (src/lib/capture/job.ts); the comparison and decisions recompute it first, at once.

/** Bump when the way results are computed changes, so that every stored result is recomputed. */
const FINGERPRINT_VERSION = 1;

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Hash of the inputs of a capture's result on one candidate. */
export function resultFingerprint(
  project: Project,
  candidate: Pick<Candidate, "limits"> & { part: Pick<Candidate["part"], "foster"> },
  start: Capture["start"],
): string {
  const inputs = [
    FINGERPRINT_VERSION,
    candidate.limits,
    candidate.part.foster ?? null,
    project.caseTemp,
    projectPolicy(project),
    projectCaseNetwork(project) ?? null,
    start,
  ];
  return createHash("sha256").update(JSON.stringify(inputs)).digest("hex").slice(0, 40);
}

export interface ComputedResult {
  partId: string;
  fingerprint: string;
  result: PulseResult | null;
  junction: StoredJunction | null;
  caseTrace: StoredJunction | null;
}

/**
 * A capture's result and junction-temperature trace on every candidate. Power `p` and the summary (extremes,
 * energy, the equal-energy rectangle) are the capture's own, computed once and shared by every candidate.
 */
export async function computeCaptureResults(
  project: Project,
  candidates: Candidate[],
  capture: Pick<Capture, "id" | "name" | "start"> & { summary: NonNullable<Capture["summary"]> },
  samples: CaptureSamples,
  p: Float64Array,
): Promise<ComputedResult[]> {
  const evaluation = await evaluate(
    candidates.map((c) => ({ partId: c.part.id, limits: c.limits })),
    [capturePulse(project, capture, samples)],
    projectPolicy(project),
    projectCaseNetwork(project),
  );
  // With a case path (METHODS.md §14) the case heats from the same power: its trace is the capture's, once.
  const caseNetwork = projectCaseNetwork(project) ?? null;
  const thermal = { start: capture.start, peakPower: Math.max(capture.summary.pPeak, 0) };
  const caseTemperature = caseNetwork
    ? caseTrace(samples.t, p, caseNetwork, project.caseTemp, thermal)
    : null;
  return candidates.map((c) => ({
    partId: c.part.id,
    fingerprint: resultFingerprint(project, c, capture.start),
    result: evaluation.results[c.part.id]?.[capture.id] ?? null,
    junction: c.part.foster?.length
      ? junctionTrace(samples.t, p, c.part.foster, project.caseTemp, { ...thermal, caseNetwork })
      : null,
    caseTrace: caseTemperature,
  }));
}

/** Writes a capture's results in the caller's transaction: one row per candidate, rows of former ones removed. */
export async function storeCaptureResults(tx: Tx, captureId: string, rows: ComputedResult[]): Promise<void> {
  const partIds = rows.map((r) => r.partId);
  await tx
    .delete(captureResults)
    .where(
      partIds.length
        ? and(eq(captureResults.captureId, captureId), notInArray(captureResults.partId, partIds))
        : eq(captureResults.captureId, captureId),
    );
  if (!rows.length) return;
  const computedAt = new Date();
  for (const row of rows) {
    const values = {
      fingerprint: row.fingerprint,
      result: row.result,
      junction: row.junction,
      caseTrace: row.caseTrace,
      computedAt,
    };
    await tx
      .insert(captureResults)
      .values({ captureId, partId: row.partId, ...values })
      .onConflictDoUpdate({ target: [captureResults.captureId, captureResults.partId], set: values });
  }
}

/** A capture's stored results, each with whether it is current for the candidate's inputs today. */
export async function storedResults(
  project: Project,
  candidates: Candidate[],
  capture: Pick<Capture, "id" | "start">,
): Promise<
  Map<
    string,
    {
      current: boolean;
      result: PulseResult | null;
      junction: StoredJunction | null;
      caseTrace: StoredJunction | null;
    }
  >
> {
  const rows = await db.select().from(captureResults).where(eq(captureResults.captureId, capture.id));
  const byPart = new Map(rows.map((r) => [r.partId, r]));
  return new Map(
    candidates.map((c) => {
      const row = byPart.get(c.part.id);
      return [
        c.part.id,
        {
          current: row?.fingerprint === resultFingerprint(project, c, capture.start),
          result: (row?.result ?? null) as PulseResult | null,
          junction: row?.junction ?? null,
          caseTrace: row?.caseTrace ?? null,
        },
      ];
    }),
  );
}

export interface CaptureStates {
  /** The processed captures as pulses of the project's check, with their current stored results. */
  pulses: ProjectPulse[];
  /** Processed captures with a result missing or stale on some candidate. */
  stale: string[];
  /** Captures still queued or being processed. */
  pending: string[];
  statuses: Record<string, CaptureStatus>;
}

/** Every capture of the project, oldest first, as its check sees it: current stored results, stale and pending. */
export async function captureStates(project: Project, candidates: Candidate[]): Promise<CaptureStates> {
  const rows = await db
    .select({
      id: captures.id,
      name: captures.name,
      summary: captures.summary,
      start: captures.start,
      status: captures.status,
    })
    .from(captures)
    .where(eq(captures.projectId, project.id))
    .orderBy(asc(captures.createdAt));
  const done = rows.filter((r) => r.status === "done" && r.summary !== null);
  const stored = done.length
    ? await db
        .select({
          captureId: captureResults.captureId,
          partId: captureResults.partId,
          fingerprint: captureResults.fingerprint,
          result: captureResults.result,
        })
        .from(captureResults)
        .where(
          inArray(
            captureResults.captureId,
            done.map((r) => r.id),
          ),
        )
    : [];
  const states: CaptureStates = {
    pulses: [],
    stale: [],
    pending: rows.filter((r) => r.status === "queued" || r.status === "processing").map((r) => r.id),
    statuses: Object.fromEntries(rows.map((r) => [r.id, r.status])),
  };
  const fingerprints = new Map<string, string>();
  const fingerprintOf = (candidate: Candidate, start: Capture["start"]) => {
    const key = `${candidate.part.id}:${start}`;
    let known = fingerprints.get(key);
    if (known === undefined) {
      known = resultFingerprint(project, candidate, start);
      fingerprints.set(key, known);
    }
    return known;
  };
  const byKey = new Map(stored.map((s) => [`${s.captureId}:${s.partId}`, s]));
  for (const row of done) {
    const current: Record<string, PulseResult> = {};
    let stale = false;
    for (const candidate of candidates) {
      const hit = byKey.get(`${row.id}:${candidate.part.id}`);
      if (hit?.fingerprint !== fingerprintOf(candidate, row.start)) stale = true;
      else if (hit.result) current[candidate.part.id] = hit.result;
    }
    if (stale) states.stale.push(row.id);
    states.pulses.push({
      ...capturePulse(project, { ...row, summary: row.summary! }, null),
      stored: current,
    });
  }
  return states;
}
