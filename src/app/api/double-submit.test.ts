// Double submissions through the real route handlers: parallel identical decisions and parts.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { PATCH as partPatch } from "@/app/api/parts/[id]/route";
import { POST as partPost } from "@/app/api/parts/route";
import { POST as signPost } from "@/app/api/projects/[id]/decisions/route";
import { decisions } from "@/db/schema";
import { DEMO_PARTS } from "@/lib/demo/parts";
import { addDemoCandidate, addProject, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";

const ws = workspaceForFile("Twice");

/** A project with one candidate; each test takes another demo part (one workspace holds each part once). */
async function projectWithCandidate(demo: number) {
  const project = await addProject(ws.id, { name: `Twice ${crypto.randomUUID().slice(0, 4)}`, caseTemp: 25 });
  const { partId } = await addDemoCandidate(ws.id, project.id, DEMO_PARTS[demo]);
  return { projectId: project.id, partId };
}

async function standing(projectId: string) {
  const rows = await testDb.db.select().from(decisions).where(eq(decisions.projectId, projectId));
  return rows.filter((d) => d.supersededBy === null);
}

describe("decisions", () => {
  it("5 parallel identical decisions leave one standing decision; the repeats answer 409", async () => {
    const { projectId, partId } = await projectWithCandidate(0);
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const body = { partId, rationale: "Passes every fault case with margin at 85 °C." };
    const statuses = (
      await Promise.all(
        Array.from({ length: 5 }, () =>
          call(signPost, "POST", { cookie: lead, params: { id: projectId }, body }),
        ),
      )
    ).map((r) => r.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(4);
    expect(await standing(projectId)).toHaveLength(1);
  });

  it("parallel different decisions still leave exactly one standing", async () => {
    const { projectId, partId } = await projectWithCandidate(1);
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const statuses = (
      await Promise.all(
        Array.from({ length: 4 }, (_, k) =>
          call(signPost, "POST", {
            cookie: lead,
            params: { id: projectId },
            body: { partId, rationale: `Reason number ${k}, stated in a sentence.` },
          }),
        ),
      )
    ).map((r) => r.status);
    expect(statuses.every((s) => s === 201)).toBe(true);
    expect(await standing(projectId)).toHaveLength(1);
  });

  it("a resent submission with the same idempotency key answers 409", async () => {
    const { projectId, partId } = await projectWithCandidate(2);
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const body = {
      partId,
      rationale: "Chosen for its linear-mode rating.",
      idempotencyKey: crypto.randomUUID(),
    };
    const send = () => call(signPost, "POST", { cookie: lead, params: { id: projectId }, body });
    expect((await send()).status).toBe(201);
    expect((await send()).status).toBe(409);
  });
});

describe("parts", () => {
  const part = () => ({
    partNumber: `TW-${crypto.randomUUID().slice(0, 6)}`,
    maker: "Twice Semiconductors",
    technology: "si-mosfet",
    package: "TO-220",
    vdsMax: "80 V",
    tjMax: "175",
  });

  it("4 parallel identical parts give one 201 and three 409s", async () => {
    const engineer = await sessionCookie(ws.members.engineer.id, ws.id);
    const body = part();
    const statuses = (
      await Promise.all(Array.from({ length: 4 }, () => call(partPost, "POST", { cookie: engineer, body })))
    )
      .map((r) => r.status)
      .sort();
    expect(statuses).toEqual([201, 409, 409, 409]);
  });

  it("renaming a part to a maker and number already in the library answers 409", async () => {
    const engineer = await sessionCookie(ws.members.engineer.id, ws.id);
    const first = part();
    const second = part();
    expect((await call(partPost, "POST", { cookie: engineer, body: first })).status).toBe(201);
    const created = await (await call(partPost, "POST", { cookie: engineer, body: second })).json();
    const res = await call(partPatch, "PATCH", {
      cookie: engineer,
      params: { id: created.part.id },
      body: { ...second, partNumber: first.partNumber },
    });
    expect(res.status).toBe(409);
  });
});
