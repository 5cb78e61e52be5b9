"use client";

import { useRouter } from "next/navigation";
import { type ClipboardEvent, useId, useMemo, useState, useTransition } from "react";
import { ApiError, messageOf } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";
import { ScrollRegion } from "@/components/scroll-region";
import { ZthChart } from "@/components/soa-chart";
import type { CsvIssue } from "@/lib/csv/issues";
import { fosterSchema } from "@/lib/library/part-schema";
import { formatQuantity } from "@/lib/soa/units";
import { callJson, RejectedFile, uploadToStorage } from "./api";
import { CsvDropzone } from "./csv-dropzone";
import { parsePastedRows } from "./paste-rows";
import { Sym } from "./symbols";
import { IssueTable, UploadProgress } from "./upload-progress";

export interface ThermalModel {
  foster: { r: number; tau: number }[] | null;
  thermalSource: {
    kind: "typed" | "fitted";
    fileName?: string;
    points?: [number, number][];
    rmsRelativeError?: number;
    maxRelativeError?: number;
  } | null;
}

interface Row {
  key: number;
  r: string;
  tau: string;
  /** The stored term and how it was shown: saved unchanged, the full-precision value goes back, not the rounding. */
  stored?: { r: number; tau: number; rText: string; tauText: string };
}

/** Significant figures a stored or fitted term is shown with; the stored value keeps full precision. */
const SHOWN_DIGITS = 4;

let nextKey = 1;
const toRows = (terms: { r: number; tau: number }[] | null): Row[] =>
  (terms ?? []).map((t) => {
    const rText = String(Number(t.r.toPrecision(SHOWN_DIGITS)));
    const tauText = formatQuantity(t.tau, "s", SHOWN_DIGITS);
    return { key: nextKey++, r: rText, tau: tauText, stored: { ...t, rText, tauText } };
  });

/** A row's term as sent: the stored number where the text still shows it, else the text as typed. */
const termOf = ({ r, tau, stored }: Row) => ({
  r: stored && r === stored.rText ? stored.r : r,
  tau: stored && tau === stored.tauText ? stored.tau : tau,
});

