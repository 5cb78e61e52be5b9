// The project check route against the engine's contract on the same inputs, on the real database.
import { beforeAll, describe, expect, it } from "vitest";
import { GET as checkGet } from "@/app/api/projects/[id]/check/route";
import { faultCases, measuredPulses, type Role } from "@/db/schema";
import type { GuardedHandler } from "@/lib/auth/guard";
import { DEMO_PARTS } from "@/lib/demo/parts";
import { runCheck } from "@/lib/soa/check";
import type { PartLimits, Pulse } from "@/lib/soa/types";
import { addDemoCandidate, addProject, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";

const ws = workspaceForFile("Check");
let projectId: string;
const limitsByPart = new Map<string, PartLimits>();

beforeAll(async () => {
  const { db } = testDb;
  const project = await addProject(ws.id, {
    name: "Disconnect board",
    caseTemp: 85,
    utilisationLimit: 0.7,
    tjGuard: 20,
  });
  projectId = project.id;
  for (const demo of DEMO_PARTS) {
    // The second part without a thermal model: its repetitions read Z_th from the curves.
    const added = await addDemoCandidate(ws.id, projectId, demo, { foster: demo.partNumber !== "QM-100G28" });
    limitsByPart.set(added.partId, added.limits);
  }
  await db.insert(faultCases).values([
    { projectId, name: "Pre-charge inrush", kind: "triangle", v: 48, i: 1.5, duration: 0.048 },
    { projectId, name: "Output short", kind: "rect", v: 52, i: 60, duration: 150e-6 },
    {
      projectId,
      name: "Overload train",
      kind: "rect",
      v: 30,
      i: 20,
      duration: 2e-3,
      repeatPeriod: 0.02,
      repeatCount: 10,
    },
    { projectId, name: "Retry forever", kind: "triangle", v: 40, i: 30, duration: 1e-3, repeatPeriod: 0.1 },
    { projectId, name: "Cold start", kind: "rect", v: 48, i: 5, duration: 5e-3, caseTemp: -20 },
  ]);
  await db.insert(measuredPulses).values([
    { projectId, label: "M1", kind: "rect", v: 47.5, i: 2.2, duration: 3e-3 },
    { projectId, label: "M2", kind: "rect", v: 120, i: 1, duration: 1e-3 },
  ]);
});

/** The project's check as the workspace's member of `role` asks for it. */
async function checkAs(role: Role): Promise<Response> {
  const cookie = await sessionCookie(ws.members[role].id, ws.id);
  return call(checkGet as GuardedHandler, "GET", { cookie, params: { id: projectId } });
}

describe("GET /api/projects/:id/check", () => {
  it("gives every candidate × pulse the engine's own result for the same inputs", async () => {
    const res = await checkAs("technician");
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.candidates).toHaveLength(3);
    expect(body.pulses).toHaveLength(7);
    const policy = { utilisationLimit: 0.7, tjGuard: 20, betweenCurves: "loglog" as const };
    let compared = 0;
    for (const candidate of body.candidates) {
      const part = limitsByPart.get(candidate.partId)!;
      for (const p of body.pulses) {
        const pulse = {
          id: p.id,
          kind: p.kind,
          v: p.v,
          i: p.i,
          duration: p.duration,
          ...(p.repeat ? { repeat: p.repeat } : {}),
        } as Pulse;
        const expected = runCheck({ part, caseTemp: p.caseTemp, policy, pulses: [pulse] }).results[0];
        expect(body.results[candidate.partId][p.id]).toEqual(expected);
        compared++;
      }
    }
    expect(compared).toBe(21);
  });

  it("checks a fault case at its own case temperature and an over-voltage pulse as a fail", async () => {
    const body = await (await checkAs("engineer")).json();
    const cold = body.pulses.find((p: { name: string }) => p.name === "Cold start");
    expect(cold.caseTemp).toBe(-20);
    const m2 = body.pulses.find((p: { name: string }) => p.name === "M2");
    for (const c of body.candidates) {
      expect(body.results[c.partId][m2.id].verdict).toBe("fail");
      expect(body.results[c.partId][m2.id].flags).toContain("over-voltage");
    }
    expect(body.worstByPulse[m2.id]).toBe("fail");
  });

  it("tells the demo story: the lowest-R_DS(on) part fails the inrush, the linear-mode part passes", async () => {
    const body = await (await checkAs("lead")).json();
    const inrush = body.pulses.find((p: { name: string }) => p.name === "Pre-charge inrush");
    const byNumber = (n: string) =>
      body.candidates.find((c: { partNumber: string }) => c.partNumber === n).partId;
    expect(body.results[byNumber("QM-80T16")][inrush.id].verdict).toBe("fail");
    expect(body.results[byNumber("BFL-100L55")][inrush.id].verdict).toBe("pass");
  });
});
