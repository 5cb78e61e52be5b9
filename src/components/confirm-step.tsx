"use client";

import { Button } from "@/components/form";

/**
 * A row action that asks first: "Remove…" opens "Keep" / "Remove" in place. The labels name what is acted on for
 * screen readers ("Remove Ada from the workspace", "Confirm removing Ada").
 */
export function ConfirmStep({
  confirming,
  pending,
  onAsk,
  onConfirm,
  onKeep,
  verb,
  askLabel,
  confirmLabel,
  prompt,
}: {
  confirming: boolean;
  pending: boolean;
  onAsk: () => void;
  onConfirm: () => void;
  onKeep: () => void;
  /** The action's word on its buttons: "Remove", "Revoke". */
  verb: string;
  askLabel: string;
  confirmLabel: string;
  /** A short question shown beside the buttons while asking. */
  prompt?: string;
}) {
  if (!confirming) {
    return (
      <Button size="sm" variant="quiet" onClick={onAsk} aria-label={askLabel}>
        {verb}…
      </Button>
    );
  }
  return (
    <span className={`inline-flex items-center ${prompt ? "gap-1.5" : "gap-1"}`}>
      {prompt ? <span className="text-xs text-ink-muted">{prompt}</span> : null}
      <Button size="sm" variant="quiet" onClick={onKeep}>
        Keep
      </Button>
      <Button size="sm" variant="danger" pending={pending} onClick={onConfirm} aria-label={confirmLabel}>
        {verb}
      </Button>
    </span>
  );
}
