"use client";

import { useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { FormMessage } from "@/components/form";
import type { CsvIssue } from "@/lib/csv/issues";
import { RejectedFile, uploadToStorage } from "./api";
import { CsvDropzone } from "./csv-dropzone";
import { Sym } from "./symbols";
import type { ThermalModel } from "./thermal-terms";
import { IssueTable, UploadProgress } from "./upload-progress";

type FitPhase =
  | { kind: "idle" }
  | { kind: "uploading"; fraction: number }
  | { kind: "fitting" }
  | { kind: "rejected"; fileName: string; issues: CsvIssue[] }
  | { kind: "failed"; message: string };

/**
 * Fit a Z_th(t) CSV to 3–6 Foster terms: the file goes to storage, the server fits and saves the model
 * (POST /api/parts/:id/thermal/fit), and `onFitted` gets it; a rejected file lists its problems.
 */
export function ZthFit({
  partId,
  onStart,
  onFitted,
}: {
  partId: string;
  onStart: () => void;
  onFitted: (result: ThermalModel, fileName: string) => void;
}) {
  const [maxTerms, setMaxTerms] = useState(4);
  const [fit, setFit] = useState<FitPhase>({ kind: "idle" });

  async function fitFile(file: File) {
    setFit({ kind: "uploading", fraction: 0 });
    onStart();
    try {
      const uploadId = await uploadToStorage(partId, file, "zth", (fraction) =>
        setFit({ kind: "uploading", fraction }),
      );
      setFit({ kind: "fitting" });
      const result = await requestJson<ThermalModel>("POST", `/api/parts/${partId}/thermal/fit`, {
        uploadId,
        maxTerms,
      });
      setFit({ kind: "idle" });
      onFitted(result, file.name);
    } catch (error) {
      setFit(
        error instanceof RejectedFile
          ? { kind: "rejected", fileName: file.name, issues: error.issues }
          : { kind: "failed", message: messageOf(error) },
      );
    }
  }

  return (
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
      {fit.kind === "fitting" ? <UploadProgress label="Fitting the thermal model…" fraction={null} /> : null}
      {fit.kind === "rejected" ? (
        <IssueTable issues={fit.issues} label={`Problems in ${fit.fileName}`} />
      ) : null}
      {fit.kind === "failed" ? <FormMessage tone="error">{fit.message}</FormMessage> : null}
    </div>
  );
}
