// Upload → storage → parse → rows, against the real storage fake and PostgreSQL.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as limitsGet } from "@/app/api/parts/[id]/limits/route";
import { POST as uploadPost } from "@/app/api/parts/[id]/uploads/route";
import { curveSets, curves, parts, pendingUploads } from "@/db/schema";
import { allowedCurrent } from "@/lib/soa/allowed-current";
import { prepareCurveSet } from "@/lib/soa/curve-set";
import { derate } from "@/lib/soa/derate";
import { createStorage } from "@/lib/storage/storage";
import { browserUpload, registerUpload } from "@/test/curve-upload";
import { addPart, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";
import { storageConfig } from "@/test/services";
import { cleanupStaleUploads, presignUpload, registerCurveSet } from "./curve-upload";

const storage = createStorage(storageConfig());

const csv = [
  "width,V_DS [V],I_D [A]",
  "1 ms,1,60",
  "1 ms,10,40",
  "1 ms,40,10",
  "10 ms,1,50",
  "10 ms,10,16",
  "10 ms,40,4",
  "DC,1,30",
  "DC,10,5",
  "DC,40,1.25",
].join("\n");

const ws = workspaceForFile("Uploads");
let cookie: string;

const newPart = () => addPart(ws.id, { status: "verified" });

async function rowsFor(partId: string) {
  return testDb.db.select().from(curveSets).where(eq(curveSets.partId, partId));
}

beforeAll(async () => {
  cookie = await sessionCookie(ws.members.engineer.id, ws.id);
});

describe("curve-set upload", () => {
  it("stores the object, the curves, name, size and SHA-256, and returns the part to draft", async () => {
    const part = await newPart();
    const ticket = await browserUpload(cookie, part.id, csv);
    const res = await registerUpload(cookie, part.id, ticket.uploadId);
    expect(res.status).toBe(201);
    const [set] = await rowsFor(part.id);
    // The set keeps its own copy of the parsed bytes; the presigned object is removed.
    expect(set.objectKey).not.toBe(ticket.objectKey);
    expect(set).toMatchObject({
      fileName: "figure-9.csv",
      size: Buffer.byteLength(csv),
      active: true,
    });
    expect(set.sha256).toMatch(/^[0-9a-f]{64}$/);
    const stored = await testDb.db.select().from(curves).where(eq(curves.curveSetId, set.id));
    expect(stored.map((c) => c.duration).sort()).toEqual([0.001, 0.01, null]);
    expect((await storage.get(set.objectKey))?.toString()).toBe(csv);
    expect(await storage.get(ticket.objectKey)).toBeNull();
    const [after] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(after.status).toBe("draft");
    expect(
      await testDb.db.select().from(pendingUploads).where(eq(pendingUploads.objectKey, ticket.objectKey)),
    ).toEqual([]);
  });

  it("rejects a malformed file with row and column, stores nothing and deletes the object", async () => {
    const part = await newPart();
    const bad = "width,V_DS [V],I_D [A]\n1 ms,1,60\n1 ms,ten,40\n";
    const ticket = await browserUpload(cookie, part.id, bad);
    const res = await registerUpload(cookie, part.id, ticket.uploadId);
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.details.issues[0]).toMatchObject({ row: 3, column: "V_DS [V]" });
    expect(await rowsFor(part.id)).toEqual([]);
    expect(await storage.get(ticket.objectKey)).toBeNull();
  });

  it("answers 503 and leaves no row when storage cannot be reached", async () => {
    const part = await newPart();
    const ticket = await presignUpload(storage, {
      workspaceId: ws.id,
      userId: ws.members.engineer.id,
      owner: `parts/${part.id}`,
      fileName: "x.csv",
      size: 10,
      purpose: "curve-set",
    });
    const down = createStorage({ ...storageConfig(), endpoint: "http://127.0.0.1:9" });
    const [upload] = await testDb.db
      .select()
      .from(pendingUploads)
      .where(eq(pendingUploads.id, ticket.uploadId));
    const error = await registerCurveSet(down, {
      part,
      userId: ws.members.engineer.id,
      userName: "Engineer",
      upload,
    }).catch((e) => e);
    expect(error.status).toBe(503);
    expect(await rowsFor(part.id)).toEqual([]);
    // The pending row stays so that the cleanup step can remove the object once storage is back.
    expect(
      await testDb.db.select().from(pendingUploads).where(eq(pendingUploads.id, ticket.uploadId)),
    ).toHaveLength(1);
  });

  it("leaves neither rows nor object when the database fails mid-transaction", async () => {
    const part = await newPart();
    const ticket = await browserUpload(cookie, part.id, csv);
    // A real failure inside the transaction: a trigger that refuses the curves of this part's set.
    await testDb.sql.unsafe(`
      create or replace function pf_test_fail() returns trigger language plpgsql as $$
      begin raise exception 'forced failure for test'; end $$;
      create trigger pf_test_fail before insert on curves for each row execute function pf_test_fail();`);
    try {
      const res = await registerUpload(cookie, part.id, ticket.uploadId);
      expect(res.status).toBe(500);
    } finally {
      await testDb.sql.unsafe("drop trigger pf_test_fail on curves; drop function pf_test_fail();");
    }
    expect(await rowsFor(part.id)).toEqual([]);
    expect(await storage.get(ticket.objectKey)).toBeNull();
    const [after] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(after.status).toBe("verified");
  });

  it("removes uploaded objects never registered", async () => {
    const part = await newPart();
    const ticket = await browserUpload(cookie, part.id, csv);
    await testDb.db
      .update(pendingUploads)
      .set({ createdAt: new Date(Date.now() - 2 * 3600_000) })
      .where(eq(pendingUploads.id, ticket.uploadId));
    expect(await cleanupStaleUploads(storage)).toBeGreaterThanOrEqual(1);
    expect(await storage.get(ticket.objectKey)).toBeNull();
  });

  it("refuses a file over 5 MB before any upload", async () => {
    const part = await newPart();
    const res = await call(uploadPost, "POST", {
      cookie,
      params: { id: part.id },
      body: { fileName: "big.csv", size: 6_000_000, purpose: "curve-set" },
    });
    expect(res.status).toBe(413);
    expect((await res.json()).error.message).toBe("The file is 6\u2009MB; the limit is 5\u2009MB.");
  });
});

