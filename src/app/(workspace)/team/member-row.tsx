"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { ConfirmStep } from "@/components/confirm-step";
import { DateText } from "@/components/date-text";
import { Button } from "@/components/form";
import { Td, Tr } from "@/components/table";
import type { Role } from "@/db/schema";
import {
  type Access,
  describeChange,
  ProposedChange,
  RoleControls,
  RoleText,
  UnderRow,
} from "./member-row-parts";

interface Member {
  userId: string;
  name: string;
  email: string;
  role: Role;
  leadRights: boolean;
  joinedAt: Date;
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
            <RoleControls
              name={member.name}
              access={current}
              options={options}
              proposedRole={proposed?.role}
              busy={busy}
              invalid={changeAccess.isError}
              errorId={failed ? errorId : undefined}
              onPropose={(role) => {
                remove.reset();
                changeAccess.reset();
                setSaved(null);
                setProposed(role === member.role ? null : { role, leadRights: member.leadRights });
              }}
              onLeadRights={(leadRights) => {
                remove.reset();
                setSaved(null);
                setProposed(null);
                changeAccess.mutate({ role: member.role, leadRights });
              }}
            />
          ) : (
            <RoleText access={current} />
          )}
        </Td>
        <Td numeric>
          <DateText value={member.joinedAt} />
        </Td>
        {mayManage ? (
          <Td className="text-right whitespace-nowrap">
            {isSelf ? null : (
              <ConfirmStep
                verb="Remove"
                prompt="Remove?"
                askLabel={`Remove ${member.name} from the workspace`}
                confirmLabel={`Confirm removing ${member.name}`}
                confirming={confirming}
                pending={remove.isPending || refreshing}
                onAsk={() => setConfirming(true)}
                onConfirm={() => {
                  changeAccess.reset();
                  remove.mutate(undefined, { onSettled: () => setConfirming(false) });
                }}
                onKeep={() => setConfirming(false)}
              />
            )}
          </Td>
        ) : null}
      </Tr>
      {proposed ? (
        <UnderRow cols={cols} className="bg-accent-soft px-3 py-2">
          <ProposedChange
            name={member.name}
            from={member.role}
            to={proposed.role}
            leavesTeam={isSelf && proposed.role !== "admin"}
            busy={busy}
            onCancel={() => setProposed(null)}
            onConfirm={() => changeAccess.mutate(proposed)}
          />
        </UnderRow>
      ) : null}
      {saved && !failed ? (
        <UnderRow cols={cols} className="bg-sunken px-3 py-1.5">
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
        </UnderRow>
      ) : null}
      {failed ? (
        <UnderRow cols={cols} className="bg-sunken px-3 py-1.5">
          <p id={errorId} role="alert" className="text-xs text-fail">
            {messageOf(failed)}
          </p>
        </UnderRow>
      ) : null}
    </>
  );
}
