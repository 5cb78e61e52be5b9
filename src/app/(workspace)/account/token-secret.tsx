"use client";

import { useState } from "react";
import { Button } from "@/components/form";

/** A new token's secret, shown this once; the server keeps only its hash. */
export function TokenSecret({
  token,
  onDone,
}: {
  token: { name: string; secret: string };
  onDone: () => void;
}) {
  const [copied, setCopied] = useState<"yes" | "failed" | null>(null);

  async function copy() {
    try {
      await navigator.clipboard.writeText(token.secret);
      setCopied("yes");
    } catch {
      setCopied("failed");
    }
  }

  return (
    <section
      aria-labelledby="token-secret-title"
      className="rounded-md border border-line border-l-2 border-l-marginal bg-panel p-4"
    >
      <h3 id="token-secret-title" className="text-sm font-semibold">
        Copy the token “{token.name}” now
      </h3>
      <p id="token-secret-warning" className="mt-1 text-sm text-ink-muted">
        This is the only time it is shown: Pulsefence keeps just a fingerprint of it. Store it where the bench
        script reads its secrets. If it is lost, revoke it and create another.
      </p>
      <div className="mt-3 flex items-center gap-2">
        <input
          readOnly
          value={token.secret}
          aria-label={`Secret of the token ${token.name}`}
          aria-describedby="token-secret-warning"
          data-testid="token-secret"
          onFocus={(event) => event.currentTarget.select()}
          className="h-9 min-w-0 flex-1 rounded-md border border-line-strong bg-sunken px-2.5 font-mono text-xs text-ink"
        />
        <Button onClick={copy}>{copied === "yes" ? "Copied" : "Copy"}</Button>
      </div>
      <p className="mt-2 text-xs text-ink-muted">
        The script sends it in the header{" "}
        <code className="font-mono text-ink">Authorization: Bearer {token.secret.slice(0, 9)}…</code>
      </p>
      {copied === "failed" ? (
        <p role="alert" className="mt-2 text-xs text-fail">
          The browser did not allow copying. Select the text in the box and copy it by hand.
        </p>
      ) : null}
      <div className="mt-3 flex justify-end">
        <Button variant="secondary" onClick={onDone}>
          I have stored it
        </Button>
      </div>
    </section>
  );
}
