/** The small arrow before a row's name that opens what is under it: pointing right, turned down when open. */
export function DisclosureChevron({ open }: { open: boolean }) {
  return (
    <svg
      width="10"
      height="10"
      viewBox="0 0 10 10"
      aria-hidden="true"
      className={`shrink-0 text-ink-faint transition-transform ${open ? "rotate-90" : ""}`}
    >
      <path d="M3 1.5 6.5 5 3 8.5" fill="none" stroke="currentColor" strokeWidth="1.4" />
    </svg>
  );
}
