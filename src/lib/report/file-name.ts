/** A download's file name from the project's name and a date, safe for every file system. */
export function downloadName(projectName: string, date: Date, extension: string): string {
  const slug = projectName
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .replace(/\s+/g, "-")
    .slice(0, 60);
  return `${slug || "project"}-${date.toISOString().slice(0, 10)}.${extension}`;
}

/** The same name keeping the project's own letters (any script), without characters file systems refuse. */
export function unicodeDownloadName(projectName: string, date: Date, extension: string): string {
  const name = projectName
    .normalize("NFC")
    .replace(/[\p{Cc}\p{Cf}/\\:*?"<>|]/gu, "")
    .trim()
    .replace(/\s+/g, "-")
    .slice(0, 60);
  return `${name || "project"}-${date.toISOString().slice(0, 10)}.${extension}`;
}

/**
 * A Content-Disposition value for an attachment (RFC 6266): an ASCII `filename` for old clients and a UTF-8
 * `filename*` (RFC 8187 encoding) so a name in any script arrives intact.
 */
export function attachmentDisposition(projectName: string, date: Date, extension: string): string {
  const ascii = downloadName(projectName, date, extension);
  const unicode = unicodeDownloadName(projectName, date, extension);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeRfc8187(unicode)}`;
}

/** Percent-encodes everything but RFC 8187's attr-char set. */
function encodeRfc8187(value: string): string {
  return encodeURIComponent(value).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );
}
