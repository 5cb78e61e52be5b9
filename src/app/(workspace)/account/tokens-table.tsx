"use client";

import { useMutation } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { requestJson } from "@/components/api-client";
import { ConfirmStep } from "@/components/confirm-step";
import { actionsColumn, DataTable, dateColumn, textColumn } from "@/components/data-table";
import { DateText } from "@/components/date-text";
import { rowAlert } from "@/components/table";

// The Account page's API tokens: the active ones can be revoked after a confirm step; a revoked one says when.

export interface Token {
  id: string;
  name: string;
  prefix: string;
  /** The workspace it acts in, or null for one the user has left. */
  workspaceName: string | null;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

const columns: ColumnDef<Token>[] = [
  textColumn("name", "Name", (t) => t.name, { className: "font-medium" }),
  textColumn("token", "Token", (t) => <code className="font-mono text-xs">{t.prefix}…</code>, {
    headerClassName: "w-28",
  }),
  textColumn(
    "workspace",
    "Workspace",
    (t) => t.workspaceName ?? <span className="text-ink-faint">a workspace you left</span>,
    { className: "max-w-64 truncate" },
  ),
  dateColumn("created", "Created (UTC)", (t) => t.createdAt),
  textColumn(
    "lastUsed",
    "Last used (UTC)",
    (t) => (t.lastUsedAt ? <DateText value={t.lastUsedAt} withTime /> : "never"),
    {
      numeric: true,
      headerClassName: "w-36",
    },
  ),
  textColumn("status", "Status", (t) => <TokenStatus revoked={Boolean(t.revokedAt)} />, {
    headerClassName: "w-28",
  }),
];

/** Active or revoked, in words beside a filled or hollow dot. */
function TokenStatus({ revoked }: { revoked: boolean }) {
  return (
    <span className="inline-flex items-center gap-1.5 text-xs">
      <span
        aria-hidden="true"
        className={`size-2 rounded-full ${revoked ? "border border-ink-faint" : "bg-accent"}`}
      />
      {revoked ? "Revoked" : "Active"}
    </span>
  );
}

export function TokensTable({ tokens }: { tokens: Token[] }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [confirming, setConfirming] = useState<string | null>(null);
  const revoke = useMutation({
    mutationFn: (id: string) => requestJson("DELETE", `/api/account/tokens/${id}`),
    onSuccess: () => startTransition(() => router.refresh()),
    onSettled: () => setConfirming(null),
  });

  const actions = (token: Token) =>
    token.revokedAt ? (
      <DateText value={token.revokedAt} />
    ) : (
      <ConfirmStep
        verb="Revoke"
        askLabel={`Revoke the token ${token.name}`}
        confirmLabel={`Confirm revoking ${token.name}`}
        confirming={confirming === token.id}
        pending={revoke.isPending || refreshing}
        onAsk={() => setConfirming(token.id)}
        onConfirm={() => revoke.mutate(token.id)}
        onKeep={() => setConfirming(null)}
      />
    );

  return (
    <DataTable
      label="API tokens"
      columns={[...columns, actionsColumn(actions, "w-24")]}
      data={tokens}
      getRowId={(token) => token.id}
      rowProps={(token) => ({ className: `hover:bg-surface ${token.revokedAt ? "text-ink-muted" : ""}` })}
      empty="No tokens yet. Name one above for each bench script that posts to Pulsefence."
      detailClassName="p-0"
      detail={(token) => rowAlert(revoke.variables === token.id && revoke.error)}
    />
  );
}
