"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import type { Role } from "@/db/schema";
import { roleLabels } from "@/lib/auth/permissions";

interface WorkspaceOption {
  id: string;
  name: string;
  role: Role;
}

/**
 * The active workspace, and a switch to the others. Switching lands on the overview: a page of the old
 * workspace (a project, a part) does not exist in the new one.
 */
export function WorkspaceSwitcher({
  current,
  workspaces,
}: {
  current: string;
  workspaces: readonly WorkspaceOption[];
}) {
  const router = useRouter();
  const [navigating, startTransition] = useTransition();
  const active = workspaces.find((w) => w.id === current);
  const switchTo = useMutation({
    mutationFn: (workspaceId: string) => requestJson("POST", "/api/workspaces/switch", { workspaceId }),
    onSuccess: () =>
      startTransition(() => {
        router.push("/app");
        router.refresh();
      }),
  });
  const busy = switchTo.isPending || navigating;

  if (workspaces.length <= 1) {
    return (
      <div className="px-1">
        <p className="text-[0.7rem] font-medium uppercase tracking-wider text-ink-faint">Workspace</p>
        <p className="mt-0.5 truncate text-sm font-medium" title={active?.name}>
          {active?.name}
        </p>
        {active ? <p className="text-xs text-ink-muted">{roleLabels[active.role]}</p> : null}
      </div>
    );
  }
  return (
    <div className="px-1">
      <label
        htmlFor="workspace-switcher"
        className="text-[0.7rem] font-medium uppercase tracking-wider text-ink-faint"
      >
        Workspace
      </label>
      <select
        id="workspace-switcher"
        value={busy && switchTo.variables ? switchTo.variables : current}
        disabled={busy}
        aria-describedby={switchTo.isError ? "workspace-switcher-error" : undefined}
        onChange={(event) => switchTo.mutate(event.target.value)}
        className="mt-1 block h-8 w-full rounded-md border border-line-strong bg-panel px-2 text-sm text-ink disabled:opacity-60"
      >
        {workspaces.map((w) => (
          <option key={w.id} value={w.id}>
            {w.name}
          </option>
        ))}
      </select>
      {active ? <p className="mt-1 text-xs text-ink-muted">{roleLabels[active.role]}</p> : null}
      {switchTo.isError ? (
        <p id="workspace-switcher-error" role="alert" className="mt-1 text-xs text-fail">
          {messageOf(switchTo.error)}
        </p>
      ) : null}
    </div>
  );
}
