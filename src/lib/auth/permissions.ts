import type { Role } from "@/db/schema";

/**
 * The one permission table: what each member role may do in its workspace. Deny by default: an action not
 * listed for a role is refused. Every route handler names its action through the guard (src/lib/auth/guard.ts).
 */
export const actions = [
  "workspace.read",
  "part.write",
  "part.verify",
  "project.write",
  /** Be named a project's owner (the engineer it belongs to, who gets its failure notices). */
  "project.own",
  "measurement.write",
  /** Correct or delete measured pulses and captures that another member recorded (one's own: measurement.write). */
  "measurement.manage",
  "check.run",
  "decision.sign",
  "member.invite",
  "member.manage",
  "audit.read",
] as const;

export type Action = (typeof actions)[number];

export const roles = ["admin", "lead", "engineer", "technician"] as const satisfies readonly Role[];

const table: Record<Role, readonly Action[]> = {
  // Owns the workspace: members and roles, and everything an engineer does. Signing and verifying stay with leads.
  admin: [
    "workspace.read",
    "part.write",
    "project.write",
    "project.own",
    "measurement.write",
    "measurement.manage",
    "check.run",
    "member.invite",
    "member.manage",
    "audit.read",
  ],
  // Compares, decides, verifies library parts, invites people.
  lead: [
    "workspace.read",
    "part.write",
    "part.verify",
    "project.write",
    "project.own",
    "measurement.write",
    "measurement.manage",
    "check.run",
    "decision.sign",
    "member.invite",
    "audit.read",
  ],
  // Builds the library and the projects.
  engineer: [
    "workspace.read",
    "part.write",
    "project.write",
    "project.own",
    "measurement.write",
    "check.run",
  ],
  // Logs what the bench measured.
  technician: ["workspace.read", "measurement.write", "check.run"],
};

/**
 * Lead rights: the lead's own actions, which an admin may grant to any member beside their role, themself
 * included, so that a one-person or small team can verify parts and sign decisions without a second person.
 */
export const leadRightsActions = ["part.verify", "decision.sign"] as const satisfies readonly Action[];

/** May a member of `role` (holding lead rights or not) do `action`? */
export function can(role: Role, action: Action, leadRights = false): boolean {
  if (table[role].includes(action)) return true;
  return leadRights && (leadRightsActions as readonly Action[]).includes(action);
}

/** The roles whose members may do `action` by their role alone, for a page that tells a caller whom to ask. */
export function rolesAllowed(action: Action): Role[] {
  return roles.filter((role) => table[role].includes(action));
}

/** Whether a role already does everything lead rights grant (granting them would add nothing). */
export function roleHasLeadRights(role: Role): boolean {
  return leadRightsActions.every((action) => table[role].includes(action));
}

/** Whether lead rights would allow `action` to a member whose role does not. */
export function grantedByLeadRights(action: Action): boolean {
  return (leadRightsActions as readonly Action[]).includes(action);
}

/** Roles a member of `role` may hand out in an invitation or a role change. */
export function assignableRoles(role: Role): Role[] {
  if (role === "admin") return ["admin", "lead", "engineer", "technician"];
  if (role === "lead") return ["lead", "engineer", "technician"];
  return [];
}

export const roleLabels: Record<Role, string> = {
  admin: "Admin",
  lead: "Lead",
  engineer: "Engineer",
  technician: "Technician",
};
