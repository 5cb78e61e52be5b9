"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { type FileRejection, useDropzone } from "react-dropzone";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";
import { putFile } from "@/components/library/api";
import { UploadProgress } from "@/components/library/upload-progress";
import {
  type CapturePreview,
  MAX_CAPTURE_BYTES,
  PREVIEW_BYTES,
  previewCaptureText,
} from "@/lib/capture/parse";
import { CSV_FILE_TYPES, overLimit } from "@/lib/csv/limits";
import { fileSize } from "@/lib/format";
import { invalidateProject } from "../api";
import { captureKeys, type RegisteredCapture } from "./capture-api";
import { ColumnPicker, type PickedCapture } from "./column-picker";

type Phase =
  | { kind: "idle" }
  | { kind: "picking"; file: File; preview: CapturePreview }
  | { kind: "uploading"; file: File; fraction: number }
  | { kind: "checking"; file: File }
  | { kind: "failed"; message: string; retry: { file: File; preview: CapturePreview } | null };

function refusal(rejections: FileRejection[]): string {
  const [first] = rejections;
  if (!first || rejections.length > 1) return "Drop one file at a time.";
  if (first.errors.some((e) => e.code === "file-too-large"))
    return `${first.file.name} is ${overLimit(first.file.size, MAX_CAPTURE_BYTES)}.`;
  if (first.errors.some((e) => e.code === "file-invalid-type"))
    return `${first.file.name} is not a CSV text file (.csv, .tsv or .txt).`;
  return first.errors[0]?.message ?? "That file could not be used.";
}

/**
 * Uploading a scope capture: the browser reads the file's first 64 KB for the column picker, then sends the whole
 * file straight to storage (progress in words) and asks the server to queue it to be parsed and checked.
 */
export function CaptureUpload({
  projectId,
  onDone,
}: {
  projectId: string;
  onDone: (result: RegisteredCapture) => void;
}) {
  const queryClient = useQueryClient();
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const busy = phase.kind === "uploading" || phase.kind === "checking";

  async function read(file: File) {
    try {
      const head = await file.slice(0, PREVIEW_BYTES).text();
      setPhase({
        kind: "picking",
        file,
        preview: previewCaptureText(head, { complete: file.size <= PREVIEW_BYTES }),
      });
    } catch (error) {
      console.error(error);
      setPhase({ kind: "failed", message: `${file.name} could not be read.`, retry: null });
    }
  }

  async function upload(file: File, preview: CapturePreview, picked: PickedCapture) {
    setPhase({ kind: "uploading", file, fraction: 0 });
    try {
      const ticket = await requestJson<{ uploadId: string; url: string }>(
        "POST",
        `/api/projects/${projectId}/uploads`,
        {
          fileName: file.name,
          size: file.size,
          purpose: "capture",
        },
      );
      await putFile(ticket.url, file, (fraction) => setPhase({ kind: "uploading", file, fraction }));
      setPhase({ kind: "checking", file });
      const result = await requestJson<RegisteredCapture>("POST", `/api/projects/${projectId}/captures`, {
        uploadId: ticket.uploadId,
        ...picked,
      });
      setPhase({ kind: "idle" });
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: captureKeys.list(projectId) }),
        invalidateProject(queryClient, projectId),
      ]);
      onDone(result);
    } catch (error) {
      setPhase({ kind: "failed", message: messageOf(error), retry: { file, preview } });
    }
  }

  const { getRootProps, getInputProps, isDragActive, open } = useDropzone({
    accept: CSV_FILE_TYPES,
    maxSize: MAX_CAPTURE_BYTES,
    multiple: false,
    disabled: busy,
    noClick: true,
    noKeyboard: true,
    onDropAccepted: ([file]) => read(file),
    onDropRejected: (rejections) => setPhase({ kind: "failed", message: refusal(rejections), retry: null }),
  });

  if (phase.kind === "picking") {
    return (
      <ColumnPicker
        fileName={phase.file.name}
        preview={phase.preview}
        busy={false}
        onPick={(picked) => upload(phase.file, phase.preview, picked)}
        onCancel={() => setPhase({ kind: "idle" })}
      />
    );
  }

  return (
    <div className="space-y-3">
      <div
        {...getRootProps({ "aria-label": "Capture upload", role: "group" })}
        className={`flex flex-col items-center justify-center gap-2 rounded-md border border-dashed px-4 py-6 text-center text-sm ${
          isDragActive ? "border-accent bg-accent-soft" : "border-line-strong bg-panel"
        } ${busy ? "opacity-70" : ""}`}
      >
        <input {...getInputProps()} aria-label="Capture upload: choose a file" />
        <p>
          {isDragActive ? "Drop the capture to read its columns" : "Drag a scope capture (CSV) here, or"}{" "}
          {isDragActive ? null : (
            <Button size="sm" onClick={open} disabled={busy} className="ml-1">
              Choose a file
            </Button>
          )}
        </p>
        <p className="text-xs text-ink-muted">
          Time, voltage and current columns; instrument settings above the data are skipped. Up to{" "}
          {fileSize(MAX_CAPTURE_BYTES)} and 2 million samples. You choose the columns before anything is sent.
        </p>
      </div>
      {phase.kind === "uploading" ? (
        <UploadProgress
          label={`Uploading ${phase.file.name} (${fileSize(phase.file.size)})…`}
          fraction={phase.fraction}
        />
      ) : null}
      {phase.kind === "checking" ? (
        <UploadProgress label="Keeping the file and queueing it to be read and checked…" fraction={null} />
      ) : null}
      {phase.kind === "failed" ? (
        <FormMessage tone="error">
          {phase.message}{" "}
          {phase.retry ? (
            <Button
              size="sm"
              variant="quiet"
              onClick={() => phase.retry && setPhase({ kind: "picking", ...phase.retry })}
            >
              Back to the columns
            </Button>
          ) : null}
        </FormMessage>
      ) : null}
    </div>
  );
}
