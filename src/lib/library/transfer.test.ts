// Transfer characteristics through their route, against the real database (issue 11): the same parser as the
// editor, unreadable cells and blocking findings refused by row, the part back in draft, the curves in the check.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE as transferDelete, PUT as transferPut } from "@/app/api/parts/[id]/transfer/route";
import { parts } from "@/db/schema";
import { partLimits } from "@/lib/projects/projects";
import { addPart, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";
import { WORKED_TRANSFER } from "@/test/transfer-data";

const ws = workspaceForFile("Transfer");
let engineer: string;

const newPart = () => addPart(ws.id, { status: "verified", avalancheEnergy: 0.2 });

beforeAll(async () => {
  engineer = await sessionCookie(ws.members.engineer.id, ws.id);
});

describe("PUT /api/parts/:id/transfer", () => {
  it("stores two curves, cooler first, returns the part to draft and carries them into the engine's limits", async () => {
    const part = await newPart();
    const res = await call(transferPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { text: "T_j;V_GS [V];I_D [A]\n125;3;3\n125;4;25\n25;3;1\n25;4;20\n", fileName: "fig-7.csv" },
    });
    expect(res.status).toBe(200);
    const body = await res.json();
    // METHODS.md §10 "v2 instability" data: the curves do not cross inside the data, a warning, not a refusal.
    expect(body.findings.map((f: { key: string }) => f.key)).toEqual(["no-crossing-hot-above"]);
    const [stored] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(stored.status).toBe("draft");
    expect(stored.transfer).toEqual({
      ...WORKED_TRANSFER,
      source: { kind: "uploaded", fileName: "fig-7.csv" },
    });
    const limits = partLimits(stored, { refCaseTemp: 25, curves: [] });
    expect(limits.transfer?.temps).toEqual([25, 125]);
    expect(limits.avalanche).toEqual({ energy: 0.2 });
  });

  it("refuses unreadable cells and V_GS out of order, naming the row, and keeps what was stored", async () => {
    const part = await newPart();
    const bad = await call(transferPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { text: "25,3,1\n25,x,20\n150,3,3\n150,4,25\n" },
    });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.details.issues[0].message).toBe(
      "row 2, column V_GS: 'x' is not a number",
    );
    const order = await call(transferPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { text: "25,4,1\n25,3,20\n150,3,3\n150,4,25\n" },
    });
    expect(order.status).toBe(400);
    expect((await order.json()).error.details.issues[0].row).toBe(2);
    const [stored] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(stored.transfer).toBeNull();
    expect(stored.status).toBe("verified");
  });

  it("DELETE removes them", async () => {
    const part = await newPart();
    await call(transferPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { text: "25,3,1\n25,4,20\n150,3,3\n150,4,25\n" },
    });
    expect((await call(transferDelete, "DELETE", { cookie: engineer, params: { id: part.id } })).status).toBe(
      200,
    );
    const [stored] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(stored.transfer).toBeNull();
  });
});
