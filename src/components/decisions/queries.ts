"use client";

import { useQuery } from "@tanstack/react-query";
import { requestJson } from "@/components/api-client";

import { checkFreshFor } from "@/components/projects/api";
import { type AuditEvent, type DecisionSummary, decisionKeys, type ProjectCheck } from "./types";

/**
 * The project checked now: the library may have changed, so a check is fresh only for a few seconds (the page's
 * server render is used at hydration; an older one is fetched again on mount).
 */
export function useCheck(projectId: string) {
  return useQuery({
    queryKey: decisionKeys.check(projectId),
    queryFn: () => requestJson<ProjectCheck>("GET", `/api/projects/${projectId}/check`),
    staleTime: checkFreshFor,
  });
}

export function useDecisions(projectId: string) {
  return useQuery({
    queryKey: decisionKeys.decisions(projectId),
    queryFn: () =>
      requestJson<{ decisions: DecisionSummary[] }>("GET", `/api/projects/${projectId}/decisions`),
  });
}

export function useAudit(projectId: string) {
  return useQuery({
    queryKey: decisionKeys.audit(projectId),
    queryFn: () => requestJson<{ events: AuditEvent[] }>("GET", `/api/projects/${projectId}/audit`),
    staleTime: 0,
  });
}
