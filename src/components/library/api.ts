import { ApiError, requestJson } from "@/components/api-client";

// Calls of the library screens: JSON through the shared client, and the browser's own upload of a file to
// storage with its progress.

export { RejectedFile } from "@/components/api-client";

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
  const ticket = await requestJson<UploadTicket>("POST", `/api/parts/${partId}/uploads`, {
    fileName: file.name,
    size: file.size,
    purpose,
  });
  await putFile(ticket.url, file, onProgress);
  return ticket.uploadId;
}
