"use client";

import { useId } from "react";
import { Button, FormMessage } from "@/components/form";
import type { TransferRow } from "@/db/schema";
import { CsvDropzone } from "./csv-dropzone";
import { Sym } from "./symbols";
import { TransferCurves, TransferFindings } from "./transfer-preview";
import { IssueTable } from "./upload-progress";
import { useTransferDraft } from "./use-transfer-draft";

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
  const draft = useTransferDraft(partId, transfer);
  const { preview } = draft;

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
              value={draft.text}
              onChange={(e) => draft.edit(e.target.value)}
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
              busy={draft.saving}
              onFile={draft.readFile}
              onRefused={draft.refuse}
            >
              <p className="text-xs text-ink-muted">The file is read into the box above by the same rules.</p>
            </CsvDropzone>
            <div className="flex items-center justify-between gap-2">
              {draft.hasSaved ? (
                <Button size="sm" variant="quiet" onClick={draft.remove} disabled={draft.saving}>
                  Remove transfer data
                </Button>
              ) : (
                <span />
              )}
              <Button
                variant="primary"
                size="sm"
                pending={draft.saving || draft.refreshing}
                disabled={!draft.dirty || draft.blocked}
                onClick={draft.save}
              >
                Save transfer characteristics
              </Button>
            </div>
          </>
        ) : draft.hasSaved ? null : (
          <p className="text-sm text-ink-muted">No transfer characteristics. An engineer adds them.</p>
        )}
        {draft.message ? <FormMessage tone={draft.message.tone}>{draft.message.text}</FormMessage> : null}
        {preview && preview.errors.length > 0 ? (
          <IssueTable issues={preview.errors} label="Problems in the transfer data" />
        ) : null}
        {preview?.review?.findings.length ? <TransferFindings findings={preview.review.findings} /> : null}
      </div>

      <div className="min-w-0 space-y-3">
        <TransferCurves preview={preview} fileName={draft.fileName} />
      </div>
    </div>
  );
}
