import "server-only";
import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import type { Role } from "@/db/schema";
import { rememberedMembership, rememberedWorkspaces } from "./auth-memory";
import { type Action, can } from "./permissions";
import { sessionCookieName, validateSessionCookie } from "./session";

/**
 * Session look-ups for server components (pages and layouts). Route handlers use the guard instead.
 * Pages cannot set cookies, so a session renewed here is renewed by the next API call.
 */
export const getPageSession = cache(async () => {
  const jar = await cookies();
  const value = jar.get(sessionCookieName)?.value;
  if (!value) return null;
  return validateSessionCookie(`${sessionCookieName}=${value}`);
});

export interface PageMember {
  user: { id: string; email: string; name: string };
  workspace: { id: string; name: string };
  role: Role;
  leadRights: boolean;
  workspaces: readonly { id: string; name: string; role: Role }[];
  can: (action: Action) => boolean;
}

/** The signed-in member of the active workspace, or a redirect to sign-in. */
export const requireMember = cache(async (): Promise<PageMember> => {
  const session = await getPageSession();
  if (!session) redirect(`/sign-in?next=${encodeURIComponent(await currentPath())}`);
  const workspaces = await rememberedWorkspaces(session.user.id);
  const workspaceId = session.workspaceId ?? workspaces[0]?.id;
  const membership = workspaceId ? await rememberedMembership(workspaceId, session.user.id) : null;
  if (!workspaceId || !membership) redirect("/no-workspace");
  return {
    user: session.user,
    workspace: { id: workspaceId, name: membership.workspaceName },
    role: membership.role,
    leadRights: membership.leadRights,
    workspaces,
    can: (action) => can(membership.role, action, membership.leadRights),
  };
});

/**
 * A page for a role's action. A member whose role may not open it is sent to a page that says which role may and
 * whom to ask; the page reveals nothing of the workspace's data (another workspace's resources stay a 404).
 */
export async function requireAction(action: Action): Promise<PageMember> {
  const member = await requireMember();
  if (!member.can(action)) {
    redirect(
      `/not-allowed?action=${encodeURIComponent(action)}&from=${encodeURIComponent(await currentPath())}`,
    );
  }
  return member;
}

async function currentPath(): Promise<string> {
  const h = await headers();
  return h.get("x-pathname") ?? "/app";
}
