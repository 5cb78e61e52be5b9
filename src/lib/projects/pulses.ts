import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { type FaultCase, faultCases, type MeasuredPulse, measuredPulses, type Project } from "@/db/schema";
import { repeatOf } from "@/lib/format";
import type { ProjectPulse } from "./evaluate";

/** Equal-energy width E/p_peak of a sequence's samples (trapezoid energy; METHODS.md §6), for its label. */
function sequenceWidth(samples: { t: number[]; v: number[]; i: number[] }): number | null {
  let energy = 0;
  let peak = 0;
  for (let n = 0; n < samples.t.length; n++) {
    const p = Math.max(samples.v[n] * samples.i[n], 0);
    peak = Math.max(peak, p);
    if (n > 0)
      energy +=
        ((Math.max(samples.v[n - 1] * samples.i[n - 1], 0) + p) / 2) * (samples.t[n] - samples.t[n - 1]);
  }
  return peak > 0 ? energy / peak : null;
}

export function faultCasePulse(project: Project, row: FaultCase): ProjectPulse {
  const base = {
    id: row.id,
    source: "fault-case" as const,
    name: row.name,
    caseTemp: row.caseTemp ?? project.caseTemp,
  };
  if (row.kind === "avalanche") {
    // Not a point on the SOA chart (no V and I to draw): the energy is checked against E_AS (METHODS.md §13).
    return {
      ...base,
      v: null,
      i: null,
      duration: null,
      kind: "avalanche",
      pulse: {
        id: row.id,
        kind: "avalanche",
        inductance: row.inductance ?? Number.NaN,
        current: row.i,
        supply: row.v,
      },
    };
  }
  if (row.kind === "waveform") {
    const samples = row.samples ?? { t: [], v: [], i: [] };
    return {
      ...base,
      v: row.v,
      i: row.i,
      duration: sequenceWidth(samples),
      kind: "waveform",
      pulse: { id: row.id, kind: "waveform", t: samples.t, v: samples.v, i: samples.i, start: "rest" },
    };
  }
  const repeat = repeatOf(row);
  const duration = row.duration ?? Number.NaN;
  return {
    ...base,
    v: row.v,
    i: row.i,
    duration,
    kind: row.kind,
    ...(repeat ? { repeat } : {}),
    pulse: { id: row.id, kind: row.kind, v: row.v, i: row.i, duration, ...(repeat ? { repeat } : {}) },
  };
}

export function measuredPulse(project: Project, row: MeasuredPulse): ProjectPulse {
  const repeat = repeatOf(row);
  return {
    id: row.id,
    source: "measured",
    name: row.label,
    caseTemp: project.caseTemp,
    v: row.v,
    i: row.i,
    duration: row.duration,
    kind: row.kind,
    ...(repeat ? { repeat } : {}),
    pulse: {
      id: row.id,
      kind: row.kind,
      v: row.v,
      i: row.i,
      duration: row.duration,
      ...(repeat ? { repeat } : {}),
    },
  };
}

export function listFaultCases(projectId: string) {
  return db
    .select()
    .from(faultCases)
    .where(eq(faultCases.projectId, projectId))
    .orderBy(asc(faultCases.createdAt));
}

export function listMeasuredPulses(projectId: string) {
  return db
    .select()
    .from(measuredPulses)
    .where(eq(measuredPulses.projectId, projectId))
    .orderBy(asc(measuredPulses.createdAt), asc(measuredPulses.label));
}