describe("limits route", () => {
  it("returns derated and interpolated curves equal to the engine's", async () => {
    const part = await newPart();
    const ticket = await browserUpload(cookie, part.id, csv);
    await registerUpload(cookie, part.id, ticket.uploadId);
    const res = await call(limitsGet, "GET", {
      cookie,
      params: { id: part.id },
      path: `/api/parts/${part.id}/limits?caseTemp=100&width=2ms`,
    });
    expect(res.status).toBe(200);
    const limits = await res.json();
    const k = derate(175, 100, 25);
    expect(limits.derating).toBeCloseTo(0.5, 12);
    const set = prepareCurveSet({
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 60],
            [10, 40],
            [40, 10],
          ],
        },
        {
          duration: 1e-2,
          points: [
            [1, 50],
            [10, 16],
            [40, 4],
          ],
        },
        {
          duration: "DC",
          points: [
            [1, 30],
            [10, 5],
            [40, 1.25],
          ],
        },
      ],
    });
    const oneMs = limits.derated.find((c: { duration: number }) => c.duration === 1e-3);
    expect(oneMs.points).toEqual([
      [1, 30],
      [10, 20],
      [40, 5],
    ]);
    expect(limits.interpolated.flags).toEqual(["interpolated"]);
    expect(limits.interpolated.points.length).toBeGreaterThan(20);
    for (const [v, i] of limits.interpolated.points) {
      expect(i).toBe((allowedCurrent(set, v, 2e-3, "loglog").current ?? Number.NaN) * k);
    }
  });
});
