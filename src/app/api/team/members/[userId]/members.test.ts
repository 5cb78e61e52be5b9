// Membership changes under concurrency: the last-admin rule holds when admins act at the same moment, and a removed
// member's projects pass to the admin who removed them, so failure notices reach a current member.
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { POST as saveMeasurements } from "@/app/api/projects/[id]/measurements/route";
import { mailOutbox, memberships, projects } from "@/db/schema";
import { DEMO_PARTS } from "@/lib/demo/parts";
import {
  addDemoCandidate,
  addMember,
  addProject,
  call,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  testDb,
} from "@/test/fixtures";
import { waitForMail } from "@/test/services";
import { PATCH as changeRole, DELETE as removeMember } from "./route";

const created: string[] = [];
afterAll(async () => {
  for (const id of created) await deleteWorkspace(id);
  await testDb.sql.end();
});

async function twoAdmins() {
  const ws = await createTestWorkspace("Admins");
  created.push(ws.id);
  const second = await addMember(ws.id, "admin");
  return { ws, a: ws.members.admin, b: second };
}

async function adminCount(workspaceId: string) {
  const rows = await testDb.db
    .select()
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "admin")));
  return rows.length;
}

describe("the last-admin rule under parallel requests", () => {
  it("two admins demoting each other at the same time: one 200, one refused, one admin left (5 trials)", async () => {
    for (let trial = 0; trial < 5; trial++) {
      const { ws, a, b } = await twoAdmins();
      const [ca, cb] = [await sessionCookie(a.id, ws.id), await sessionCookie(b.id, ws.id)];
      const statuses = await Promise.all([
        call(changeRole, "PATCH", { cookie: ca, params: { userId: b.id }, body: { role: "engineer" } }),
        call(changeRole, "PATCH", { cookie: cb, params: { userId: a.id }, body: { role: "engineer" } }),
      ]).then((rs) => rs.map((r) => r.status).sort());
      // The loser is refused: 409 when it raced the winner, 403 when the winner had already demoted it.
      expect(statuses[0]).toBe(200);
      expect([403, 409]).toContain(statuses[1]);
      expect(await adminCount(ws.id)).toBe(1);
    }
  });

  it("two admins removing each other at the same time: one 200, one refused, one admin left (5 trials)", async () => {
    for (let trial = 0; trial < 5; trial++) {
      const { ws, a, b } = await twoAdmins();
      const [ca, cb] = [await sessionCookie(a.id, ws.id), await sessionCookie(b.id, ws.id)];
      const statuses = await Promise.all([
        call(removeMember, "DELETE", { cookie: ca, params: { userId: b.id } }),
        call(removeMember, "DELETE", { cookie: cb, params: { userId: a.id } }),
      ]).then((rs) => rs.map((r) => r.status).sort());
      expect(statuses[0]).toBe(200);
      expect([403, 404, 409]).toContain(statuses[1]);
      expect(await adminCount(ws.id)).toBe(1);
    }
  });
});

describe("removing a member who owns a project", () => {
  it("passes the project to the removing admin, and its failures are mailed to them, not the removed member", async () => {
    const ws = await createTestWorkspace("Owners");
    created.push(ws.id);
    const project = await addProject(ws.id, {
      name: "Owned board",
      caseTemp: 25,
      ownerId: ws.members.engineer.id,
    });
    await addDemoCandidate(ws.id, project.id, DEMO_PARTS[0]);
    const admin = await sessionCookie(ws.members.admin.id, ws.id);
    const removed = await call(removeMember, "DELETE", {
      cookie: admin,
      params: { userId: ws.members.engineer.id },
    });
    expect(removed.status).toBe(200);
    const [after] = await testDb.db.select().from(projects).where(eq(projects.id, project.id));
    expect(after.ownerId).toBe(ws.members.admin.id);

    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const saved = await call(saveMeasurements, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: { rows: [{ label: "Overload", kind: "rect", v: 40, i: 900, duration: 10e-3 }] },
    });
    expect(saved.status).toBe(201);
    await waitForMail(ws.members.admin.email);
    // Nothing was queued for the removed member: the outbox holds every e-mail the save asked for.
    const toRemoved = await testDb.db
      .select()
      .from(mailOutbox)
      .where(eq(mailOutbox.to, ws.members.engineer.email));
    expect(toRemoved).toEqual([]);
  });
});
