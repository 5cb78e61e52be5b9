import "server-only";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { can, roleLabels } from "@/lib/auth/permissions";

/** The workspace's members who may own a project, as the project form offers them (all but `exceptUserId`). */
export async function ownerChoices(workspaceId: string, exceptUserId?: string) {
  const members = await rememberedMembers(workspaceId);
  return members
    .filter((m) => can(m.role, "project.own") && m.userId !== exceptUserId)
    .map((m) => ({ id: m.userId, name: m.name, role: roleLabels[m.role].toLowerCase() }));
}
