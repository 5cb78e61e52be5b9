"use client";

import type { ReactNode } from "react";
import { Button } from "@/components/form";

/**
 * A row's delete action in two steps: "Delete" asks, then "Delete" / "Keep" decide. Other row actions (`before`)
 * stand beside the first button and step aside while the row asks.
 */
export function ConfirmDelete({
  label,
  confirming,
  pending,
  onAsk,
  onConfirm,
  onKeep,
  before,
  className = "",
}: {
  /** What is deleted, for the button's accessible name ("Delete P3"). */
  label: string;
  confirming: boolean;
  pending: boolean;
  onAsk: () => void;
  onConfirm: () => void;
  onKeep: () => void;
  before?: ReactNode;
  className?: string;
}) {
  if (confirming) {
    return (
      <span className="inline-flex items-center gap-1">
        <Button size="sm" variant="danger" pending={pending} onClick={onConfirm}>
          Delete
        </Button>
        <Button size="sm" variant="quiet" onClick={onKeep}>
          Keep
        </Button>
      </span>
    );
  }
  return (
    <span className={`inline-flex items-center gap-1 ${className}`}>
      {before}
      <Button size="sm" variant="quiet" aria-label={`Delete ${label}`} onClick={onAsk}>
        Delete
      </Button>
    </span>
  );
}
