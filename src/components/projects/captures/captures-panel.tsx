"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { ConfirmDelete } from "@/components/confirm-delete";
import { DateText } from "@/components/date-text";
import { FormMessage } from "@/components/form";
import { sizeText } from "@/components/library/format";
import { Section } from "@/components/page-header";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { useUrlState } from "@/components/use-url-state";
import { VerdictBadge } from "@/components/verdict-shape";
import { can } from "@/lib/auth/permissions";
import { invalidateProject } from "../api";
import { q } from "../format";
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

/** The captures tab: upload a scope waveform (technicians and up), the list of captures, and the one opened. */
export function CapturesPanel({ projectId, check, viewer, canMeasure, people }: PanelProps) {
  const [params, setParams] = useUrlState();
  const queryClient = useQueryClient();
  const list = useCaptures(projectId);
  const [fresh, setFresh] = useState<RegisteredCapture | null>(null);
  const [confirming, setConfirming] = useState<string | null>(null);
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
  const names = new Map(people.map((p) => [p.id, p.name]));
  const mayDeleteAny = can(viewer.role, "measurement.manage");

  function open(id: string) {
    setParams({ tab: "captures", capture: id }, { push: true });
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
  const columns = canMeasure ? 9 : 8;

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
        <Table label="Captures">
          <thead>
            <tr>
              <Th>Name</Th>
              <Th numeric>Samples</Th>
              <Th numeric>Peak power</Th>
              <Th numeric>Energy</Th>
              <Th numeric>Equal-energy rectangle</Th>
              <Th>Worst verdict</Th>
              <Th>Uploaded by</Th>
              <Th numeric>When (UTC)</Th>
              {canMeasure ? (
                <Th className="w-32">
                  <span className="sr-only">Actions</span>
                </Th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {list.isPending ? <EmptyRow colSpan={columns}>Loading captures…</EmptyRow> : null}
            {list.isError ? (
              <EmptyRow colSpan={columns}>
                <span role="alert" className="text-fail">
                  {messageOf(list.error)}
                </span>
              </EmptyRow>
            ) : null}
            {list.isSuccess && captures.length === 0 ? (
              <EmptyRow colSpan={columns}>
                {canMeasure
                  ? "No captures yet. Drop a scope waveform above; you choose its columns before it is sent."
                  : "No captures yet. Technicians upload scope waveforms here."}
              </EmptyRow>
            ) : null}
            {captures.map((c) => {
              const eq = c.summary?.equivalent;
              const worst = check?.worstByPulse[c.id];
              const mine = c.createdBy === viewer.id;
              return (
                <Tr key={c.id} className={c.id === selected ? "bg-accent-soft" : ""}>
                  <Td>
                    <button
                      type="button"
                      aria-current={c.id === selected ? "true" : undefined}
                      onClick={() => open(c.id)}
                      className="font-medium hover:text-accent hover:underline"
                    >
                      {c.name}
                    </button>
                    <span className="ml-2 text-xs text-ink-faint">
                      {c.fileName}, {sizeText(c.size)}
                    </span>
                  </Td>
                  <Td numeric>{c.summary ? c.summary.samples.toLocaleString("en-GB") : "—"}</Td>
                  <Td numeric>{c.summary ? q(c.summary.pPeak, "W") : "—"}</Td>
                  <Td numeric>{c.summary ? q(c.summary.energy, "J") : "—"}</Td>
                  <Td numeric>
                    {!eq ? "—" : eq.ok ? `${q(eq.v, "V")} × ${q(eq.i, "A")}, ${q(eq.duration, "s")}` : "none"}
                  </Td>
                  <Td>
                    {c.status !== "done" ? (
                      <StatusWord status={c.status} />
                    ) : worst ? (
                      <VerdictBadge verdict={worst} />
                    ) : (
                      <span className="text-ink-faint">—</span>
                    )}
                  </Td>
                  <Td className="text-ink-muted">
                    {c.createdBy ? (mine ? "you" : (names.get(c.createdBy) ?? "a former member")) : "—"}
                  </Td>
                  <Td numeric>
                    <DateText value={c.createdAt} withTime />
                  </Td>
                  {canMeasure ? (
                    <Td className="text-right">
                      {mine || mayDeleteAny ? (
                        <ConfirmDelete
                          label={c.name}
                          confirming={confirming === c.id}
                          pending={remove.isPending}
                          onAsk={() => setConfirming(c.id)}
                          onConfirm={() => remove.mutate(c.id)}
                          onKeep={() => setConfirming(null)}
                        />
                      ) : null}
                    </Td>
                  ) : null}
                </Tr>
              );
            })}
          </tbody>
        </Table>
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

/** A capture not (yet) done, in words. */
function StatusWord({ status }: { status: CaptureListItem["status"] }) {
  const words = { queued: "queued", processing: "processing…", failed: "failed", done: "done" } as const;
  return (
    <span className={status === "failed" ? "text-fail" : "text-ink-muted"} data-capture-status={status}>
      {words[status]}
    </span>
  );
}
