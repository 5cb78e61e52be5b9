import { ApiError, type FieldErrors } from "@/components/api-client";
import type { CsvIssue } from "@/lib/csv/issues";

// Calls of the library screens that the shared `sendJson` does not cover: GET and PUT with the same typed
// failure, the rejected rows of a CSV, and the browser's own upload of a file to storage with its progress.

interface ErrorBody {
  error?: { code?: string; message?: string; details?: { fieldErrors?: FieldErrors; issues?: CsvIssue[] } };
}

/** A failure that carries the CSV rows the server rejected, if any. */
export class RejectedFile extends ApiError {
  constructor(
    status: number,
    code: string,
    message: string,
    readonly issues: CsvIssue[],
  ) {
    super(status, code, message);
  }
}

export async function callJson<T>(method: "GET" | "PUT" | "POST", url: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      credentials: "same-origin",
      headers: body === undefined ? undefined : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch (cause) {
    console.error(cause);
    throw new ApiError(0, "network", "The server could not be reached. Check the connection and try again.");
  }
  const payload: unknown = await res.json().catch(() => null);
  if (res.ok) return payload as T;
  const error = (payload as ErrorBody | null)?.error;
  const message =
    error?.message ??
    (res.status === 413 ? "The file is larger than 5 MB." : `The server answered ${res.status}.`);
  const code = error?.code ?? `http:${res.status}`;
  if (error?.details?.issues?.length) throw new RejectedFile(res.status, code, message, error.details.issues);
  throw new ApiError(res.status, code, message, error?.details?.fieldErrors ?? {});
}

/** PUTs a file to a presigned storage URL, reporting progress from 0 to 1. */
export function putFile(url: string, file: File, onProgress: (fraction: number) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("PUT", url);
    xhr.setRequestHeader("content-type", "text/csv");
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1);
        resolve();
      } else {
        reject(new ApiError(xhr.status, "storage", `Storage refused the file (${xhr.status}). Try again.`));
      }
    };
    xhr.onerror = () =>
      reject(
        new ApiError(
          0,
          "storage",
          "The file could not be sent to storage. Check the connection and try again.",
        ),
      );
    xhr.send(file);
  });
}

export interface UploadTicket {
  uploadId: string;
  objectKey: string;
  url: string;
}

/** Asks for a presigned URL, then sends the file straight to storage; returns the upload's id. */
export async function uploadToStorage(
  partId: string,
  file: File,
  purpose: "curve-set" | "zth",
  onProgress: (fraction: number) => void,
): Promise<string> {
  const ticket = await callJson<UploadTicket>("POST", `/api/parts/${partId}/uploads`, {
    fileName: file.name,
    size: file.size,
    purpose,
  });
  await putFile(ticket.url, file, onProgress);
  return ticket.uploadId;
}
