"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { FormMessage } from "@/components/form";
import { curveCsvHelp } from "@/lib/csv/curve-set-help";
import type { CsvIssue } from "@/lib/csv/issues";
import { RejectedFile, uploadToStorage } from "./api";
import { CsvDropzone } from "./csv-dropzone";
import { IssueTable, UploadProgress } from "./upload-progress";

type Phase =
  | { kind: "idle" }
  | { kind: "uploading"; fileName: string; fraction: number }
  | { kind: "checking"; fileName: string }
  | { kind: "accepted"; fileName: string; curves: number; findings: number; warnings: CsvIssue[] }
  | { kind: "rejected"; fileName: string; message: string; issues: CsvIssue[] }
  | { kind: "failed"; message: string };

interface Registered {
  curves: number;
  findings: unknown[];
  warnings: CsvIssue[];
}

/**
 * Uploads a curve set: the browser sends the CSV straight to storage (progress in words), then the server reads
 * it back, checks it and stores the curves as the part's active set, or answers with every rejected row.
 */
export function CurveUpload({ partId }: { partId: string }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [refreshing, startTransition] = useTransition();
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const busy = phase.kind === "uploading" || phase.kind === "checking" || refreshing;

  async function upload(file: File) {
    const fileName = file.name;
    setPhase({ kind: "uploading", fileName, fraction: 0 });
    try {
      const uploadId = await uploadToStorage(partId, file, "curve-set", (fraction) =>
        setPhase({ kind: "uploading", fileName, fraction }),
      );
      setPhase({ kind: "checking", fileName });
      const result = await requestJson<Registered>("POST", `/api/parts/${partId}/curve-sets`, { uploadId });
      setPhase({
        kind: "accepted",
        fileName,
        curves: result.curves,
        findings: result.findings.length,
        warnings: result.warnings ?? [],
      });
      await queryClient.invalidateQueries({ queryKey: ["part-limits", partId] });
      startTransition(() => router.refresh());
    } catch (error) {
      if (error instanceof RejectedFile) {
        setPhase({ kind: "rejected", fileName, message: error.message, issues: error.issues });
      } else {
        setPhase({ kind: "failed", message: messageOf(error) });
      }
    }
  }

  return (
    <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,22rem)]">
      <div className="min-w-0 space-y-3">
        <CsvDropzone
          label="Curve-set upload"
          testId="curve-dropzone"
          busy={busy}
          onFile={upload}
          onRefused={(message) => setPhase({ kind: "failed", message })}
        >
          <p className="text-xs text-ink-muted">
            One CSV of the datasheet&apos;s SOA figure, at most 5&nbsp;MB. It becomes the active curve set;
            earlier ones stay in the revisions below.
          </p>
        </CsvDropzone>
        {phase.kind === "uploading" ? <UploadProgress label="Uploading…" fraction={phase.fraction} /> : null}
        {phase.kind === "checking" ? <UploadProgress label="Checking the curves…" fraction={null} /> : null}
        {phase.kind === "accepted" ? (
          <div className="space-y-2">
            <UploadProgress label="Uploaded and checked" fraction={1} />
            <FormMessage tone="done">
              {phase.fileName} accepted: {phase.curves} {phase.curves === 1 ? "curve" : "curves"},{" "}
              {phase.findings === 0
                ? "no findings"
                : `${phase.findings} ${phase.findings === 1 ? "finding" : "findings"} marked on the chart`}
              .{refreshing ? " Drawing the chart…" : ""}
            </FormMessage>
            {phase.warnings.length ? (
              <IssueTable issues={phase.warnings} label={`Notes on ${phase.fileName}`} />
            ) : null}
          </div>
        ) : null}
        {phase.kind === "rejected" ? (
          <div className="space-y-2" data-testid="upload-rejected">
            <FormMessage tone="error">
              {phase.fileName} was not accepted, and nothing was stored. Fix these rows and upload it again.
            </FormMessage>
            <IssueTable issues={phase.issues} label={`Problems in ${phase.fileName}`} />
          </div>
        ) : null}
        {phase.kind === "failed" ? <FormMessage tone="error">{phase.message}</FormMessage> : null}
      </div>
      <div className="min-w-0 space-y-2 text-sm text-ink-muted">
        <h3 className="font-medium text-ink">Accepted formats</h3>
        <p>{curveCsvHelp[0]}</p>
        <p className="flex flex-wrap gap-x-4 gap-y-1">
          <a
            href="/examples/soa-curves-table.csv"
            download="pulsefence-soa-example-table.csv"
            className="text-accent underline underline-offset-2"
          >
            Example: table form (CSV)
          </a>
          <a
            href="/examples/soa-curves-paired.csv"
            download="pulsefence-soa-example-paired.csv"
            className="text-accent underline underline-offset-2"
          >
            Example: paired columns (CSV)
          </a>
        </p>
        <details>
          <summary className="cursor-pointer text-ink hover:underline">
            The two forms, units, separators and checks
          </summary>
          <div className="mt-2 space-y-2">
            {curveCsvHelp.slice(1).map((paragraph) => (
              <p key={paragraph.slice(0, 24)}>{paragraph}</p>
            ))}
          </div>
        </details>
      </div>
    </div>
  );
}
