"use client";

import { useMutation } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { requestJson } from "@/components/api-client";
import { actionsColumn, DataTable, dateColumn, textColumn } from "@/components/data-table";
import { Button } from "@/components/form";
import { rowAlert } from "@/components/table";
import type { Role } from "@/db/schema";
import { roleLabels } from "@/lib/auth/permissions";

// The Team page's pending invitations: each can be resent (a new link) or revoked; a failure is said under its row.

export interface Invitation {
  id: string;
  email: string;
  role: Role;
  invitedBy: string | null;
  createdAt: Date;
  expiresAt: Date;
}

const columns: ColumnDef<Invitation>[] = [
  textColumn("email", "E-mail", (i) => i.email, { className: "font-medium" }),
  textColumn("role", "Role", (i) => roleLabels[i.role], { headerClassName: "w-40" }),
  textColumn("invitedBy", "Invited by", (i) => i.invitedBy ?? "—", {
    className: "max-w-48 truncate text-ink-muted",
    headerClassName: "w-48",
  }),
  dateColumn("sent", "Sent (UTC)", (i) => i.createdAt),
  dateColumn("expires", "Expires (UTC)", (i) => i.expiresAt),
];

export function InvitationsTable({ invitations }: { invitations: Invitation[] }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const urlOf = (id: string) => `/api/team/invitations/${id}`;
  const refresh = () => startTransition(() => router.refresh());
  const resend = useMutation({
    mutationFn: (id: string) => requestJson("POST", `${urlOf(id)}/resend`),
    onSuccess: refresh,
  });
  const revoke = useMutation({
    mutationFn: (id: string) => requestJson("DELETE", urlOf(id)),
    onSuccess: refresh,
  });
  // Only one of the two holds a row at a time: each action clears the other.
  const actingOn = resend.variables ?? revoke.variables;
  const busyOn = (id: string) => actingOn === id && (resend.isPending || revoke.isPending || refreshing);
  const failedOn = (id: string) => (actingOn === id ? (resend.error ?? revoke.error) : null);

  const actions = (invitation: Invitation) => (
    <span className="inline-flex items-center gap-1">
      {[
        { verb: "Resend", doing: "Sending…", action: resend, other: revoke },
        { verb: "Revoke", doing: "Revoking…", action: revoke, other: resend },
      ].map(({ verb, doing, action, other }) => (
        <Button
          key={verb}
          size="sm"
          variant="quiet"
          pending={busyOn(invitation.id)}
          onClick={() => {
            other.reset();
            action.mutate(invitation.id);
          }}
          aria-label={`${verb} the invitation to ${invitation.email}`}
        >
          {action.isPending && actingOn === invitation.id ? doing : verb}
        </Button>
      ))}
    </span>
  );

  return (
    <DataTable
      label="Pending invitations"
      columns={[...columns, actionsColumn(actions, "w-44")]}
      data={invitations}
      getRowId={(invitation) => invitation.id}
      empty="No pending invitations. Invite someone with the form above."
      detailClassName="p-0"
      detail={(invitation) => rowAlert(failedOn(invitation.id))}
    />
  );
}
