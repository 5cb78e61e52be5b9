import { ScrollRegion } from "@/components/scroll-region";
import type { CsvIssue } from "@/lib/csv/issues";

/** Long work in words with a bar: "Uploading… 45 %", then "Checking the curves…". */
export function UploadProgress({ label, fraction }: { label: string; fraction: number | null }) {
  const percent = fraction === null ? null : Math.round(fraction * 100);
  return (
    <div className="space-y-1.5" data-testid="upload-progress">
      <p className="text-sm text-ink" aria-live="polite">
        {label}
        {percent === null ? "" : ` ${percent}\u00a0%`}
      </p>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent ?? undefined}
        className="h-1.5 overflow-hidden rounded-full bg-sunken"
      >
        <div
          className={`h-full rounded-full bg-accent transition-[width] ${percent === null ? "w-1/3 animate-pulse" : ""}`}
          style={percent === null ? undefined : { width: `${percent}%` }}
        />
      </div>
    </div>
  );
}

/** The rows a CSV was rejected for: row, column and reason, as a spreadsheet would point at them. */
export function IssueTable({ issues, label }: { issues: CsvIssue[]; label: string }) {
  return (
    <ScrollRegion className="max-h-72 overflow-auto rounded-md border border-line bg-panel">
      <table aria-label={label} className="w-full border-separate border-spacing-0 text-sm">
        <thead>
          <tr>
            {["Row", "Column", "Reason"].map((h) => (
              <th
                key={h}
                scope="col"
                className={`sticky top-0 h-8 border-b border-line bg-sunken px-3 text-xs font-medium text-ink-muted ${h === "Row" ? "w-16 text-right" : "text-left"}`}
              >
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {issues.map((issue, k) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: the server's list, shown once and never reordered
            <tr key={k}>
              <td className="num h-8 border-b border-line px-3 text-right font-mono text-xs">
                {issue.row ?? "—"}
              </td>
              <td className="h-8 border-b border-line px-3 font-mono text-xs">{issue.column ?? "—"}</td>
              <td className="h-8 border-b border-line px-3">{issue.reason}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
