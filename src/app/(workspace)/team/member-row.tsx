"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { DateText } from "@/components/date-text";
import { Button } from "@/components/form";
import { Td, Tr } from "@/components/table";
import type { Role } from "@/db/schema";
import { roleLabels } from "@/lib/auth/permissions";

interface Member {
  userId: string;
  name: string;
  email: string;
  role: Role;
  leadRights: boolean;
  joinedAt: Date;
}

interface Access {
  role: Role;
  leadRights: boolean;
}

interface Saved {
  message: string;
  previous: Access;
}

export function MemberRow({
  member,
  isSelf,
  mayManage,
  roleOptions,
}: {
  member: Member;
  isSelf: boolean;
  mayManage: boolean;
  roleOptions: Role[];
}) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [confirming, setConfirming] = useState(false);
  // A role change waits for confirmation; a saved change says so and can be undone.
  const [proposed, setProposed] = useState<Access | null>(null);
  const [saved, setSaved] = useState<Saved | null>(null);
  const url = `/api/team/members/${member.userId}`;
  const errorId = `member-${member.userId}-error`;
  const current: Access = { role: member.role, leadRights: member.leadRights };

  const changeAccess = useMutation({
    mutationFn: (next: Access & { undo?: boolean }) =>
      sendJson("PATCH", url, { role: next.role, leadRights: next.leadRights }),
    onSuccess: (_data, next) => {
      setProposed(null);
      setSaved(next.undo ? null : { message: describeChange(member.name, current, next), previous: current });
      startTransition(() => {
        // Giving up your own admin role takes the Team page away with it.
        if (isSelf && next.role !== "admin") router.replace("/app");
        router.refresh();
      });
    },
  });
  const remove = useMutation({
    mutationFn: () => sendJson("DELETE", url),
    onSuccess: () => startTransition(() => router.refresh()),
  });
  const failed = changeAccess.error ?? remove.error;
  const options = roleOptions.includes(member.role) ? roleOptions : [member.role, ...roleOptions];
  const busy = changeAccess.isPending || refreshing;
  const cols = mayManage ? 5 : 4;

  return (
    <>
      <Tr>
        <Td className="font-medium">
          {member.name}
          {isSelf ? <span className="ml-1.5 text-xs font-normal text-ink-faint">(you)</span> : null}
        </Td>
        <Td className="text-ink-muted">{member.email}</Td>
        <Td>
          {mayManage ? (
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <select
                aria-label={`Role of ${member.name}`}
                aria-describedby={failed ? errorId : undefined}
                aria-invalid={changeAccess.isError || undefined}
                value={proposed?.role ?? member.role}
                disabled={busy}
                onChange={(event) => {
                  remove.reset();
                  changeAccess.reset();
                  setSaved(null);
                  const role = event.target.value as Role;
                  setProposed(role === member.role ? null : { role, leadRights: member.leadRights });
                }}
                className="h-7 min-w-28 rounded border border-line bg-panel px-1.5 text-sm hover:border-line-strong disabled:opacity-60 max-md:min-h-11 pointer-coarse:min-h-11"
              >
                {options.map((role) => (
                  <option key={role} value={role}>
                    {roleLabels[role]}
                  </option>
                ))}
              </select>
              {member.role === "lead" ? null : (
                <label className="inline-flex items-center gap-1.5 text-xs text-ink-muted max-md:min-h-11 pointer-coarse:min-h-11">
                  <input
                    type="checkbox"
                    checked={member.leadRights}
                    disabled={busy}
                    onChange={(event) => {
                      remove.reset();
                      setSaved(null);
                      setProposed(null);
                      changeAccess.mutate({ role: member.role, leadRights: event.target.checked });
                    }}
                    className="size-4 accent-[var(--color-accent)]"
                  />
                  Lead rights
                </label>
              )}
            </div>
          ) : (
            <>
              {roleLabels[member.role]}
              {member.leadRights && member.role !== "lead" ? (
                <span className="ml-1.5 text-xs text-ink-muted">with lead rights</span>
              ) : null}
            </>
          )}
        </Td>
        <Td numeric>
          <DateText value={member.joinedAt} />
        </Td>
        {mayManage ? (
          <Td className="text-right whitespace-nowrap">
            {isSelf ? null : confirming ? (
              <span className="inline-flex items-center gap-1.5">
                <span className="text-xs text-ink-muted">Remove?</span>
                <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
                  Keep
                </Button>
                <Button
                  size="sm"
                  variant="danger"
                  pending={remove.isPending || refreshing}
                  onClick={() => {
                    changeAccess.reset();
                    remove.mutate(undefined, { onSettled: () => setConfirming(false) });
                  }}
                  aria-label={`Confirm removing ${member.name}`}
                >
                  Remove
                </Button>
              </span>
            ) : (
              <Button
                size="sm"
                variant="quiet"
                onClick={() => setConfirming(true)}
                aria-label={`Remove ${member.name} from the workspace`}
              >
                Remove…
              </Button>
            )}
          </Td>
        ) : null}
      </Tr>
      {proposed ? (
        <tr>
          <td colSpan={cols} className="border-b border-line bg-accent-soft px-3 py-2">
            <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
              <p>
                Change {member.name} from {roleLabels[member.role].toLowerCase()} to{" "}
                <span className="font-medium">{roleLabels[proposed.role].toLowerCase()}</span>?
                {isSelf && proposed.role !== "admin" ? " You will no longer manage this team." : ""}
              </p>
              <span className="flex gap-2">
                <Button size="sm" variant="quiet" onClick={() => setProposed(null)} disabled={busy}>
                  Cancel
                </Button>
                <Button
                  size="sm"
                  variant="primary"
                  pending={busy}
                  onClick={() => changeAccess.mutate(proposed)}
                >
                  Change role
                </Button>
              </span>
            </div>
          </td>
        </tr>
      ) : null}
      {saved && !failed ? (
        <tr>
          <td colSpan={cols} className="border-b border-line bg-sunken px-3 py-1.5">
            <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
              <p role="status">Saved: {saved.message}</p>
              <Button
                size="sm"
                variant="quiet"
                pending={busy}
                onClick={() => changeAccess.mutate({ ...saved.previous, undo: true })}
              >
                Undo
              </Button>
            </div>
          </td>
        </tr>
      ) : null}
      {failed ? (
        <tr>
          <td colSpan={cols} className="border-b border-line bg-sunken px-3 py-1.5">
            <p id={errorId} role="alert" className="text-xs text-fail">
              {messageOf(failed)}
            </p>
          </td>
        </tr>
      ) : null}
    </>
  );
}

/** What a saved change did, in words. */
function describeChange(name: string, before: Access, after: Access): string {
  const parts: string[] = [];
  if (before.role !== after.role) parts.push(`${name} is now ${roleLabels[after.role].toLowerCase()}`);
  if (before.leadRights !== after.leadRights)
    parts.push(after.leadRights ? `${name} holds lead rights` : `${name} no longer holds lead rights`);
  return `${parts.join("; ") || "nothing changed"}.`;
}
