"use client";

import { type ClipboardEvent, type ReactNode, useId } from "react";
import { Button, FormMessage } from "@/components/form";
import { ScrollRegion } from "@/components/scroll-region";
import { ZthChart } from "@/components/soa-chart";
import { q } from "@/lib/format";
import { parsePastedRows } from "./paste-rows";
import { Sym } from "./symbols";
import {
  MAX_TERMS,
  type Message,
  newKey,
  type TermRow,
  type ThermalModel,
  useThermalTerms,
} from "./thermal-terms";
import { ZthFit } from "./zth-fit";

/** A fit's relative error in percent; unknown stays unknown ("—"), never a claimed 0 %. */
const asPercent = (fraction: number | null | undefined) => (fraction == null ? null : fraction * 100);

export type { ThermalModel } from "./thermal-terms";

/**
 * The part's thermal model (Foster network, junction to case): a small table of R_i and τ_i typed or pasted, or a
 * Z_th(t) CSV fitted to 3–6 terms, drawn over its points with the fit error. Read-only without part.write.
 */
export function ThermalEditor({
  partId,
  model,
  canWrite,
}: {
  partId: string;
  model: ThermalModel;
  canWrite: boolean;
}) {
  const terms = useThermalTerms(partId, model);
  const { rows, setRows, message, setMessage } = terms;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <div className="min-w-0 space-y-3">
        <FosterTerms
          rows={rows}
          canWrite={canWrite}
          cellErrors={terms.cellErrors}
          onEdit={terms.edit}
          onPaste={terms.onPaste}
          onRemove={(key) => setRows((all) => all.filter((r) => r.key !== key))}
        />
        {canWrite ? (
          <TermActions
            count={rows.length}
            dirty={terms.dirty}
            busy={terms.busy}
            onAdd={() => setRows((all) => [...all, { key: newKey(), r: "", tau: "" }])}
            onReplace={(next) => setRows(next)}
            onMessage={setMessage}
            onSave={terms.save}
          />
        ) : null}
        {message ? <FormMessage tone={message.tone}>{message.text}</FormMessage> : null}
      </div>

      <div className="min-w-0 space-y-3">
        <ThermalSummary preview={terms.preview} source={terms.saved.thermalSource} />
        {canWrite ? (
          <ZthFit
            partId={partId}
            onStart={() => setMessage(null)}
            onFitted={(result, fileName) =>
              terms.accept(
                result,
                `Fitted ${result.foster?.length ?? 0} terms to ${fileName} and saved them.`,
              )
            }
          />
        ) : null}
      </div>
    </div>
  );
}

/**
 * The terms as a small editable grid: a form's layout rather than a data table (each cell is an input), so it
 * keeps its own markup instead of the shared DataTable.
 */
