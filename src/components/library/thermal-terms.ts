"use client";

import { useRouter } from "next/navigation";
import { type ClipboardEvent, useMemo, useState, useTransition } from "react";
import { ApiError, requestJson } from "@/components/api-client";
import { useSaveAction } from "@/components/use-save-action";
import { editable, q } from "@/lib/format";
import { fosterSchema } from "@/lib/library/part-schema";

import { parsePastedRows } from "./paste-rows";

// The thermal editor's state: the Foster terms as typed, their errors, and saving them (PUT /api/parts/:id/thermal).

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

export interface TermRow {
  key: number;
  r: string;
  tau: string;
  /** The stored term and how it was shown: saved unchanged, the full-precision value goes back, not the rounding. */
  stored?: { r: number; tau: number; rText: string; tauText: string };
}

export type { Message } from "@/components/use-save-action";

/** Most terms a model keeps. */
export const MAX_TERMS = 8;

/** Significant figures a stored or fitted term is shown with; the stored value keeps full precision. */
const SHOWN_DIGITS = 4;

let nextKey = 1;
export const newKey = () => nextKey++;

const toRows = (terms: { r: number; tau: number }[] | null): TermRow[] =>
  (terms ?? []).map((t) => {
    const rText = editable(t.r, "plain", SHOWN_DIGITS);
    const tauText = q(t.tau, "s", SHOWN_DIGITS);
    return { key: newKey(), r: rText, tau: tauText, stored: { ...t, rText, tauText } };
  });

/** A row's term as sent: the stored number where the text still shows it, else the text as typed. */
const termOf = ({ r, tau, stored }: TermRow) => ({
  r: stored && r === stored.rText ? stored.r : r,
  tau: stored && tau === stored.tauText ? stored.tau : tau,
});

/** The terms being edited, the model as saved, and what editing, pasting and saving do to them. */
export function useThermalTerms(partId: string, model: ThermalModel) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [rows, setRows] = useState<TermRow[]>(() => toRows(model.foster));
  const [saved, setSaved] = useState(model);
  const [cellErrors, setCellErrors] = useState<Record<string, string>>({});
  const { saving, message, setMessage, run } = useSaveAction();

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

  /** Rows pasted into a cell replace that row and go before the rows after it. */
  function onPaste(event: ClipboardEvent<HTMLInputElement>, key: number) {
    const text = event.clipboardData.getData("text");
    if (!/[\t\n]/.test(text)) return;
    const pasted = parsePastedRows(text);
    if (!pasted.length) return;
    event.preventDefault();
    setRows((all) => {
      const at = all.findIndex((row) => row.key === key);
      const fresh = pasted.map((p) => ({ key: newKey(), ...p }));
      const keep = all.filter((row, k) => k < at || (k > at && (row.r || row.tau)));
      return [...keep.slice(0, Math.max(0, at)), ...fresh, ...keep.slice(Math.max(0, at))].slice(
        0,
        MAX_TERMS,
      );
    });
    setMessage({
      tone: "done",
      text: `Pasted ${pasted.length} ${pasted.length === 1 ? "row" : "rows"}. Save to keep them.`,
    });
  }

  /** A model the server saved (typed and saved, or fitted): it becomes the rows and the saved state. */
  function accept(result: ThermalModel, text: string) {
    setSaved(result);
    setRows(toRows(result.foster));
    setCellErrors({});
    setMessage({ tone: "done", text });
    startTransition(() => router.refresh());
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
    await run(
      async () => {
        const result = await requestJson<ThermalModel>("PUT", `/api/parts/${partId}/thermal`, {
          terms: rows.map(termOf),
        });
        accept(
          result,
          result.foster
            ? "Thermal model saved. The part is back in draft until a lead verifies it."
            : "Thermal model removed.",
        );
      },
      {
        onError: (error) => {
          if (error instanceof ApiError && Object.keys(error.fieldErrors).length) {
            setCellErrors(Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v[0]])));
          }
        },
      },
    );
  }

  return {
    rows,
    setRows,
    saved,
    preview,
    dirty,
    cellErrors,
    message,
    setMessage,
    busy: saving || refreshing,
    edit,
    onPaste,
    accept,
    save,
  };
}
