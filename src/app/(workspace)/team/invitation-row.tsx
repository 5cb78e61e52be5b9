"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { DateText } from "@/components/date-text";
import { Button } from "@/components/form";
import { Td, Tr } from "@/components/table";
import type { Role } from "@/db/schema";
import { roleLabels } from "@/lib/auth/permissions";

interface Invitation {
  id: string;
  email: string;
  role: Role;
  invitedBy: string | null;
  createdAt: Date;
  expiresAt: Date;
}

export function InvitationRow({ invitation }: { invitation: Invitation }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const url = `/api/team/invitations/${invitation.id}`;
  const refresh = () => startTransition(() => router.refresh());
  const resend = useMutation({ mutationFn: () => sendJson("POST", `${url}/resend`), onSuccess: refresh });
  const revoke = useMutation({ mutationFn: () => sendJson("DELETE", url), onSuccess: refresh });
  const failed = resend.error ?? revoke.error;
  const busy = resend.isPending || revoke.isPending || refreshing;

  return (
    <>
      <Tr>
        <Td className="font-medium">{invitation.email}</Td>
        <Td>{roleLabels[invitation.role]}</Td>
        <Td className="max-w-48 truncate text-ink-muted">{invitation.invitedBy ?? "—"}</Td>
        <Td numeric>
          <DateText value={invitation.createdAt} />
        </Td>
        <Td numeric>
          <DateText value={invitation.expiresAt} />
        </Td>
        <Td className="text-right whitespace-nowrap">
          <span className="inline-flex items-center gap-1">
            <Button
              size="sm"
              variant="quiet"
              pending={busy}
              onClick={() => {
                revoke.reset();
                resend.mutate();
              }}
              aria-label={`Resend the invitation to ${invitation.email}`}
            >
              {resend.isPending ? "Sending…" : "Resend"}
            </Button>
            <Button
              size="sm"
              variant="quiet"
              pending={busy}
              onClick={() => {
                resend.reset();
                revoke.mutate();
              }}
              aria-label={`Revoke the invitation to ${invitation.email}`}
            >
              {revoke.isPending ? "Revoking…" : "Revoke"}
            </Button>
          </span>
        </Td>
      </Tr>
      {failed ? (
        <tr>
          <td colSpan={6} className="border-b border-line bg-sunken px-3 py-1.5">
            <p role="alert" className="text-xs text-fail">
              {messageOf(failed)}
            </p>
          </td>
        </tr>
      ) : null}
    </>
  );
}
