/** A part's status as a word and a small shape: draft a dashed ring, verified a ring with a tick. */
export function PartStatus({ status }: { status: "draft" | "verified" }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 text-sm ${status === "verified" ? "text-accent" : "text-ink-muted"}`}
    >
      <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true" fill="none" stroke="currentColor">
        {status === "verified" ? (
          <>
            <circle cx="6" cy="6" r="5" strokeWidth="1.4" />
            <path d="M3.6 6.2l1.7 1.7 3.1-3.4" strokeWidth="1.5" />
          </>
        ) : (
          <circle cx="6" cy="6" r="4.6" strokeWidth="1.3" strokeDasharray="2.2 1.6" />
        )}
      </svg>
      {status}
    </span>
  );
}
