"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { usePathname, useSearchParams } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { FormMessage } from "@/components/form";
import { Section } from "@/components/page-header";
import { can } from "@/lib/auth/permissions";
import { invalidateProject } from "../api";
import type { PanelProps } from "../project-workspace";
import {
  type CaptureListItem,
  captureKeys,
  inProgress,
  type RegisteredCapture,
  useCaptures,
} from "./capture-api";
import { CaptureUpload } from "./capture-upload";
import { CaptureView } from "./capture-view";
import { CapturesTable } from "./captures-table";

/** The captures tab: upload a scope waveform (technicians and up), the list of captures, and the one opened. */
export function CapturesPanel({ projectId, check, viewer, canMeasure, people }: PanelProps) {
  const params = useSearchParams();
  const pathname = usePathname();
  const queryClient = useQueryClient();
  const list = useCaptures(projectId);
  const [fresh, setFresh] = useState<RegisteredCapture | null>(null);
  const [confirming, setConfirming] = useState<string | null>(null);
  const captures = list.data?.captures ?? [];
  const selected = params.get("capture") ?? captures[0]?.id ?? null;
  useRecheckWhenJobsFinish(projectId, captures);
  const names = new Map(people.map((p) => [p.id, p.name]));

  function open(id: string) {
    const next = new URLSearchParams(params);
    next.set("tab", "captures");
    next.set("capture", id);
    window.history.pushState(null, "", `${pathname}?${next}`);
  }

  const remove = useMutation({
    mutationFn: (id: string) => sendJson("DELETE", `/api/projects/${projectId}/captures/${id}`),
    onSuccess: async () => {
      setConfirming(null);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: captureKeys.list(projectId) }),
        invalidateProject(queryClient, projectId),
      ]);
    },
  });

  return (
    <div className="space-y-8">
      {canMeasure ? (
        <Section
          id="capture-upload"
          title="Upload a scope capture"
          description="A waveform CSV with time, voltage and current: the server computes power, energy and junction temperature and checks it."
        >
          <CaptureUpload
            projectId={projectId}
            onDone={(result) => {
              setFresh(result);
              open(result.capture.id);
            }}
          />
          {fresh ? (
            <FormMessage tone="done">
              {fresh.capture.name} uploaded and queued: the server reads it and checks it against every
              candidate; its progress and then its results show below. If it fails or has no data on a
              candidate, the project&apos;s owner is e-mailed.
            </FormMessage>
          ) : null}
        </Section>
      ) : null}

      <Section id="captures" title="Captures" description="Open one to see its traces and its verdicts.">
        <CapturesTable
          list={list}
          selected={selected}
          canMeasure={canMeasure}
          viewerId={viewer.id}
          worstByPulse={check?.worstByPulse}
          names={names}
          onOpen={open}
          actions={{
            mayDeleteAny: can(viewer.role, "measurement.manage"),
            confirming,
            removing: remove.isPending,
            onAsk: setConfirming,
            onConfirm: (id) => remove.mutate(id),
            onKeep: () => setConfirming(null),
          }}
        />
        {remove.isError ? <FormMessage tone="error">{messageOf(remove.error)}</FormMessage> : null}
        <Caution className="mt-3" />
      </Section>

      {selected && (captures.some((c) => c.id === selected) || fresh?.capture.id === selected) ? (
        <Section
          id="capture"
          title={captures.find((c) => c.id === selected)?.name ?? fresh?.capture.name ?? "Capture"}
        >
          <CaptureView
            projectId={projectId}
            captureId={selected}
            check={check}
            registered={fresh?.capture.id === selected ? fresh.capture.status : null}
          />
        </Section>
      ) : null}
    </div>
  );
}

/** When a capture's job finishes, the project's check (results, charts, comparison) has new evidence. */
function useRecheckWhenJobsFinish(projectId: string, captures: CaptureListItem[]) {
  const queryClient = useQueryClient();
  const pendingIds = captures
    .filter((c) => inProgress(c.status))
    .map((c) => c.id)
    .join(",");
  const following = useRef(pendingIds);
  useEffect(() => {
    if (following.current !== pendingIds && following.current !== "")
      void invalidateProject(queryClient, projectId);
    following.current = pendingIds;
  }, [pendingIds, queryClient, projectId]);
}