function FosterTerms({
  rows,
  canWrite,
  cellErrors,
  onEdit,
  onPaste,
  onRemove,
}: {
  rows: TermRow[];
  canWrite: boolean;
  cellErrors: Record<string, string>;
  onEdit: (key: number, field: "r" | "tau", value: string) => void;
  onPaste: (event: ClipboardEvent<HTMLInputElement>, key: number) => void;
  onRemove: (key: number) => void;
}) {
  const id = useId();
  return (
    <ScrollRegion className="overflow-x-auto">
      <table
        aria-label="Foster terms"
        className="w-full border-separate border-spacing-0 rounded-md border border-line bg-panel text-sm"
      >
        <thead>
          <tr>
            <th
              scope="col"
              className="h-8 w-10 border-b border-line bg-sunken px-2 text-right text-xs font-medium text-ink-muted"
            >
              i
            </th>
            <th
              scope="col"
              className="h-8 border-b border-line bg-sunken px-2 text-right text-xs font-medium text-ink-muted"
            >
              <Sym main="R" sub="i" /> (K/W)
            </th>
            <th
              scope="col"
              className="h-8 border-b border-line bg-sunken px-2 text-right text-xs font-medium text-ink-muted"
            >
              <Sym main="τ" sub="i" /> (s)
            </th>
            {canWrite ? (
              <th scope="col" className="h-8 w-20 border-b border-line bg-sunken">
                <span className="sr-only">Remove</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={4} className="px-3 py-4 text-center text-ink-muted">
                No thermal model.{" "}
                {canWrite
                  ? "Add rows, paste them from a spreadsheet, or fit a Z_th CSV."
                  : "An engineer adds it."}
              </td>
            </tr>
          ) : (
            rows.map((row, k) => (
              <tr key={row.key}>
                <td className="num h-9 border-b border-line px-2 text-right font-mono text-xs text-ink-muted">
                  {k + 1}
                </td>
                {(["r", "tau"] as const).map((field) => {
                  const error = cellErrors[`terms.${k}.${field}`];
                  return (
                    <td key={field} className="h-9 border-b border-line px-1.5 text-right">
                      {canWrite ? (
                        <>
                          <input
                            value={row[field]}
                            aria-label={`${field === "r" ? "R" : "τ"} of term ${k + 1}`}
                            aria-invalid={error ? true : undefined}
                            aria-describedby={error ? `${id}-${row.key}-${field}` : undefined}
                            onChange={(e) => onEdit(row.key, field, e.target.value)}
                            onPaste={(e) => onPaste(e, row.key)}
                            className="h-7 w-full rounded border border-line-strong bg-panel px-2 text-right font-mono text-xs aria-invalid:border-fail"
                          />
                          {error ? (
                            <span
                              id={`${id}-${row.key}-${field}`}
                              className="block text-left text-xs text-fail"
                            >
                              {error}
                            </span>
                          ) : null}
                        </>
                      ) : (
                        <span className="num font-mono text-xs">{row[field]}</span>
                      )}
                    </td>
                  );
                })}
                {canWrite ? (
                  <td className="h-9 border-b border-line px-1 text-right">
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Remove term ${k + 1}`}
                      onClick={() => onRemove(row.key)}
                    >
                      Remove
                    </Button>
                  </td>
                ) : null}
              </tr>
            ))
          )}
        </tbody>
      </table>
    </ScrollRegion>
  );
}

const pasteHint = "Nothing to paste: copy rows such as “0.12⇥250us” first, or paste into a cell with Ctrl+V.";

/** Add a row, paste rows from the clipboard, save; and how to type a term. */
function TermActions({
  count,
  dirty,
  busy,
  onAdd,
  onReplace,
  onMessage,
  onSave,
}: {
  count: number;
  dirty: boolean;
  busy: boolean;
  onAdd: () => void;
  onReplace: (rows: TermRow[]) => void;
  onMessage: (message: Message) => void;
  onSave: () => void;
}) {
  async function pasteFromClipboard() {
    try {
      const text = await navigator.clipboard.readText();
      const pasted = parsePastedRows(text);
      if (!pasted.length) throw new Error("no rows");
      onReplace(pasted.slice(0, MAX_TERMS).map((p) => ({ key: newKey(), ...p })));
      onMessage({ tone: "done", text: `Pasted ${pasted.length} rows. Save to keep them.` });
    } catch {
      onMessage({ tone: "error", text: pasteHint });
    }
  }
  return (
    <>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div className="flex gap-2">
          <Button size="sm" disabled={count >= MAX_TERMS} onClick={onAdd}>
            Add row
          </Button>
          <Button size="sm" variant="quiet" onClick={pasteFromClipboard}>
            Paste rows
          </Button>
        </div>
        <Button variant="primary" size="sm" pending={busy} disabled={!dirty} onClick={onSave}>
          Save thermal model
        </Button>
      </div>
      <p className="text-xs text-ink-muted">
        Up to 8 terms, R in K/W and τ with a unit (250us, 1.5 ms, 0.2 s). Paste rows copied from a spreadsheet
        into any cell: one term per line, R then τ. Saving returns the part to draft.
      </p>
    </>
  );
}

/** The model drawn as Z_th(t), its total R_th and where it came from (typed, or fitted with its error). */
function ThermalSummary({
  preview,
  source,
}: {
  preview: { r: number; tau: number }[];
  source: ThermalModel["thermalSource"];
}): ReactNode {
  if (!preview.length) return null;
  const rth = preview.reduce((sum, t) => sum + t.r, 0);
  return (
    <>
      <ZthChart terms={preview} points={source?.kind === "fitted" ? source.points : undefined} />
      <p className="text-xs text-ink-muted">
        <Sym main="R" sub="th(j-c)" /> = Σ<Sym main="R" sub="i" /> = {q(rth, "K/W")}.{" "}
        {source?.kind === "fitted" ? (
          <>
            Fitted to {source.fileName ?? "an uploaded Z_th curve"} (rings): RMS error{" "}
            {q(asPercent(source.rmsRelativeError), "%")}, largest {q(asPercent(source.maxRelativeError), "%")}
            .
          </>
        ) : (
          "Typed or pasted terms."
        )}
      </p>
    </>
  );
}
