// Fault cases beyond rectangles and triangles (METHODS.md §13 and the fault-sequence builder): an unclamped turn-off
// and a fault sequence go through the real route handlers into the project's check, and bad ones are refused with
// the field that is wrong.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as checkGet } from "@/app/api/projects/[id]/check/route";
import { PATCH as faultCasePatch } from "@/app/api/projects/[id]/fault-cases/[caseId]/route";
import { POST as faultCasePost } from "@/app/api/projects/[id]/fault-cases/route";
import { faultCases, parts } from "@/db/schema";
import { DEMO_PARTS } from "@/lib/demo/parts";
import { faultSequence } from "@/lib/soa/sequence";
import type { PulseResult } from "@/lib/soa/types";
import { addDemoCandidate, addProject, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";

const ws = workspaceForFile("Sequences");
let projectId: string;
let partId: string;
let cookie: string;

beforeAll(async () => {
  const project = await addProject(ws.id, { name: "Disconnect", caseTemp: 25 });
  projectId = project.id;
  // QM-100G28 (V_DSS 100 V) with an invented avalanche rating: E_AS 50 mJ, I_AS 30 A, V_BR 100 V.
  ({ partId } = await addDemoCandidate(ws.id, projectId, DEMO_PARTS[1]));
  await testDb.db
    .update(parts)
    .set({ avalancheEnergy: 0.05, avalancheCurrent: 30, avalancheBreakdown: 100 })
    .where(eq(parts.id, partId));
  cookie = await sessionCookie(ws.members.engineer.id, ws.id);
});

async function post(body: unknown) {
  return call(faultCasePost, "POST", { cookie, params: { id: projectId }, body });
}

async function resultOf(caseId: string): Promise<PulseResult> {
  const res = await call(checkGet, "GET", { cookie, params: { id: projectId } });
  expect(res.status).toBe(200);
  const check = (await res.json()) as { results: Record<string, Record<string, PulseResult>> };
  return check.results[partId][caseId];
}

describe("an unclamped turn-off as a fault case", () => {
  it("is stored with its inductance and checked against the avalanche rating", async () => {
    const res = await post({
      name: "Short, no clamp",
      kind: "avalanche",
      supply: "48",
      current: "20",
      inductance: "10u",
    });
    expect(res.status).toBe(201);
    const { faultCase } = (await res.json()) as { faultCase: { id: string; duration: number | null } };
    expect(faultCase).toMatchObject({ kind: "avalanche", v: 48, i: 20, inductance: 10e-6, duration: null });
    // METHODS.md §10 "v2 avalanche" at a 25 °C case: E = ½·L·I²·V_BR/(V_BR − V_DD) = 3.84615 mJ, k_av = 1,
    // u = 3.84615 mJ / 50 mJ = 0.0769231.
    const result = await resultOf(faultCase.id);
    expect(result.utilisation).toBeCloseTo(0.0769231, 6);
    expect(result).toMatchObject({ curveVerdict: "pass", derating: 1, allowedCurrent: null });
    expect(result.flags).toContain("avalanche");
  });

  it("fails outright when the supply reaches the breakdown voltage", async () => {
    const res = await post({
      name: "Bus at breakdown",
      kind: "avalanche",
      supply: "100",
      current: "5",
      inductance: "1u",
    });
    expect(res.status).toBe(201);
    const { faultCase } = (await res.json()) as { faultCase: { id: string } };
    const result = await resultOf(faultCase.id);
    expect(result).toMatchObject({ verdict: "fail", curveVerdict: "fail" });
    expect(result.flags).toContain("over-voltage");
  });

  it("names the missing field", async () => {
    const res = await post({ name: "Half typed", kind: "avalanche", supply: "48", current: "20" });
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: { details: { fieldErrors: Record<string, string[]> } } };
    expect(Object.keys(body.error.details.fieldErrors)).toEqual(["inductance"]);
  });
});

describe("a fault sequence as a fault case", () => {
  const built = faultSequence({
    supply: 54.6,
    limitCurrent: 8,
    holdTime: 2e-3,
    inductance: 1e-6,
    turnOff: { kind: "clamped", clampVoltage: 75 },
    restarts: 2,
    pause: 5e-3,
  });
  if (!built.ok) throw new Error(built.reason);
  const pulse = built.pulses[0];
  if (pulse.kind !== "waveform") throw new Error("no waveform");
  const samples = { t: pulse.t, v: pulse.v, i: pulse.i };

  it("is stored with its samples and checked as one waveform", async () => {
    const res = await post({ name: "Short and restarts", kind: "waveform", samples, origin: null });
    expect(res.status).toBe(201);
    const { faultCase } = (await res.json()) as { faultCase: { id: string } };
    // The (V, I) shown for it is its peak-power sample: the clamp voltage at the limit current.
    expect(faultCase).toMatchObject({ kind: "waveform", v: 75, i: 8, duration: null, inductance: null });
    const result = await resultOf(faultCase.id);
    expect(result.flags).toContain("equivalent-rectangle");
    expect(result.at).toBeDefined();
    expect(result.tjPeak).not.toBeNull();
    expect(result.equivalentWidth).toBeCloseTo(built.figures.totalEnergy / built.figures.peakPower, 4);
  });

  it("refuses samples out of order, unequal lengths and a negative voltage, saying where", async () => {
    const swapped = { ...samples, t: [samples.t[1], samples.t[0], ...samples.t.slice(2)] };
    const cases: [unknown, string][] = [
      [swapped, "samples.t.1"],
      [{ ...samples, v: samples.v.slice(1) }, "samples.v"],
      [{ ...samples, v: samples.v.map((v, n) => (n === 3 ? -1 : v)) }, "samples.v.3"],
    ];
    for (const [bad, field] of cases) {
      const res = await post({ name: "Broken", kind: "waveform", samples: bad });
      expect(res.status).toBe(400);
      const body = (await res.json()) as { error: { details: { fieldErrors: Record<string, string[]> } } };
      expect(Object.keys(body.error.details.fieldErrors)).toEqual([field]);
    }
  });

  it("can be turned into a typed rectangle by an edit, leaving no stale samples", async () => {
    const res = await post({ name: "To retype", kind: "waveform", samples });
    const { faultCase } = (await res.json()) as { faultCase: { id: string } };
    const edited = await call(faultCasePatch, "PATCH", {
      cookie,
      params: { id: projectId, caseId: faultCase.id },
      body: { name: "Retyped", kind: "rect", v: "48", i: "8", duration: "2m" },
    });
    expect(edited.status).toBe(200);
    const [row] = await testDb.db.select().from(faultCases).where(eq(faultCases.id, faultCase.id));
    expect(row).toMatchObject({ kind: "rect", samples: null, inductance: null, duration: 2e-3 });
  });
});

describe("the table's shape rule", () => {
  it("refuses an unclamped turn-off without its inductance, whatever wrote it", async () => {
    await expect(
      testDb.db.insert(faultCases).values({ projectId, name: "x", kind: "avalanche", v: 48, i: 20 }),
    ).rejects.toThrow();
  });
});
