import { TransferChart } from "@/components/soa-chart";
import type { TransferFinding } from "@/lib/library/transfer-findings";
import type { TransferPreview } from "./use-transfer-draft";

/** What the review of the curves found: must-fix errors and warnings to check. */
export function TransferFindings({ findings }: { findings: TransferFinding[] }) {
  return (
    <ul className="space-y-2" aria-label="Transfer findings">
      {findings.map((f) => (
        <li
          key={`${f.key}-${f.row ?? ""}`}
          data-testid="transfer-finding"
          data-severity={f.severity}
          className={`rounded-md border border-line border-l-2 bg-panel px-3 py-2 text-sm ${
            f.severity === "error" ? "border-l-fail" : "border-l-marginal"
          }`}
        >
          <span className="font-medium">{f.severity === "error" ? "Must fix" : "Check"}:</span> {f.message}
        </li>
      ))}
    </ul>
  );
}

/** The curves drawn with their zero-temperature-coefficient point, or why there is nothing to draw. */
export function TransferCurves({
  preview,
  fileName,
}: {
  preview: TransferPreview | null;
  fileName?: string;
}) {
  if (!preview?.curves?.length) {
    return (
      <p className="rounded-md border border-line bg-panel px-4 py-8 text-center text-sm text-ink-muted">
        No transfer characteristics: the stability check of this part says nothing until they are given.
      </p>
    );
  }
  return (
    <>
      <TransferChart curves={preview.curves} zeroTc={preview.review?.zeroTc ?? null} />
      <p className="text-xs text-ink-muted">
        {preview.points} points
        {fileName ? ` from ${fileName}` : ""}. Below the zero-temperature-coefficient point the hotter curve
        carries more current: a pulse held there at fixed gate voltage heats, draws more current and can run
        away. The stability check reads the temperature coefficient α from these curves and draws the
        instability boundary on the SOA chart.
      </p>
    </>
  );
}
