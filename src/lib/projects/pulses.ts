import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { type FaultCase, faultCases, type MeasuredPulse, measuredPulses, type Project } from "@/db/schema";
import type { Repeat } from "@/lib/soa/types";
import type { ProjectPulse } from "./evaluate";

function repeatOf(row: { repeatPeriod: number | null; repeatCount: number | null }): Repeat | undefined {
  if (row.repeatPeriod === null) return undefined;
  return { period: row.repeatPeriod, ...(row.repeatCount !== null ? { count: row.repeatCount } : {}) };
}

export function faultCasePulse(project: Project, row: FaultCase): ProjectPulse {
  const repeat = repeatOf(row);
  return {
    id: row.id,
    source: "fault-case",
    name: row.name,
    caseTemp: row.caseTemp ?? project.caseTemp,
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
