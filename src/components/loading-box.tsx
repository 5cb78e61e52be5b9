import type { ReactNode } from "react";

/** A placeholder while data loads that says, in words, what is loading (never a blank box). */
export function LoadingBox({ className = "", children }: { className?: string; children: ReactNode }) {
  return (
    <div
      role="status"
      aria-busy="true"
      className={`flex items-center justify-center rounded-md border border-line bg-panel px-4 text-sm text-ink-muted ${className}`}
    >
      <span
        aria-hidden="true"
        className="mr-2 size-2 shrink-0 rounded-full bg-accent motion-safe:animate-pulse"
      />
      <span>{children}</span>
    </div>
  );
}
