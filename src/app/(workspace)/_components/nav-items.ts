import type { Action } from "@/lib/auth/permissions";

export type NavIcon = "overview" | "library" | "projects" | "team" | "account";

export interface NavItem {
  href: string;
  label: string;
  icon: NavIcon;
}

/**
 * The rail's items, each shown only to roles whose permission table allows its action (none: everyone).
 */
const items: (NavItem & { action?: Action })[] = [
  { href: "/app", label: "Overview", icon: "overview", action: "workspace.read" },
  { href: "/library", label: "Library", icon: "library", action: "workspace.read" },
  { href: "/projects", label: "Projects", icon: "projects", action: "workspace.read" },
  { href: "/team", label: "Team", icon: "team", action: "member.invite" },
  { href: "/account", label: "Account", icon: "account" },
];

export function navItemsFor(can: (action: Action) => boolean): NavItem[] {
  return items.filter((item) => !item.action || can(item.action)).map(({ action: _, ...item }) => item);
}
