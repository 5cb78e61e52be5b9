"use client";

import { useRouter } from "next/navigation";
import { useId, useMemo, useState, useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";
import { TransferChart } from "@/components/soa-chart";
import type { TransferRow } from "@/db/schema";
import { parseTransferCsv } from "@/lib/csv/transfer";
import { reviewTransfer, type TransferFinding } from "@/lib/library/transfer-findings";
import { RejectedFile } from "./api";
import { CsvDropzone } from "./csv-dropzone";
import { Sym } from "./symbols";
import { IssueTable } from "./upload-progress";

/** The stored curves as the text the editor shows: one row per point, cooler curve first. */
function toText(transfer: TransferRow | null): string {
  if (!transfer) return "";
  const rows = transfer.curves.flatMap((curve, c) =>
    curve.map(([g, i]) => `${transfer.temps[c]},${Number(g.toPrecision(6))},${Number(i.toPrecision(6))}`),
  );
  return ["T_j [°C],V_GS [V],I_D [A]", ...rows].join("\n");
}

const example =
  "T_j [°C],V_GS [V],I_D [A]\n25,3.0,0.5\n25,4.0,12\n25,5.0,60\n150,3.0,1.6\n150,4.0,16\n150,5.0,48";

/**
 * A part's transfer characteristics at two junction temperatures (METHODS.md §12): typed or pasted as rows, or read
 * from a CSV file into the same box, so both go through one parser. The preview lists unreadable cells by row and
 * column, the findings (order, temperatures, where the curves cross), and draws the curves with the
 * zero-temperature-coefficient point; saving sends the text, which the server reads again by the same rules.
 */
export function TransferEditor({
  partId,
  transfer,
  canWrite,
}: {
  partId: string;
  transfer: TransferRow | null;
  canWrite: boolean;
}) {
  const id = useId();
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [saved, setSaved] = useState(transfer);
  const [text, setText] = useState(() => toText(transfer));
  const [fileName, setFileName] = useState<string | undefined>(transfer?.source.fileName);
  const [message, setMessage] = useState<{ tone: "error" | "done"; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const dirty = text.trim() !== toText(saved).trim();

  const preview = useMemo(() => {
    if (text.trim() === "") return null;
    const parsed = parseTransferCsv(text);
    if (!parsed.ok) return { errors: parsed.errors, review: null, points: 0 };
    return {
      errors: [],
      review: reviewTransfer(parsed.curves),
      points: parsed.curves.reduce((n, c) => n + c.points.length, 0),
      curves: parsed.curves,
    };
  }, [text]);
  const blocked = !preview || preview.errors.length > 0 || !preview.review?.data;

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

  async function save() {
    setSaving(true);
    setMessage(null);
    try {
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
    } catch (error) {
      setMessage({
        tone: "error",
        text: error instanceof RejectedFile ? `Not saved: ${error.issues[0]?.message}` : messageOf(error),
      });
    } finally {
      setSaving(false);
    }
  }

  async function remove() {
    setSaving(true);
    try {
      await requestJson("DELETE", `/api/parts/${partId}/transfer`);
      setSaved(null);
      setText("");
      setFileName(undefined);
      setMessage({ tone: "done", text: "Transfer characteristics removed." });
      startTransition(() => router.refresh());
    } catch (error) {
      setMessage({ tone: "error", text: messageOf(error) });
    } finally {
      setSaving(false);
    }
  }

  const review = preview?.review ?? null;
  const chartCurves =
    preview && "curves" in preview && preview.curves
      ? preview.curves.map((c) => ({
          temp: c.temp,
          points: c.points.map((p) => [p.vgs, p.id] as [number, number]),
        }))
      : null;

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <div className="min-w-0 space-y-3">
        {canWrite ? (
          <>
            <label htmlFor={`${id}-text`} className="block text-sm font-medium">
              Points, one per row: <Sym main="T" sub="j" /> (°C), <Sym main="V" sub="GS" /> (V),{" "}
              <Sym main="I" sub="D" /> (A)
            </label>
            <textarea
              id={`${id}-text`}
              value={text}
              onChange={(e) => {
                setText(e.target.value);
                setFileName(undefined);
                setMessage(null);
              }}
              rows={10}
              spellCheck={false}
              placeholder={example}
              aria-describedby={`${id}-help`}
              data-testid="transfer-text"
              className="w-full rounded-md border border-line-strong bg-panel px-2 py-1.5 font-mono text-xs"
            />
            <p id={`${id}-help`} className="text-xs text-ink-muted">
              Two curves from the datasheet&rsquo;s typical transfer characteristic figure, e.g. at 25 °C and
              150 °C junction temperature, each with its points in ascending <Sym main="V" sub="GS" />. A
              header row is optional; a unit in it scales its column (&ldquo;I_D [mA]&rdquo;). Comma,
              semicolon or tab separated, as for curve sets. Saving returns the part to draft.
            </p>
            <CsvDropzone
              label="Transfer characteristics upload"
              testId="transfer-dropzone"
              busy={saving}
              onFile={readFile}
              onRefused={(refusal) => setMessage({ tone: "error", text: refusal })}
            >
              <p className="text-xs text-ink-muted">The file is read into the box above by the same rules.</p>
            </CsvDropzone>
            <div className="flex items-center justify-between gap-2">
              {saved ? (
                <Button size="sm" variant="quiet" onClick={remove} disabled={saving}>
                  Remove transfer data
                </Button>
              ) : (
                <span />
              )}
              <Button
                variant="primary"
                size="sm"
                pending={saving || refreshing}
                disabled={!dirty || blocked}
                onClick={save}
              >
                Save transfer characteristics
              </Button>
            </div>
          </>
        ) : saved ? null : (
          <p className="text-sm text-ink-muted">No transfer characteristics. An engineer adds them.</p>
        )}
        {message ? <FormMessage tone={message.tone}>{message.text}</FormMessage> : null}
        {preview && preview.errors.length > 0 ? (
          <IssueTable issues={preview.errors} label="Problems in the transfer data" />
        ) : null}
        {review && review.findings.length > 0 ? (
          <ul className="space-y-2" aria-label="Transfer findings">
            {review.findings.map((f) => (
              <li
                key={`${f.key}-${f.row ?? ""}`}
                data-testid="transfer-finding"
                data-severity={f.severity}
                className={`rounded-md border border-line border-l-2 bg-panel px-3 py-2 text-sm ${
                  f.severity === "error" ? "border-l-fail" : "border-l-marginal"
                }`}
              >
                <span className="font-medium">{f.severity === "error" ? "Must fix" : "Check"}:</span>{" "}
                {f.message}
              </li>
            ))}
          </ul>
        ) : null}
      </div>

      <div className="min-w-0 space-y-3">
        {chartCurves?.length ? (
          <>
            <TransferChart curves={chartCurves} zeroTc={review?.zeroTc ?? null} />
            <p className="text-xs text-ink-muted">
              {preview?.points} points
              {fileName ? ` from ${fileName}` : ""}. Below the zero-temperature-coefficient point the hotter
              curve carries more current: a pulse held there at fixed gate voltage heats, draws more current
              and can run away. The stability check reads the temperature coefficient α from these curves and
              draws the instability boundary on the SOA chart.
            </p>
          </>
        ) : (
          <p className="rounded-md border border-line bg-panel px-4 py-8 text-center text-sm text-ink-muted">
            No transfer characteristics: the stability check of this part says nothing until they are given.
          </p>
        )}
      </div>
    </div>
  );
}
