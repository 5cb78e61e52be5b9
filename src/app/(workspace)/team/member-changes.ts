"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { requestJson } from "@/components/api-client";
import type { Role } from "@/db/schema";
import type { CachedMember } from "@/lib/auth/auth-cache";
import { can } from "@/lib/auth/permissions";
import { type Access, describeChange } from "./member-row-parts";

// The members table's row state, lifted out of its rows: a role change waits for confirmation, a saved change says
// so and can be undone, a removal asks first, and a failure is said under its row. One row at a time asks, saves
// or fails; starting on another row clears the last one's.

/** A row of the members table: a workspace's member as pages list them. */
export type Member = CachedMember;

interface AccessChange {
  member: Member;
  next: Access;
  undo?: boolean;
}

export const accessOf = (m: Member): Access => ({ role: m.role, leadRights: m.leadRights });
const urlOf = (m: Member) => `/api/team/members/${m.userId}`;

export type MemberChanges = ReturnType<typeof useMemberChanges>;

export function useMemberChanges(selfId: string) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [confirming, setConfirming] = useState<string | null>(null);
  const [proposed, setProposed] = useState<{ userId: string; next: Access } | null>(null);
  const [saved, setSaved] = useState<{ userId: string; message: string; previous: Access } | null>(null);

  const changeAccess = useMutation({
    mutationFn: ({ member, next }: AccessChange) =>
      requestJson("PATCH", urlOf(member), { role: next.role, leadRights: next.leadRights }),
    onSuccess: (_data, { member, next, undo }) => {
      const current = accessOf(member);
      setProposed(null);
      setSaved(
        undo
          ? null
          : { userId: member.userId, message: describeChange(member.name, current, next), previous: current },
      );
      startTransition(() => {
        // Giving up your own right to invite takes the Team page away with it (the page needs member.invite).
        if (member.userId === selfId && !can(next.role, "member.invite", next.leadRights))
          router.replace("/app");
        router.refresh();
      });
    },
  });
  const remove = useMutation({
    mutationFn: (member: Member) => requestJson("DELETE", urlOf(member)),
    onSuccess: () => startTransition(() => router.refresh()),
    onSettled: () => setConfirming(null),
  });
  const changing = (m: Member) => changeAccess.variables?.member.userId === m.userId;

  return {
    /** The role proposed for the row, waiting for confirmation. */
    proposalOn: (m: Member) => (proposed?.userId === m.userId ? proposed.next : null),
    /** The row's saved change in words and the access it replaced, for the undo. */
    savedOn: (m: Member) => (saved?.userId === m.userId ? saved : null),
    /** The row's failed change or removal. */
    failedOn: (m: Member) =>
      (changing(m) ? changeAccess.error : null) ??
      (remove.variables?.userId === m.userId ? remove.error : null),
    changeFailedOn: (m: Member) => changing(m) && changeAccess.isError,
    /** The row's change is being saved, or the page refreshes after it. */
    busyOn: (m: Member) => changing(m) && (changeAccess.isPending || refreshing),
    confirmingOn: (m: Member) => confirming === m.userId,
    removing: remove.isPending,
    propose(m: Member, role: Role) {
      remove.reset();
      changeAccess.reset();
      setSaved(null);
      setProposed(role === m.role ? null : { userId: m.userId, next: { role, leadRights: m.leadRights } });
    },
    cancel: () => setProposed(null),
    confirm: (m: Member, next: Access) => changeAccess.mutate({ member: m, next }),
    setLeadRights(m: Member, leadRights: boolean) {
      remove.reset();
      setSaved(null);
      setProposed(null);
      changeAccess.mutate({ member: m, next: { role: m.role, leadRights } });
    },
    undo: (m: Member, previous: Access) => changeAccess.mutate({ member: m, next: previous, undo: true }),
    askRemove: (m: Member) => setConfirming(m.userId),
    keep: () => setConfirming(null),
    remove(m: Member) {
      changeAccess.reset();
      remove.mutate(m);
    },
  };
}
