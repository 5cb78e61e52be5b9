import type { ChartDuration, ChartFinding } from "@/components/soa-chart";
import { q } from "@/lib/format";
import { findingKey } from "@/lib/library/finding-key";

/** A curve's width as the chart's legend names it; written here so the list does not load the chart's code. */
function curveName(duration: ChartDuration): string {
  return duration === "DC" ? "DC" : q(duration, "s");
}

const kindWords: Record<string, string> = {
  "invalid-point": "Invalid point",
  "empty-curve": "Empty curve",
  "not-increasing": "Digitised out of order",
  "steeper-than-resistor": "Steeper than a resistor line",
  "longer-above-shorter": "Longer pulse above a shorter one",
  "thermal-mismatch": "Disagrees with the thermal model",
  "rating-mismatch": "Thermal model against the rated R_th(j-c)",
};

/** The curve set's quality findings, numbered as they are marked on the chart, with any reason for accepting. */
export function FindingsList({
  findings,
  accepted = [],
}: {
  findings: ChartFinding[];
  accepted?: { key: string; reason: string }[];
}) {
  if (findings.length === 0) {
    return (
      <p className="text-sm text-ink-muted">
        No findings: every curve rises no faster than a resistor line, no longer pulse lies more than 5 %
        above a shorter one, and the power levels and ΣR_i agree with the thermal model and R_th(j-c) where
        given.
      </p>
    );
  }
  const reasons = new Map(accepted.map((a) => [a.key, a.reason]));
  return (
    <ol className="space-y-2.5" aria-label="Findings">
      {findings.map((finding, k) => {
        const reason = reasons.get(findingKey(finding));
        return (
          <li key={findingKey(finding)} className="flex gap-2.5 text-sm" data-testid="finding">
            <span
              aria-hidden="true"
              className="mt-0.5 inline-flex size-[18px] shrink-0 items-center justify-center rounded-full border border-ink text-[10px] font-semibold"
            >
              {k + 1}
            </span>
            <div className="min-w-0">
              <p className="font-medium">
                <span className="sr-only">Finding {k + 1}: </span>
                {kindWords[finding.kind] ?? finding.kind}
                <span className="font-normal text-ink-muted">
                  {finding.curve ? ` · ${curveName(finding.curve.duration)} curve` : " · part"}
                  {finding.size ? ` · ${finding.size}` : ""}
                </span>
              </p>
              <p className="text-ink-muted">
                {finding.message.charAt(0).toUpperCase() + finding.message.slice(1)}.
                {finding.location && "index" in finding.location
                  ? " (Not marked on the chart: it concerns the order in the file.)"
                  : finding.location === undefined
                    ? " (Not marked on the chart: it concerns the part's ratings.)"
                    : ""}
              </p>
              {reason ? (
                <p className="mt-0.5 text-ink" data-testid="finding-accepted">
                  Accepted on verifying: {reason}
                </p>
              ) : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
