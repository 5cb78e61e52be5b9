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
