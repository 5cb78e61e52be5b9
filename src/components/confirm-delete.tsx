"use client";

import { useMutation } from "@tanstack/react-query";
import { type ReactNode, useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";

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

/**
 * A table's row deletes: which row is asking, the DELETE request to `path(id)`, then `refresh` (what showed the
 * row). `action` is a row's ConfirmDelete; `failure` the form message to show under the table.
 */
export function useRowDelete(path: (id: string) => string, refresh: () => Promise<unknown>) {
  const [confirming, setConfirming] = useState<string | null>(null);
  const remove = useMutation({
    mutationFn: (id: string) => requestJson("DELETE", path(id)),
    onSuccess: async () => {
      setConfirming(null);
      await refresh();
    },
  });
  const action = (id: string, label: string, before?: ReactNode) => (
    <ConfirmDelete
      label={label}
      confirming={confirming === id}
      pending={remove.isPending}
      onAsk={() => setConfirming(id)}
      onConfirm={() => remove.mutate(id)}
      onKeep={() => setConfirming(null)}
      before={before}
    />
  );
  const failure = remove.isError ? <FormMessage tone="error">{messageOf(remove.error)}</FormMessage> : null;
  return { action, failure };
}
