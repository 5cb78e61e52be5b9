"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import { messageOf, sendJson } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { Button, FormMessage } from "@/components/form";
import { UnitField } from "@/components/library/fields";
import { IssueTable } from "@/components/library/upload-progress";
import type { ColumnMapping } from "@/lib/csv/measurements";
import { invalidateProject, type MeasurementPreview } from "../api";
import { ColumnMappingTable } from "./column-mapping";
import { PreviewTable } from "./preview-table";

interface SaveFields {
  note: string;
  boardSerial: string;
  probe: string;
}

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
  const { register, handleSubmit, reset } = useForm<SaveFields>({
    defaultValues: { note: "", boardSerial: "", probe: "" },
  });

  const preview = useMutation({
    mutationFn: (body: { text: string; mapping: ColumnMapping }) =>
      sendJson<MeasurementPreview>("POST", `/api/projects/${projectId}/measurements/preview`, body),
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
      sendJson<{ saved: string[]; notified: number }>("POST", `/api/projects/${projectId}/measurements`, {
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
      reset();
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
        <div id={`${id}-help`} className="space-y-2 text-sm text-ink-muted">
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
            <form
              noValidate
              aria-label="Save the measured pulses"
              onSubmit={handleSubmit((fields) => save.mutate(fields))}
              className="rounded-md border border-line bg-panel p-4"
            >
              <div className="grid gap-4 sm:grid-cols-3">
                <UnitField
                  id={`${id}-board`}
                  label="Board serial"
                  hint="Optional"
                  {...register("boardSerial")}
                />
                <UnitField
                  id={`${id}-probe`}
                  label="Probe"
                  hint="Optional: current probe or shunt"
                  {...register("probe")}
                />
                <UnitField id={`${id}-note`} label="Note" hint="Optional" {...register("note")} />
              </div>
              {save.isError ? <FormMessage tone="error">{messageOf(save.error)}</FormMessage> : null}
              <div className="mt-4 flex items-center justify-between gap-3">
                <p className="text-sm text-ink-muted">
                  {blocked
                    ? "Saving waits until every column is read or left out and the paste has no problems."
                    : withProblems > 0
                      ? `${withProblems} ${withProblems === 1 ? "row has" : "rows have"} problems and will be left out.`
                      : "Every row can be saved."}
                </p>
                <Button type="submit" variant="primary" pending={save.isPending} disabled={stale || blocked}>
                  Save {valid.length} {valid.length === 1 ? "row" : "rows"}
                </Button>
              </div>
            </form>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
