import { useRouter } from "next/navigation";
import { useMemo, useState, useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { useSaveAction } from "@/components/use-save-action";
import type { TransferRow } from "@/db/schema";
import { parseTransferCsv } from "@/lib/csv/transfer";
import { editable } from "@/lib/format";
import { reviewTransfer, type TransferFinding } from "@/lib/library/transfer-findings";
import { RejectedFile } from "./api";

/** The stored curves as the text the editor shows: one row per point, cooler curve first. */
function toText(transfer: TransferRow | null): string {
  if (!transfer) return "";
  const rows = transfer.curves.flatMap((curve, c) =>
    curve.map(([g, i]) => `${transfer.temps[c]},${editable(g, "plain", 6)},${editable(i, "plain", 6)}`),
  );
  return ["T_j [°C],V_GS [V],I_D [A]", ...rows].join("\n");
}

/** The text as read: unreadable cells, or the findings, the point count and the curves to draw. */
function previewOf(text: string) {
  if (text.trim() === "") return null;
  const parsed = parseTransferCsv(text);
  if (!parsed.ok) return { errors: parsed.errors, review: null, points: 0, curves: null };
  return {
    errors: [],
    review: reviewTransfer(parsed.curves),
    points: parsed.curves.reduce((n, c) => n + c.points.length, 0),
    curves: parsed.curves.map((c) => ({
      temp: c.temp,
      points: c.points.map((p) => [p.vgs, p.id] as [number, number]),
    })),
  };
}

export type TransferPreview = NonNullable<ReturnType<typeof previewOf>>;

/**
 * The transfer editor's draft: the text (typed, pasted or read from a file), its preview, and saving or removing
 * it on the server, with the message each step leaves.
 */
export function useTransferDraft(partId: string, transfer: TransferRow | null) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [saved, setSaved] = useState(transfer);
  const [text, setText] = useState(() => toText(transfer));
  const [fileName, setFileName] = useState<string | undefined>(transfer?.source.fileName);
  const { saving, message, setMessage, run } = useSaveAction();
  const preview = useMemo(() => previewOf(text), [text]);

  function edit(next: string) {
    setText(next);
    setFileName(undefined);
    setMessage(null);
  }

  async function readFile(file: File) {
    setMessage(null);
    const content = await file.text();
    setText(content);
    setFileName(file.name);
    setMessage({
      tone: "done",
      text: `Read ${file.name} into the table below. Check the preview, then save.`,
    });
  }

  function save() {
    setMessage(null);
    return run(
      async () => {
        const result = await requestJson<{ transfer: TransferRow; findings: TransferFinding[] }>(
          "PUT",
          `/api/parts/${partId}/transfer`,
          { text, ...(fileName ? { fileName } : {}) },
        );
        setSaved(result.transfer);
        setText(toText(result.transfer));
        setMessage({
          tone: "done",
          text: "Transfer characteristics saved. The part is back in draft until a lead verifies it.",
        });
        startTransition(() => router.refresh());
      },
      {
        say: (error) =>
          error instanceof RejectedFile ? `Not saved: ${error.issues[0]?.message}` : messageOf(error),
      },
    );
  }

  function remove() {
    return run(async () => {
      await requestJson("DELETE", `/api/parts/${partId}/transfer`);
      setSaved(null);
      setText("");
      setFileName(undefined);
      setMessage({ tone: "done", text: "Transfer characteristics removed." });
      startTransition(() => router.refresh());
    });
  }

  return {
    text,
    fileName,
    preview,
    hasSaved: saved !== null,
    dirty: text.trim() !== toText(saved).trim(),
    blocked: !preview || preview.errors.length > 0 || !preview.review?.data,
    message,
    refuse: (refusal: string) => setMessage({ tone: "error", text: refusal }),
    saving,
    refreshing,
    edit,
    readFile,
    save,
    remove,
  };
}
