import type { Role } from "@/db/schema";
import type { Action } from "@/lib/auth/permissions";

/** What each role is for, in one line (PRODUCT.md, roles). */
export const roleSummaries: Record<Role, string> = {
  admin: "Owns the workspace: its members and their roles, and everything an engineer does.",
  lead: "Compares candidates, signs decisions, verifies library parts and invites people.",
  engineer: "Builds the part library, defines projects and fault cases, runs checks.",
  technician: "Logs bench measurements and captures, and sees at once whether each pulse passes.",
};

/** Every action of the permission table in plain words, in the order a newcomer meets them. */
export const actionDescriptions: Record<Action, string> = {
  "workspace.read": "See the workspace's part library, projects, checks and decisions",
  "measurement.write": "Log measured pulses and upload scope captures",
  "measurement.manage": "Correct or delete measured pulses and captures that others recorded",
  "check.run": "Run checks of pulses against candidate parts",
  "part.write": "Add parts to the library with their SOA curve sets and thermal models",
  "project.write": "Create projects, candidates and fault cases",
  "project.own": "Own a project and receive its failure notices",
  "part.verify": "Mark library parts as verified after a second check against the datasheet",
  "decision.sign": "Sign off a project's decision",
  "member.invite": "Invite people to the workspace",
  "member.manage": "Change members' roles and remove members",
  "audit.read": "Read the workspace's record of membership, role and token changes",
};
