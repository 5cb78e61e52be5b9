"use client";

import type { ReactNode } from "react";
import { type FileRejection, useDropzone } from "react-dropzone";
import { Button } from "@/components/form";
import { CSV_FILE_TYPES, MAX_CSV_BYTES, overLimit } from "@/lib/csv/limits";

/** Why a dropped file was refused before it was sent, in words. */
function refusal(rejections: FileRejection[]): string {
  const [first] = rejections;
  if (!first) return "That file could not be used.";
  if (rejections.length > 1 || first.errors.some((e) => e.code === "too-many-files"))
    return "Drop one file at a time.";
  if (first.errors.some((e) => e.code === "file-too-large")) {
    return `${first.file.name} is ${overLimit(first.file.size)}.`;
  }
  if (first.errors.some((e) => e.code === "file-invalid-type")) {
    return `${first.file.name} is not a CSV text file (.csv, .tsv or .txt).`;
  }
  return first.errors[0]?.message ?? "That file could not be used.";
}

/** A drop zone for one CSV file, with a button to choose it instead. */
export function CsvDropzone({
  label,
  busy,
  onFile,
  onRefused,
  children,
  testId,
}: {
  label: string;
  busy: boolean;
  onFile: (file: File) => void;
  onRefused: (message: string) => void;
  children?: ReactNode;
  testId?: string;
}) {
  const { getRootProps, getInputProps, isDragActive, open } = useDropzone({
    accept: CSV_FILE_TYPES,
    maxSize: MAX_CSV_BYTES,
    multiple: false,
    disabled: busy,
    noClick: true,
    noKeyboard: true,
    onDropAccepted: ([file]) => onFile(file),
    onDropRejected: (rejections) => onRefused(refusal(rejections)),
  });
  return (
    <div
      {...getRootProps({
        "aria-label": label,
        role: "group",
      })}
      data-testid={testId}
      className={`flex flex-col items-center justify-center gap-2 rounded-md border border-dashed px-4 py-6 text-center text-sm transition-colors ${
        isDragActive ? "border-accent bg-accent-soft" : "border-line-strong bg-panel"
      } ${busy ? "opacity-70" : ""}`}
    >
      <input {...getInputProps()} aria-label={`${label}: choose a file`} />
      <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true" className="text-ink-faint">
        <path d="M11 14V4M7 8l4-4 4 4M4 14v4h14v-4" fill="none" stroke="currentColor" strokeWidth="1.5" />
      </svg>
      <p className="text-ink">
        {isDragActive ? "Drop the file to upload it" : "Drag a CSV file here, or"}{" "}
        {isDragActive ? null : (
          <Button size="sm" variant="secondary" onClick={open} disabled={busy} className="ml-1">
            Choose a file
          </Button>
        )}
      </p>
      {children}
    </div>
  );
}
