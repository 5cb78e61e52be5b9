import { describe, expect, it } from "vitest";
import {
  actions,
  assignableRoles,
  can,
  leadRightsActions,
  roleHasLeadRights,
  roles,
  rolesAllowed,
} from "./permissions";

// The product's division of work (PRODUCT.md, roles table), pinned so that a change to the table is deliberate.
describe("permission table", () => {
  it("lets a technician log bench evidence and nothing of an engineer's or lead's work", () => {
    expect(can("technician", "measurement.write")).toBe(true);
    expect(can("technician", "check.run")).toBe(true);
    for (const action of [
      "part.write",
      "part.verify",
      "project.write",
      "project.own",
      "decision.sign",
      "member.invite",
    ] as const) {
      expect(can("technician", action), action).toBe(false);
    }
  });

  it("keeps signing decisions and verifying parts with leads only", () => {
    expect(roles.filter((r) => can(r, "decision.sign"))).toEqual(["lead"]);
    expect(roles.filter((r) => can(r, "part.verify"))).toEqual(["lead"]);
  });

  it("lets lead rights add exactly verifying and signing to any role, and nothing else", () => {
    expect([...leadRightsActions].sort()).toEqual(["decision.sign", "part.verify"]);
    for (const role of roles) {
      expect(can(role, "decision.sign", true), role).toBe(true);
      expect(can(role, "part.verify", true), role).toBe(true);
      for (const action of actions.filter((x) => !leadRightsActions.includes(x as never)))
        expect(can(role, action, true), `${role} ${action}`).toBe(can(role, action));
    }
  });

  it("says only a lead's role holds lead rights already, so only a lead is never offered them", () => {
    expect(roles.filter((r) => roleHasLeadRights(r))).toEqual(["lead"]);
  });

  it("names the roles an action is open to, for the page that tells a member whom to ask", () => {
    expect(rolesAllowed("decision.sign")).toEqual(["lead"]);
    expect(rolesAllowed("member.invite")).toEqual(["admin", "lead"]);
    expect(rolesAllowed("workspace.read")).toEqual(["admin", "lead", "engineer", "technician"]);
  });

  it("lets admins and leads change others' measured pulses and captures; lead rights do not", () => {
    expect(roles.filter((r) => can(r, "measurement.manage"))).toEqual(["admin", "lead"]);
    expect(can("technician", "measurement.manage", true)).toBe(false);
  });

  it("lets only admins manage members; admins and leads invite", () => {
    expect(roles.filter((r) => can(r, "member.manage"))).toEqual(["admin"]);
    expect(roles.filter((r) => can(r, "member.invite"))).toEqual(["admin", "lead"]);
  });

  it("lets anyone who writes projects own one, and never a technician", () => {
    expect(roles.filter((r) => can(r, "project.own"))).toEqual(["admin", "lead", "engineer"]);
    expect(can("technician", "project.own", true)).toBe(false);
  });

  it("lets engineers build the library and projects", () => {
    expect(can("engineer", "part.write")).toBe(true);
    expect(can("engineer", "project.write")).toBe(true);
    expect(can("engineer", "decision.sign")).toBe(false);
  });

  it("denies by default: every role lacks at least one action, every action has a role", () => {
    for (const role of roles)
      expect(
        actions.some((a) => !can(role, a)),
        role,
      ).toBe(true);
    for (const action of actions)
      expect(
        roles.some((r) => can(r, action)),
        action,
      ).toBe(true);
  });

  it("lets a lead hand out roles up to lead, an admin any role, others none", () => {
    expect(assignableRoles("admin")).toEqual(["admin", "lead", "engineer", "technician"]);
    expect(assignableRoles("lead")).toEqual(["lead", "engineer", "technician"]);
    expect(assignableRoles("engineer")).toEqual([]);
    expect(assignableRoles("technician")).toEqual([]);
  });
});
