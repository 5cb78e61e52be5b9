"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { ConfirmStep } from "@/components/confirm-step";
import { DateText } from "@/components/date-text";
import { Td, Tr } from "@/components/table";

interface Token {
  id: string;
  name: string;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

export function TokenRow({ token, workspaceName }: { token: Token; workspaceName: string | null }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [confirming, setConfirming] = useState(false);
  const revoke = useMutation({
    mutationFn: () => sendJson("DELETE", `/api/account/tokens/${token.id}`),
    onSuccess: () => startTransition(() => router.refresh()),
    onSettled: () => setConfirming(false),
  });

  return (
    <>
      <Tr className={token.revokedAt ? "text-ink-muted" : ""}>
        <Td className="font-medium">{token.name}</Td>
        <Td>
          <code className="font-mono text-xs">{token.prefix}…</code>
        </Td>
        <Td className="max-w-64 truncate">
          {workspaceName ?? <span className="text-ink-faint">a workspace you left</span>}
        </Td>
        <Td numeric>
          <DateText value={token.createdAt} />
        </Td>
        <Td numeric>{token.lastUsedAt ? <DateText value={token.lastUsedAt} withTime /> : "never"}</Td>
        <Td>
          {token.revokedAt ? (
            <span className="inline-flex items-center gap-1.5 text-xs">
              <span aria-hidden="true" className="size-2 rounded-full border border-ink-faint" />
              Revoked
            </span>
          ) : (
            <span className="inline-flex items-center gap-1.5 text-xs">
              <span aria-hidden="true" className="size-2 rounded-full bg-accent" />
              Active
            </span>
          )}
        </Td>
        <Td className="text-right whitespace-nowrap">
          {token.revokedAt ? (
            <DateText value={token.revokedAt} />
          ) : (
            <ConfirmStep
              verb="Revoke"
              askLabel={`Revoke the token ${token.name}`}
              confirmLabel={`Confirm revoking ${token.name}`}
              confirming={confirming}
              pending={revoke.isPending || refreshing}
              onAsk={() => setConfirming(true)}
              onConfirm={() => revoke.mutate()}
              onKeep={() => setConfirming(false)}
            />
          )}
        </Td>
      </Tr>
      {revoke.isError ? (
        <tr>
          <td colSpan={7} className="border-b border-line bg-sunken px-3 py-1.5">
            <p role="alert" className="text-xs text-fail">
              {messageOf(revoke.error)}
            </p>
          </td>
        </tr>
      ) : null}
    </>
  );
}
