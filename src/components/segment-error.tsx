"use client";

import { useEffect } from "react";

export interface SegmentErrorProps {
  error: Error & { digest?: string };
  reset: () => void;
}

/**
 * What a page shows when it failed on the server or in the browser: what could not be shown, a way to try again, and
 * the error's reference for the server log (never the message or stack, which may hold internals).
 */
export function SegmentError({ error, reset, what }: SegmentErrorProps & { what: string }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div role="alert" className="mx-auto max-w-xl py-16 text-center">
      <h1 className="text-xl font-semibold">{`${what[0].toUpperCase()}${what.slice(1)} could not be shown`}</h1>
      <p className="mt-3 text-sm text-ink-muted">
        Something went wrong on our side; nothing you entered was lost. Try again, and if it keeps failing,
        give the reference below to whoever runs Pulsefence.
      </p>
      {error.digest ? (
        <p className="mt-2 font-mono text-xs text-ink-faint">Reference: {error.digest}</p>
      ) : null}
      <button
        type="button"
        onClick={reset}
        className="mt-6 rounded-md border border-line bg-panel px-4 py-2 text-sm hover:bg-sunken"
      >
        Try again
      </button>
    </div>
  );
}
