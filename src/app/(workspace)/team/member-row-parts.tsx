"use client";

import { Button } from "@/components/form";
import type { Role } from "@/db/schema";
import { roleHasLeadRights, roleLabels } from "@/lib/auth/permissions";

// The pieces of a member's row on the Team page: the role controls and the notes that open under the row.

export interface Access {
  role: Role;
  leadRights: boolean;
}

/** An admin's controls: the role (a change waits for confirmation) and lead rights (saved at once). */
export function RoleControls({
  name,
  access,
  options,
  proposedRole,
  busy,
  invalid,
  errorId,
  onPropose,
  onLeadRights,
}: {
  name: string;
  access: Access;
  options: Role[];
  proposedRole: Role | undefined;
  busy: boolean;
  invalid: boolean;
  /** The id of the error row, when there is one. */
  errorId: string | undefined;
  onPropose: (role: Role) => void;
  onLeadRights: (leadRights: boolean) => void;
}) {
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
      <select
        aria-label={`Role of ${name}`}
        aria-describedby={errorId}
        aria-invalid={invalid || undefined}
        value={proposedRole ?? access.role}
        disabled={busy}
        onChange={(event) => onPropose(event.target.value as Role)}
        className="h-7 min-w-28 rounded border border-line bg-panel px-1.5 text-sm hover:border-line-strong disabled:opacity-60 max-md:min-h-11 pointer-coarse:min-h-11"
      >
        {options.map((role) => (
          <option key={role} value={role}>
            {roleLabels[role]}
          </option>
        ))}
      </select>
      {roleHasLeadRights(access.role) ? null : (
        <label className="inline-flex items-center gap-1.5 text-xs text-ink-muted max-md:min-h-11 pointer-coarse:min-h-11">
          <input
            type="checkbox"
            checked={access.leadRights}
            disabled={busy}
            onChange={(event) => onLeadRights(event.target.checked)}
            className="size-4 accent-[var(--color-accent)]"
          />
          Lead rights
        </label>
      )}
    </div>
  );
}

/** The role as text, for members who cannot manage the team. */
export function RoleText({ access }: { access: Access }) {
  return (
    <>
      {roleLabels[access.role]}
      {access.leadRights && !roleHasLeadRights(access.role) ? (
        <span className="ml-1.5 text-xs text-ink-muted">with lead rights</span>
      ) : null}
    </>
  );
}

/** The proposed role change, to confirm or cancel (under the row). */
export function ProposedChange({
  name,
  from,
  to,
  losesManagement,
  busy,
  onCancel,
  onConfirm,
}: {
  name: string;
  from: Role;
  to: Role;
  /** The admin demotes themself and will no longer manage the team. */
  losesManagement: boolean;
  busy: boolean;
  onCancel: () => void;
  onConfirm: () => void;
}) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-2 bg-accent-soft px-3 py-2 text-sm">
      <p>
        Change {name} from {roleLabels[from].toLowerCase()} to{" "}
        <span className="font-medium">{roleLabels[to].toLowerCase()}</span>?
        {losesManagement ? " You will no longer manage this team." : ""}
      </p>
      <span className="flex gap-2">
        <Button size="sm" variant="quiet" onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
        <Button size="sm" variant="primary" pending={busy} onClick={onConfirm}>
          Change role
        </Button>
      </span>
    </div>
  );
}

/** A saved change in words, with its undo (under the row). */
export function SavedChange({
  message,
  busy,
  onUndo,
}: {
  message: string;
  busy: boolean;
  onUndo: () => void;
}) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-2 bg-sunken px-3 py-1.5 text-sm">
      <p role="status">Saved: {message}</p>
      <Button size="sm" variant="quiet" pending={busy} onClick={onUndo}>
        Undo
      </Button>
    </div>
  );
}

/** What a saved change did, in words. */
export function describeChange(name: string, before: Access, after: Access): string {
  const parts: string[] = [];
  if (before.role !== after.role) parts.push(`${name} is now ${roleLabels[after.role].toLowerCase()}`);
  if (before.leadRights !== after.leadRights)
    parts.push(after.leadRights ? `${name} holds lead rights` : `${name} no longer holds lead rights`);
  return `${parts.join("; ") || "nothing changed"}.`;
}
