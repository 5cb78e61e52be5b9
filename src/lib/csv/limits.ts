// The upload limit and how a refusal states it, apart from the reader so that the browser's drop zones can state it
// without loading papaparse.
import { fileSize } from "@/lib/format";

/** Largest accepted CSV file: 5 MB, i.e. 5 000 000 bytes of UTF-8 (SI megabytes, as lib/format.ts writes sizes). */
export const MAX_CSV_BYTES = 5_000_000;

/** The sizes in a refusal, as every upload path words it: "5.2 MB; the limit is 5 MB". */
export function overLimit(size: number, limit = MAX_CSV_BYTES): string {
  return `${fileSize(size)}; the limit is ${fileSize(limit)}`;
}

/** The file types a CSV drop zone offers and accepts (react-dropzone's `accept`): CSV, tab-separated and plain text. */
export const CSV_FILE_TYPES = {
  "text/csv": [".csv"],
  "text/plain": [".txt", ".csv"],
  "text/tab-separated-values": [".tsv"],
  "application/vnd.ms-excel": [".csv"],
};
