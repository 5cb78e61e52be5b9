import { type ChartFinding, durationName } from "@/components/soa-chart";

const kindWords: Record<string, string> = {
  "invalid-point": "Invalid point",
  "empty-curve": "Empty curve",
  "not-increasing": "Digitised out of order",
  "steeper-than-resistor": "Steeper than a resistor line",
  "longer-above-shorter": "Longer pulse above a shorter one",
  "thermal-mismatch": "Disagrees with the thermal model",
};

/** The curve set's quality findings, numbered as they are marked on the chart. */
export function FindingsList({ findings }: { findings: ChartFinding[] }) {
  if (findings.length === 0) {
    return (
      <p className="text-sm text-ink-muted">
        No findings: every curve rises no faster than a resistor line, no longer pulse lies above a shorter
        one, and the power levels agree with the thermal model where there is one.
      </p>
    );
  }
  return (
    <ol className="space-y-2.5" aria-label="Findings">
      {findings.map((finding, k) => (
        <li
          key={`${finding.kind}-${finding.curve.index}-${finding.message}`}
          className="flex gap-2.5 text-sm"
          data-testid="finding"
        >
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
                {" "}
                · {durationName(finding.curve.duration)} curve
              </span>
            </p>
            <p className="text-ink-muted">
              {finding.message.charAt(0).toUpperCase() + finding.message.slice(1)}.
              {"index" in finding.location
                ? " (Not marked on the chart: it concerns the order in the file.)"
                : ""}
            </p>
          </div>
        </li>
      ))}
    </ol>
  );
}
