import type { CheckedCandidate } from "./types";

/**
 * The library status of every candidate, and, when some are unverified drafts, the warning and (if the chosen
 * one is a draft) the box the lead ticks to sign anyway.
 */
export function CandidateLibraryStatus({
  candidates,
  chosenDraft,
  acknowledged,
  onAcknowledge,
}: {
  candidates: CheckedCandidate[];
  chosenDraft: boolean;
  acknowledged: boolean;
  onAcknowledge: (acknowledged: boolean) => void;
}) {
  const drafts = candidates.filter((c) => c.status !== "verified");
  return (
    <div className="mt-4 text-sm">
      <h3 className="text-xs font-medium text-ink-muted">Library status of the candidates</h3>
      <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1" data-testid="candidate-library-status">
        {candidates.map((c) => (
          <li key={c.partId}>
            <span className="font-medium">{c.partNumber}</span>{" "}
            {c.status === "verified" ? (
              <span className="text-ink-muted">
                verified{c.verifiedByName ? ` by ${c.verifiedByName}` : ""}
              </span>
            ) : (
              <span className="text-marginal">draft, unverified</span>
            )}
          </li>
        ))}
      </ul>
      {drafts.length > 0 ? (
        <div
          role="note"
          className="mt-3 rounded-md border border-line border-l-2 border-l-marginal bg-sunken px-3 py-2"
        >
          <p>
            {drafts.length === candidates.length
              ? "Every candidate is still an unverified library draft"
              : `${drafts.map((c) => c.partNumber).join(", ")} ${drafts.length === 1 ? "is" : "are"} still unverified library ${drafts.length === 1 ? "draft" : "drafts"}`}
            : no one has checked {drafts.length === 1 ? "its" : "their"} curves against the datasheet a second
            time. The record and the PDF will say so. Verify the parts in the library first, or sign
            knowingly.
          </p>
          {chosenDraft ? (
            <label className="mt-2 flex items-center gap-2 max-md:min-h-11">
              <input
                type="checkbox"
                checked={acknowledged}
                onChange={(e) => onAcknowledge(e.target.checked)}
                className="size-4 accent-[var(--color-accent)]"
              />
              I sign on an unverified part knowingly
            </label>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