type FitPhase =
  | { kind: "idle" }
  | { kind: "uploading"; fraction: number }
  | { kind: "fitting" }
  | { kind: "rejected"; fileName: string; issues: CsvIssue[] }
  | { kind: "failed"; message: string };

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
  const id = useId();
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [rows, setRows] = useState<Row[]>(() => toRows(model.foster));
  const [saved, setSaved] = useState(model);
  const [cellErrors, setCellErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: "error" | "done"; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const [maxTerms, setMaxTerms] = useState(4);
  const [fit, setFit] = useState<FitPhase>({ kind: "idle" });

  const parsed = useMemo(() => fosterSchema.safeParse({ terms: rows.map(termOf) }), [rows]);
  const preview = parsed.success && parsed.data.terms.length ? parsed.data.terms : (saved.foster ?? []);
  const dirty =
    JSON.stringify(rows.map(({ r, tau }) => [r, tau])) !==
    JSON.stringify(toRows(saved.foster).map(({ r, tau }) => [r, tau]));

  function edit(key: number, field: "r" | "tau", value: string) {
    const index = rows.findIndex((row) => row.key === key);
    setRows((all) => all.map((row) => (row.key === key ? { ...row, [field]: value } : row)));
    // The edited cell's error is stale now; the others stay until the next save says otherwise.
    setCellErrors((errors) => {
      const { [`terms.${index}.${field}`]: _edited, ...rest } = errors;
      return rest;
    });
    setMessage(null);
  }

  function onPaste(event: ClipboardEvent<HTMLInputElement>, key: number) {
    const text = event.clipboardData.getData("text");
    if (!/[\t\n]/.test(text)) return;
    const pasted = parsePastedRows(text);
    if (!pasted.length) return;
    event.preventDefault();
    setRows((all) => {
      const at = all.findIndex((row) => row.key === key);
      const fresh = pasted.map((p) => ({ key: nextKey++, ...p }));
      const keep = all.filter((row, k) => k < at || (k > at && (row.r || row.tau)));
      return [...keep.slice(0, Math.max(0, at)), ...fresh, ...keep.slice(Math.max(0, at))].slice(0, 8);
    });
    setMessage({
      tone: "done",
      text: `Pasted ${pasted.length} ${pasted.length === 1 ? "row" : "rows"}. Save to keep them.`,
    });
  }

  async function save() {
    setMessage(null);
    const check = fosterSchema.safeParse({ terms: rows.map(termOf) });
    if (!check.success) {
      const errors: Record<string, string> = {};
      for (const issue of check.error.issues) errors[issue.path.join(".")] ??= issue.message;
      setCellErrors(errors);
      setMessage({ tone: "error", text: "Some values are not valid; see the marked cells." });
      return;
    }
    setCellErrors({});
    setSaving(true);
    try {
      const result = await callJson<ThermalModel>("PUT", `/api/parts/${partId}/thermal`, {
        terms: rows.map(termOf),
      });
      setSaved(result);
      setRows(toRows(result.foster));
      setMessage({
        tone: "done",
        text: result.foster
          ? "Thermal model saved. The part is back in draft until a lead verifies it."
          : "Thermal model removed.",
      });
      startTransition(() => router.refresh());
    } catch (error) {
      if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
        setCellErrors(Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v[0]])));
      }
      setMessage({ tone: "error", text: messageOf(error) });
    } finally {
      setSaving(false);
    }
  }

  async function fitFile(file: File) {
    setFit({ kind: "uploading", fraction: 0 });
    setMessage(null);
    try {
      const uploadId = await uploadToStorage(partId, file, "zth", (fraction) =>
        setFit({ kind: "uploading", fraction }),
      );
      setFit({ kind: "fitting" });
      const result = await callJson<ThermalModel>("POST", `/api/parts/${partId}/thermal/fit`, {
        uploadId,
        maxTerms,
      });
      setSaved(result);
      setRows(toRows(result.foster));
      setCellErrors({});
      setFit({ kind: "idle" });
      setMessage({
        tone: "done",
        text: `Fitted ${result.foster?.length ?? 0} terms to ${file.name} and saved them.`,
      });
      startTransition(() => router.refresh());
    } catch (error) {
      setFit(
        error instanceof RejectedFile
          ? { kind: "rejected", fileName: file.name, issues: error.issues }
          : { kind: "failed", message: messageOf(error) },
      );
    }
  }

  const source = saved.thermalSource;
  const rth = preview.reduce((sum, t) => sum + t.r, 0);

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <div className="min-w-0 space-y-3">
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
                                onChange={(e) => edit(row.key, field, e.target.value)}
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
                          onClick={() => setRows((all) => all.filter((r) => r.key !== row.key))}
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
        {canWrite ? (
          <>
            <div className="flex flex-wrap items-center justify-between gap-2">
              <div className="flex gap-2">
                <Button
                  size="sm"
                  disabled={rows.length >= 8}
                  onClick={() => setRows((all) => [...all, { key: nextKey++, r: "", tau: "" }])}
                >
                  Add row
                </Button>
                <Button
                  size="sm"
                  variant="quiet"
                  onClick={async () => {
                    try {
                      const text = await navigator.clipboard.readText();
                      const pasted = parsePastedRows(text);
                      if (!pasted.length) throw new Error("no rows");
                      setRows(pasted.slice(0, 8).map((p) => ({ key: nextKey++, ...p })));
                      setMessage({ tone: "done", text: `Pasted ${pasted.length} rows. Save to keep them.` });
                    } catch {
                      setMessage({
                        tone: "error",
                        text: "Nothing to paste: copy rows such as “0.12⇥250us” first, or paste into a cell with Ctrl+V.",
                      });
                    }
                  }}
                >
                  Paste rows
                </Button>
              </div>
              <Button
                variant="primary"
                size="sm"
                pending={saving || refreshing}
                disabled={!dirty}
                onClick={save}
              >
                Save thermal model
              </Button>
            </div>
            <p className="text-xs text-ink-muted">
              Up to 8 terms, R in K/W and τ with a unit (250us, 1.5 ms, 0.2 s). Paste rows copied from a
              spreadsheet into any cell: one term per line, R then τ. Saving returns the part to draft.
            </p>
          </>
        ) : null}
        {message ? <FormMessage tone={message.tone}>{message.text}</FormMessage> : null}
      </div>

      <div className="min-w-0 space-y-3">
        {preview.length ? (
          <>
            <ZthChart terms={preview} points={source?.kind === "fitted" ? source.points : undefined} />
            <p className="text-xs text-ink-muted">
              <Sym main="R" sub="th(j-c)" /> = Σ<Sym main="R" sub="i" /> = {formatQuantity(rth, "K/W")}.{" "}
              {source?.kind === "fitted" ? (
                <>
                  Fitted to {source.fileName ?? "an uploaded Z_th curve"} (rings): RMS error{" "}
                  {formatQuantity((source.rmsRelativeError ?? 0) * 100, "%")}, largest{" "}
                  {formatQuantity((source.maxRelativeError ?? 0) * 100, "%")}.
                </>
              ) : (
                "Typed or pasted terms."
              )}
            </p>
          </>
        ) : null}
        {canWrite ? (
          <div className="space-y-2">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h4 className="text-sm font-medium">
                Fit a <Sym main="Z" sub="th" />
                (t) curve
              </h4>
              <label className="text-xs text-ink-muted">
                Terms{" "}
                <select
                  value={maxTerms}
                  onChange={(e) => setMaxTerms(Number(e.target.value))}
                  className="ml-1 h-7 rounded-md border border-line-strong bg-panel px-1.5 text-sm text-ink"
                >
                  {[3, 4, 5, 6].map((n) => (
                    <option key={n} value={n}>
                      {n}
                    </option>
                  ))}
                </select>
              </label>
            </div>
            <CsvDropzone
              label="Z_th curve upload"
              testId="zth-dropzone"
              busy={fit.kind === "uploading" || fit.kind === "fitting"}
              onFile={fitFile}
              onRefused={(text) => setFit({ kind: "failed", message: text })}
            >
              <p className="text-xs text-ink-muted">
                Two columns, t and <Sym main="Z" sub="th" /> (single pulse, junction to case), e.g. &ldquo;t
                [ms],Zth [K/W]&rdquo;; at least 4 points. The fit replaces the terms above.
              </p>
            </CsvDropzone>
            {fit.kind === "uploading" ? <UploadProgress label="Uploading…" fraction={fit.fraction} /> : null}
            {fit.kind === "fitting" ? (
              <UploadProgress label="Fitting the thermal model…" fraction={null} />
            ) : null}
            {fit.kind === "rejected" ? (
              <IssueTable issues={fit.issues} label={`Problems in ${fit.fileName}`} />
            ) : null}
            {fit.kind === "failed" ? <FormMessage tone="error">{fit.message}</FormMessage> : null}
          </div>
        ) : null}
      </div>
    </div>
  );
}
