"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { type ReactNode, useEffect, useRef, useState } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { ConfirmDelete } from "@/components/confirm-delete";
import { DataTable } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { FormMessage } from "@/components/form";
import { sizeText } from "@/components/library/format";
import { Section } from "@/components/page-header";
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
            who: (c) =>
              c.createdBy
                ? c.createdBy === viewer.id
                  ? "you"
                  : (names.get(c.createdBy) ?? "a former member")
                : "—",
            actions: canMeasure
              ? (c) =>
                  c.createdBy === viewer.id || mayDeleteAny ? (
                    <ConfirmDelete
                      label={c.name}
                      confirming={confirming === c.id}
                      pending={remove.isPending}
                      onAsk={() => setConfirming(c.id)}
                      onConfirm={() => remove.mutate(c.id)}
                      onKeep={() => setConfirming(null)}
                    />
                  ) : null
              : null,
          })}
          data={captures}
          getRowId={(c) => c.id}
          rowProps={(c) => ({ className: c.id === selected ? "bg-accent-soft" : "hover:bg-surface" })}
          status={
            list.isPending ? (
              "Loading captures…"
            ) : list.isError ? (
              <span role="alert" className="text-fail">
                {messageOf(list.error)}
              </span>
            ) : null
          }
          empty={
            canMeasure
              ? "No captures yet. Drop a scope waveform above; you choose its columns before it is sent."
              : "No captures yet. Technicians upload scope waveforms here."
          }
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

const num = { numeric: true };

function captureColumns({
  check,
  selected,
  open,
  who,
  actions,
}: {
  check: PanelProps["check"];
  selected: string | null;
  open: (id: string) => void;
  who: (c: CaptureListItem) => string;
  actions: ((c: CaptureListItem) => ReactNode) | null;
}): ColumnDef<CaptureListItem>[] {
  const columns: ColumnDef<CaptureListItem>[] = [
    {
      id: "name",
      header: "Name",
      cell: ({ row: { original: c } }) => (
        <>
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
        </>
      ),
    },
    {
      id: "samples",
      header: "Samples",
      cell: ({ row: { original: c } }) => (c.summary ? c.summary.samples.toLocaleString("en-GB") : "—"),
      meta: num,
    },
    {
      id: "peak",
      header: "Peak power",
      cell: ({ row: { original: c } }) => (c.summary ? q(c.summary.pPeak, "W") : "—"),
      meta: num,
    },
    {
      id: "energy",
      header: "Energy",
      cell: ({ row: { original: c } }) => (c.summary ? q(c.summary.energy, "J") : "—"),
      meta: num,
    },
    {
      id: "equivalent",
      header: "Equal-energy rectangle",
      cell: ({ row: { original: c } }) => {
        const eq = c.summary?.equivalent;
        return !eq ? "—" : eq.ok ? `${q(eq.v, "V")} × ${q(eq.i, "A")}, ${q(eq.duration, "s")}` : "none";
      },
      meta: num,
    },
    {
      id: "worst",
      header: "Worst verdict",
      cell: ({ row: { original: c } }) => {
        const worst = check?.worstByPulse[c.id];
        return c.status !== "done" ? (
          <StatusWord status={c.status} />
        ) : worst ? (
          <VerdictBadge verdict={worst} />
        ) : (
          <span className="text-ink-faint">—</span>
        );
      },
    },
    {
      id: "who",
      header: "Uploaded by",
      cell: ({ row }) => who(row.original),
      meta: { className: "text-ink-muted", headerClassName: "" },
    },
    {
      id: "when",
      header: "When (UTC)",
      cell: ({ row }) => <DateText value={row.original.createdAt} withTime />,
      meta: num,
    },
  ];
  if (actions) {
    columns.push({
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      cell: ({ row }) => actions(row.original),
      meta: { className: "text-right", headerClassName: "w-32" },
    });
  }
  return columns;
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
