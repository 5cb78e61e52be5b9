/** The Pulsefence wordmark: a pulse held under a limit line, and the name. */
export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 text-base font-semibold tracking-tight ${className}`}>
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true" className="shrink-0">
        <path d="M1.5 3.5h6l9 9" fill="none" stroke="var(--color-accent)" strokeWidth="1.6" />
        <path d="M1.5 15.5h3v-6h3v6h9" fill="none" stroke="var(--color-ink)" strokeWidth="1.6" />
      </svg>
      <span>
        Pulse<span className="text-accent">fence</span>
      </span>
    </span>
  );
}
