import { factor, percent, q } from "@/lib/format";
import { explainFlag, VERDICT_EXPLANATIONS } from "@/lib/soa/explain";
import { shapeWords, sourceWords } from "@/lib/vocabulary";
import { readWidth } from "./format";
import type { CellRef } from "./matrix-table";
import type { MatrixData } from "./types";
import { VerdictMark } from "./verdict-mark";

/** The details of the matrix cell picked, under the matrix; nothing while none is. */
export function SelectedCellDetails({
  data,
  selected,
  onClose,
}: {
  data: MatrixData;
  selected: CellRef | null;
  onClose: () => void;
}) {
  if (!selected) return null;
  return (
    <div className="mt-3">
      <CellDetails data={data} partId={selected.partId} pulseId={selected.pulseId} onClose={onClose} />
    </div>
  );
}

/** How one cell of the matrix was found: the figures behind the verdict and the words for each flag. */
export function CellDetails({
  data,
  partId,
  pulseId,
  onClose,
}: {
  data: MatrixData;
  partId: string;
  pulseId: string;
  onClose: () => void;
}) {
  const candidate = data.candidates.find((c) => c.partId === partId);
  const pulse = data.pulses.find((p) => p.id === pulseId);
  if (!candidate || !pulse) return null;
  const result = data.results[partId]?.[pulseId];
  const verdict = result?.verdict ?? "no-data";
  const width = readWidth(pulse);
  const figures: [string, string][] = [
    [
      "Pulse",
      [
        sourceWords[pulse.source],
        shapeWords[pulse.kind],
        q(pulse.v, "V"),
        q(pulse.i, "A"),
        q(pulse.duration, "s"),
        pulse.repeat
          ? `every ${q(pulse.repeat.period, "s")}${pulse.repeat.count ? `, ${pulse.repeat.count} pulses` : ", continuous"}`
          : "single pulse",
      ].join(", "),
    ],
    ["Read on the curves at", width === null ? "—" : `${q(width, "s")} and ${q(pulse.caseTemp, "°C")} case`],
    ["Allowed current", q(result?.allowedCurrent, "A")],
    ["Utilisation", percent(result?.utilisation)],
    ["Peak junction temperature", result?.tjPeak != null ? q(result.tjPeak, "°C") : "— (no thermal model)"],
    ["Derating factor", result ? `×${factor(result.derating)}` : "—"],
    [
      "Stability factor",
      result?.stability != null
        ? `S = ${factor(result.stability)}, ${result.stabilityVerdict === "fail" ? "runs away (S ≥ 1)" : (result.stabilityVerdict ?? "")}`
        : "— (no transfer characteristics or thermal model)",
    ],
  ];
  return (
    <section
      aria-labelledby="cell-details-title"
      className="rounded-md border border-line bg-panel p-4"
      data-testid="cell-details"
    >
      <div className="flex items-start justify-between gap-4">
        <h3 id="cell-details-title" className="text-sm font-semibold">
          {candidate.partNumber} <span className="font-normal text-ink-muted">×</span> {pulse.name}
          <span className="ml-3 text-sm">{VerdictMark({ verdict })}</span>
        </h3>
        <button type="button" onClick={onClose} className="text-sm text-ink-muted hover:text-ink">
          Close
        </button>
      </div>
      <dl className="mt-3 grid gap-x-6 gap-y-1.5 text-sm sm:grid-cols-[max-content_1fr]">
        {figures.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-ink-muted">{label}</dt>
            <dd className="font-mono text-xs leading-5 num">{value}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3 text-sm">
        {result
          ? VERDICT_EXPLANATIONS[verdict]
          : "The part has no SOA curves yet, so no verdict can be given."}
      </p>
      {result?.flags.length ? (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-muted">
          {result.flags.map((flag) => (
            <li key={flag}>{explainFlag(flag)}</li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
