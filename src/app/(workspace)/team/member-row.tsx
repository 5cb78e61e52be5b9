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
  joinedAt: Date;
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
  const url = `/api/team/members/${member.userId}`;
  const errorId = `member-${member.userId}-error`;

  const changeRole = useMutation({
    mutationFn: (role: Role) => sendJson("PATCH", url, { role }),
    onSuccess: (_data, role) =>
      startTransition(() => {
        // Giving up your own admin role takes the Team page away with it.
        if (isSelf && role !== "admin") router.replace("/app");
        router.refresh();
      }),
  });
  const remove = useMutation({
    mutationFn: () => sendJson("DELETE", url),
    onSuccess: () => startTransition(() => router.refresh()),
  });
  const failed = changeRole.error ?? remove.error;
  const options = roleOptions.includes(member.role) ? roleOptions : [member.role, ...roleOptions];
  const shownRole =
    (changeRole.isPending || refreshing) && changeRole.variables ? changeRole.variables : member.role;

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
            <select
              aria-label={`Role of ${member.name}`}
              aria-describedby={failed ? errorId : undefined}
              aria-invalid={changeRole.isError || undefined}
              value={shownRole}
              disabled={changeRole.isPending || refreshing}
              onChange={(event) => {
                remove.reset();
                changeRole.mutate(event.target.value as Role);
              }}
              className="h-7 w-full rounded border border-line bg-panel px-1.5 text-sm hover:border-line-strong disabled:opacity-60"
            >
              {options.map((role) => (
                <option key={role} value={role}>
                  {roleLabels[role]}
                </option>
              ))}
            </select>
          ) : (
            roleLabels[member.role]
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
                    changeRole.reset();
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
      {failed ? (
        <tr>
          <td colSpan={mayManage ? 5 : 4} className="border-b border-line bg-sunken px-3 py-1.5">
            <p id={errorId} role="alert" className="text-xs text-fail">
              {messageOf(failed)}
            </p>
          </td>
        </tr>
      ) : null}
    </>
  );
}
