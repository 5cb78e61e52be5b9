"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { Button, FormMessage } from "@/components/form";
import { IssueTable } from "@/components/library/upload-progress";
import type { ColumnMapping } from "@/lib/csv/measurements";
import { invalidateProject, type MeasurementPreview } from "../api";
import { ColumnMappingTable } from "./column-mapping";
import { PreviewTable } from "./preview-table";
import { type SaveFields, SaveMeasuredForm } from "./save-measured-form";

const example = [
  "label\tV_DS [V]\tI_D [A]\twidth\tshape\tperiod\tcount",
  "B1\t48\t1.2\t10 ms\trect\t\t",
  "B2\t36\t2,5\t2 ms\ttriangle\t50 ms\t10",
].join("\n");

/**
 * The paste box: rows copied from a spreadsheet or a scope's measurement table are previewed on the server (each
 * row's problems and its verdict against every candidate), then saved in one go with the bench setup.
 */
export function PasteMeasurements({ projectId }: { projectId: string }) {
  const id = useId();
  const queryClient = useQueryClient();
  const [text, setText] = useState("");
  const [previewed, setPreviewed] = useState<{
    text: string;
    mapping: ColumnMapping;
    preview: MeasurementPreview;
  } | null>(null);
  const [saved, setSaved] = useState<{ count: number; notified: number } | null>(null);

  const preview = useMutation({
    mutationFn: (body: { text: string; mapping: ColumnMapping }) =>
      requestJson<MeasurementPreview>("POST", `/api/projects/${projectId}/measurements/preview`, body),
    onSuccess: (data, body) => {
      setPreviewed({ ...body, preview: data });
      setSaved(null);
    },
  });
  const valid = previewed ? previewed.preview.rows.filter((r) => r.errors.length === 0) : [];
  const blocked = previewed !== null && previewed.preview.errors.length > 0;
  const withProblems = previewed ? previewed.preview.rows.length - valid.length : 0;
  const save = useMutation({
    mutationFn: (fields: SaveFields) =>
      requestJson<{ saved: string[]; notified: number }>("POST", `/api/projects/${projectId}/measurements`, {
        rows: valid.map((r) => ({
          label: r.label,
          kind: r.kind,
          v: r.v,
          i: r.i,
          duration: r.duration,
          ...(r.repeat ? { repeat: r.repeat } : {}),
        })),
        ...fields,
      }),
    onSuccess: async (data) => {
      setSaved({ count: data.saved.length, notified: data.notified });
      setPreviewed(null);
      setText("");
      await invalidateProject(queryClient, projectId);
    },
  });
  const stale = previewed !== null && previewed.text !== text;

  return (
    <div className="space-y-4">
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0">
          <label htmlFor={`${id}-paste`} className="text-sm font-medium">
            Rows from the bench
          </label>
          <textarea
            id={`${id}-paste`}
            value={text}
            onChange={(e) => setText(e.target.value)}
            rows={7}
            spellCheck={false}
            placeholder={example}
            aria-describedby={`${id}-help`}
            className="mt-1 block w-full rounded-md border border-line-strong bg-panel px-2.5 py-2 font-mono text-xs leading-5 text-ink placeholder:text-ink-faint focus-visible:border-accent focus-visible:outline-1 focus-visible:outline-offset-0"
          />
          <div className="mt-2 flex items-center justify-between gap-3">
            <p className="text-xs text-ink-muted">
              {stale ? "The text changed since the preview: preview it again." : null}
            </p>
            <Button
              variant={previewed && !stale ? "secondary" : "primary"}
              pending={preview.isPending}
              disabled={text.trim() === ""}
              onClick={() =>
                preview.mutate({ text, mapping: previewed?.text === text ? previewed.mapping : {} })
              }
            >
              Preview
            </Button>
          </div>
        </div>
        <PasteHelp id={`${id}-help`} />
      </div>

      {preview.isError ? <FormMessage tone="error">{messageOf(preview.error)}</FormMessage> : null}
      {saved ? (
        <FormMessage tone="done">
          Saved {saved.count} measured {saved.count === 1 ? "pulse" : "pulses"}; they are in the results and
          on the charts.
          {saved.notified > 0
            ? ` The project's owner was e-mailed about ${saved.notified} that ${saved.notified === 1 ? "fails or has" : "fail or have"} no data.`
            : ""}
        </FormMessage>
      ) : null}

      {previewed ? (
        <div className={`space-y-3 ${stale ? "opacity-60" : ""}`} data-testid="bench-preview">
          {previewed.preview.errors.length ? (
            <>
              <FormMessage tone="error">
                The paste cannot be saved as it is: choose what each column holds, or fix these and preview
                again.
              </FormMessage>
              <IssueTable issues={previewed.preview.errors} label="Problems with the paste" />
            </>
          ) : null}
          <ColumnMappingTable
            columns={previewed.preview.columns}
            pending={preview.isPending || stale}
            onChange={(mapping) => preview.mutate({ text: previewed.text, mapping })}
          />
          {previewed.preview.rows.length ? <PreviewTable preview={previewed.preview} /> : null}
          <Caution />
          {valid.length ? (
            <SaveMeasuredForm
              rows={valid.length}
              withProblems={withProblems}
              blocked={blocked}
              stale={stale}
              save={save}
            />
          ) : null}
        </div>
      ) : null}
    </div>
  );
}

/** What the paste box reads, beside it. */
function PasteHelp({ id }: { id: string }) {
  return (
    <div id={id} className="space-y-2 text-sm text-ink-muted">
      <p className="font-medium text-ink">What to paste</p>
      <p>
        One pulse per row, copied from a spreadsheet or a scope&apos;s measurement table: tabs, commas or
        semicolons; decimal commas are fine. A header row is optional; without one the columns are V, I,
        width, shape, period, count.
      </p>
      <p>
        Units may sit in the header (<span className="font-mono">I_D [A]</span>,{" "}
        <span className="font-mono">width [us]</span>) or in the values (
        <span className="font-mono">150 µs</span>). Repetition: a period or a frequency, and a count or
        &ldquo;cont&rdquo;.
      </p>
    </div>
  );
}
