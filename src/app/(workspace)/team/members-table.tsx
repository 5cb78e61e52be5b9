"use client";

import type { ColumnDef } from "@tanstack/react-table";
import type { ReactNode } from "react";
import { ConfirmStep } from "@/components/confirm-step";
import { actionsColumn, DataTable, dateColumn, textColumn } from "@/components/data-table";
import { rowAlert } from "@/components/table";
import type { Role } from "@/db/schema";
import { can } from "@/lib/auth/permissions";
import { accessOf, type Member, type MemberChanges, useMemberChanges } from "./member-changes";
import { ProposedChange, RoleControls, RoleText, SavedChange } from "./member-row-parts";

// The Team page's members. An admin changes a role in its column (confirmed under the row, then saved with an
// undo), grants lead rights, and removes a member after a confirm step; the row's state lives in useMemberChanges.

const errorIdOf = (m: Member) => `member-${m.userId}-error`;

export function MembersTable({
  members,
  selfId,
  mayManage,
  roleOptions,
}: {
  members: Member[];
  selfId: string;
  mayManage: boolean;
  roleOptions: Role[];
}) {
  const changes = useMemberChanges(selfId);
  return (
    <DataTable
      label="Members"
      columns={memberColumns({ changes, selfId, mayManage, roleOptions })}
      data={members}
      getRowId={(m) => m.userId}
      detailClassName="p-0"
      detail={(m) => memberNotes(m, selfId, changes)}
    />
  );
}

function memberColumns({
  changes,
  selfId,
  mayManage,
  roleOptions,
}: {
  changes: MemberChanges;
  selfId: string;
  mayManage: boolean;
  roleOptions: Role[];
}): ColumnDef<Member>[] {
  const columns: ColumnDef<Member>[] = [
    {
      id: "name",
      header: "Name",
      cell: ({ row: { original: m } }) => (
        <>
          {m.name}
          {m.userId === selfId ? (
            <span className="ml-1.5 text-xs font-normal text-ink-faint">(you)</span>
          ) : null}
        </>
      ),
      meta: { className: "font-medium", headerClassName: "" },
    },
    textColumn("email", "E-mail", (m) => m.email, { className: "text-ink-muted" }),
    {
      id: "role",
      header: "Role",
      cell: ({ row: { original: m } }) =>
        mayManage ? (
          <RoleControls
            name={m.name}
            access={accessOf(m)}
            options={roleOptions.includes(m.role) ? roleOptions : [m.role, ...roleOptions]}
            proposedRole={changes.proposalOn(m)?.role}
            busy={changes.busyOn(m)}
            invalid={changes.changeFailedOn(m)}
            errorId={changes.failedOn(m) ? errorIdOf(m) : undefined}
            onPropose={(role) => changes.propose(m, role)}
            onLeadRights={(leadRights) => changes.setLeadRights(m, leadRights)}
          />
        ) : (
          <RoleText access={accessOf(m)} />
        ),
      meta: { headerClassName: "w-40" },
    },
    dateColumn("joined", "Joined (UTC)", (m) => m.joinedAt),
  ];
  if (!mayManage) return columns;
  const remove = (m: Member) =>
    m.userId === selfId ? null : (
      <ConfirmStep
        verb="Remove"
        prompt="Remove?"
        askLabel={`Remove ${m.name} from the workspace`}
        confirmLabel={`Confirm removing ${m.name}`}
        confirming={changes.confirmingOn(m)}
        pending={changes.removing}
        onAsk={() => changes.askRemove(m)}
        onConfirm={() => changes.remove(m)}
        onKeep={changes.keep}
      />
    );
  return [...columns, actionsColumn(remove, "w-56")];
}

/** Under a member's row: the role change to confirm, the saved change with its undo, what failed; or nothing. */
function memberNotes(m: Member, selfId: string, changes: MemberChanges): ReactNode {
  const proposal = changes.proposalOn(m);
  const failed = changes.failedOn(m);
  const saved = failed ? null : changes.savedOn(m);
  if (!proposal && !saved && !failed) return null;
  const busy = changes.busyOn(m);
  return (
    <div className="divide-y divide-line">
      {proposal ? (
        <ProposedChange
          name={m.name}
          from={m.role}
          to={proposal.role}
          losesManagement={m.userId === selfId && !can(proposal.role, "member.manage", proposal.leadRights)}
          busy={busy}
          onCancel={changes.cancel}
          onConfirm={() => changes.confirm(m, proposal)}
        />
      ) : null}
      {saved ? (
        <SavedChange message={saved.message} busy={busy} onUndo={() => changes.undo(m, saved.previous)} />
      ) : null}
      {rowAlert(failed, errorIdOf(m))}
    </div>
  );
}
