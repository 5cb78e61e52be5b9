// Upload integrity against the real storage fake and PostgreSQL: a curve upload registered twice at once, and what
// a presigned PUT may still do.
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as uploadPost } from "@/app/api/parts/[id]/uploads/route";
import { POST as capturesPost } from "@/app/api/projects/[id]/captures/route";
import { POST as projectUploadPost } from "@/app/api/projects/[id]/uploads/route";
import { captures, curveSets } from "@/db/schema";
import { processCaptureJob } from "@/lib/capture/job";
import { createStorage } from "@/lib/storage/storage";
import { registerUpload } from "@/test/curve-upload";
import { addPart, addProject, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";
import { requireEnv, storageConfig } from "@/test/services";

const storage = createStorage(storageConfig());

// A small valid curve set in the long format the app documents (public/examples/soa-curves-table.csv).
const csv = ["width,V_DS [V],I_D [A]", "1 ms,1,60", "1 ms,10,40", "1 ms,40,10", "DC,1,30", "DC,40,1.25"].join(
  "\n",
);
const sha256 = (text: string | Buffer) => createHash("sha256").update(text).digest("hex");

const ws = workspaceForFile("Integrity");
let cookie: string;

beforeAll(async () => {
  cookie = await sessionCookie(ws.members.engineer.id, ws.id);
});

const newPart = () => addPart(ws.id);

async function ticketFor(partId: string, size: number) {
  const res = await call(uploadPost, "POST", {
    cookie,
    params: { id: partId },
    body: { fileName: "figure.csv", size, purpose: "curve-set" },
  });
  expect(res.status).toBe(201);
  return (await res.json()) as { uploadId: string; objectKey: string; url: string };
}

async function put(url: string, body: string) {
  return fetch(url, { method: "PUT", body, headers: { "content-type": "text/csv" } });
}

describe("registering one curve upload several times at once", () => {
  it("answers one 201 and 409s, and the committed set's object stays with its recorded hash (5 trials)", async () => {
    for (let trial = 0; trial < 5; trial++) {
      const part = await newPart();
      const ticket = await ticketFor(part.id, Buffer.byteLength(csv));
      expect((await put(ticket.url, csv)).status).toBe(200);
      const statuses = await Promise.all(
        Array.from({ length: 3 }, () => registerUpload(cookie, part.id, ticket.uploadId)),
      ).then((rs) => rs.map((r) => r.status).sort());
      expect(statuses[0]).toBe(201);
      for (const s of statuses.slice(1)) expect([404, 409]).toContain(s);
      const sets = await testDb.db.select().from(curveSets).where(eq(curveSets.partId, part.id));
      expect(sets).toHaveLength(1);
      const stored = await storage.get(sets[0].objectKey);
      expect(stored).not.toBeNull();
      expect(sha256(stored!)).toBe(sets[0].sha256);
    }
  });
});

describe("presigned uploads", () => {
  it("carry the signed size: a body of another length is refused", async () => {
    const part = await newPart();
    const ticket = await ticketFor(part.id, 10);
    expect(new URL(ticket.url).searchParams.get("X-Amz-SignedHeaders")).toContain("content-length");
    expect((await put(ticket.url, "x".repeat(20_000))).status).toBe(403);
    expect((await put(ticket.url, "a,b\n1,2\n3\n")).status).toBe(200);
  });

  it("after registration, a PUT to the upload's URL changes nothing the curve set points to", async () => {
    const part = await newPart();
    const ticket = await ticketFor(part.id, Buffer.byteLength(csv));
    expect((await put(ticket.url, csv)).status).toBe(200);
    const res = await registerUpload(cookie, part.id, ticket.uploadId);
    expect(res.status).toBe(201);
    const forged = csv.replace("1 ms,40,10", "1 ms,40,99");
    await put(ticket.url, forged);
    const [set] = await testDb.db.select().from(curveSets).where(eq(curveSets.partId, part.id));
    const stored = await storage.get(set.objectKey);
    expect(stored?.toString()).toBe(csv);
    expect(sha256(stored!)).toBe(set.sha256);
  });
});

describe("capture uploads", () => {
  it("after registration, a PUT to the upload's URL changes nothing the capture points to", async () => {
    const project = await addProject(ws.id, { name: "Integrity board", caseTemp: 25 });
    // A small falling-current waveform: time (s), V_DS (V), I_D (A).
    const rows = Array.from(
      { length: 200 },
      (_, k) => `${(k * 1e-6).toExponential(3)},${24 - k * 0.1},${10 - k * 0.04}`,
    );
    const text = ["t,v,i", ...rows].join("\n");
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const ticketRes = await call(projectUploadPost, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: { fileName: "run.csv", size: Buffer.byteLength(text), purpose: "capture" },
    });
    expect(ticketRes.status).toBe(201);
    const ticket = (await ticketRes.json()) as { uploadId: string; url: string };
    expect((await put(ticket.url, text)).status).toBe(200);
    const res = await call(capturesPost, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: { uploadId: ticket.uploadId, name: "run", mapping: { time: 0, voltage: 1, current: 2 } },
    });
    expect(res.status).toBe(202);
    await put(ticket.url, text.replace("t,v,i", "t,v,9"));
    // The job runs after the PUT: it still reads the copy kept at registration.
    expect(await processCaptureJob(storage, (await res.json()).capture.id)).toBe("done");
    const [row] = await testDb.db.select().from(captures).where(eq(captures.projectId, project.id));
    const stored = await storage.get(row.objectKey);
    expect(stored?.toString()).toBe(text);
    expect(sha256(stored!)).toBe(row.sha256);
  });
});

describe("the storage fake, as a real store", () => {
  const endpoint = requireEnv("S3_ENDPOINT");
  const bucketUrl = `${endpoint}/${requireEnv("S3_BUCKET")}`;

  it("refuses anonymous reads and writes", async () => {
    const key = `test/${crypto.randomUUID()}.csv`;
    await storage.put(key, "a,b\n");
    expect((await fetch(`${bucketUrl}/${key}`)).status).toBe(403);
    expect((await fetch(`${bucketUrl}/${key}`, { method: "PUT", body: "evil" })).status).toBe(403);
    expect((await storage.get(key))?.toString()).toBe("a,b\n");
    await storage.remove(key);
  });

  it("allows cross-origin browser uploads only from the app's origin", async () => {
    const preflight = (origin: string) =>
      fetch(`${bucketUrl}/test/cors.csv`, {
        method: "OPTIONS",
        headers: { origin, "access-control-request-method": "PUT" },
      });
    const app = await preflight(new URL(requireEnv("APP_URL")).origin);
    expect(app.status).toBe(200);
    expect(app.headers.get("access-control-allow-origin")).not.toBeNull();
    const evil = await preflight("https://evil.example");
    expect(evil.headers.get("access-control-allow-origin")).toBeNull();
  });
});
