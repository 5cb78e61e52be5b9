import { actionDescriptions } from "@/components/role-text";
import type { Role } from "@/db/schema";
import { type Action, can, roleLabels, roles } from "@/lib/auth/permissions";

/** The permission table read for one role: what it may do, and who does the rest. */
export function RoleAbilities({ role, leadRights = false }: { role: Role; leadRights?: boolean }) {
  const all = Object.keys(actionDescriptions) as Action[];
  const allowed = all.filter((action) => can(role, action, leadRights));
  const elsewhere = all.filter((action) => !can(role, action, leadRights));
  return (
    <div className="grid items-start gap-4 md:grid-cols-2">
      <div className="rounded-md border border-line bg-panel">
        <h3 className="border-b border-line px-4 py-2 text-xs font-medium text-ink-muted">
          Your role allows
        </h3>
        <ul className="divide-y divide-line text-sm">
          {allowed.map((action) => (
            <li key={action} className="flex items-start gap-2.5 px-4 py-2">
              <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true" className="mt-1 shrink-0">
                <path d="M2 6.5l2.5 2.5L10 3.5" fill="none" stroke="var(--color-accent)" strokeWidth="1.6" />
              </svg>
              {actionDescriptions[action]}
            </li>
          ))}
        </ul>
      </div>
      {elsewhere.length > 0 ? (
        <div className="rounded-md border border-line bg-panel">
          <h3 className="border-b border-line px-4 py-2 text-xs font-medium text-ink-muted">
            Left to other roles
          </h3>
          <ul className="divide-y divide-line text-sm">
            {elsewhere.map((action) => (
              <li key={action} className="flex items-start justify-between gap-4 px-4 py-2 text-ink-muted">
                <span>{actionDescriptions[action]}</span>
                <span className="shrink-0 text-xs text-ink-faint">
                  {roles
                    .filter((r) => can(r, action))
                    .map((r) => roleLabels[r].toLowerCase())
                    .join(", ")}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
