"use client";

import { useQuery } from "@tanstack/react-query";
import { callJson } from "@/components/library/api";
import { checkFreshFor } from "@/components/projects/api";
import { type AuditEvent, type DecisionSummary, decisionKeys, type ProjectCheck } from "./types";

/**
 * The project checked now: the library may have changed, so a check is fresh only for a few seconds (the page's
 * server render is used at hydration; an older one is fetched again on mount).
 */
export function useCheck(projectId: string) {
  return useQuery({
    queryKey: decisionKeys.check(projectId),
    queryFn: () => callJson<ProjectCheck>("GET", `/api/projects/${projectId}/check`),
    staleTime: checkFreshFor,
  });
}

export function useDecisions(projectId: string) {
  return useQuery({
    queryKey: decisionKeys.decisions(projectId),
    queryFn: () => callJson<{ decisions: DecisionSummary[] }>("GET", `/api/projects/${projectId}/decisions`),
  });
}

export function useAudit(projectId: string) {
  return useQuery({
    queryKey: decisionKeys.audit(projectId),
    queryFn: () => callJson<{ events: AuditEvent[] }>("GET", `/api/projects/${projectId}/audit`),
    staleTime: 0,
  });
}
