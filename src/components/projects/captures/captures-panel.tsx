"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { Caution } from "@/components/caution";
import { useRowDelete } from "@/components/confirm-delete";
import { DataTable } from "@/components/data-table";
import { FormMessage } from "@/components/form";
import { Section } from "@/components/page-header";
import { queryStatus } from "@/components/query-status";
import { useUrlState } from "@/components/use-url-state";
import { invalidateProject } from "../api";
import type { PanelProps } from "../project-workspace";
import { recordedBy } from "../recorded-by";
import { captureKeys, inProgress, type RegisteredCapture, useCaptures } from "./capture-api";
import { CaptureUpload } from "./capture-upload";
import { CaptureView } from "./capture-view";
import { captureColumns } from "./captures-table";

/** The captures tab: upload a scope waveform (technicians and up), the list of captures, and the one opened. */
export function CapturesPanel({ projectId, check, viewer, canMeasure, people }: PanelProps) {
  const [params, setParams] = useUrlState();
  const queryClient = useQueryClient();
  const list = useCaptures(projectId);
  const [fresh, setFresh] = useState<RegisteredCapture | null>(null);
  const captures = list.data?.captures ?? [];
  const selected = params.get("capture") ?? captures[0]?.id ?? null;
  // When a capture's job finishes, the project's check (results, charts, comparison) has new evidence.
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
  const recorded = recordedBy(viewer, people);

  function open(id: string) {
    setParams({ tab: "captures", capture: id }, { push: true });
  }

  const remove = useRowDelete(
    (id) => `/api/projects/${projectId}/captures/${id}`,
    () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: captureKeys.list(projectId) }),
        invalidateProject(queryClient, projectId),
      ]),
  );

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
        <DataTable
          label="Captures"
          columns={captureColumns({
            check,
            selected,
            open,
            who: (c) => recorded.who(c.createdBy),
            actions: canMeasure
              ? (c) => (recorded.mayDelete(c.createdBy) ? remove.action(c.id, c.name) : null)
              : null,
          })}
          data={captures}
          getRowId={(c) => c.id}
          rowProps={(c) => ({ className: c.id === selected ? "bg-accent-soft" : "hover:bg-surface" })}
          status={queryStatus(list, "Loading captures…")}
          empty={
            canMeasure
              ? "No captures yet. Drop a scope waveform above; you choose its columns before it is sent."
              : "No captures yet. Technicians upload scope waveforms here."
          }
        />
        {remove.failure}
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
