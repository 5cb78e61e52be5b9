// Long file: the capture path from upload to stored results, on one set of storage and database fixtures.
// Capture upload → storage → streaming parse → objects and row, against the real storage fake and PostgreSQL.
import { createHash } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  DELETE as captureDelete,
  GET as captureGet,
} from "@/app/api/projects/[id]/captures/[captureId]/route";
import { GET as capturesGet, POST as capturesPost } from "@/app/api/projects/[id]/captures/route";
import { POST as uploadPost } from "@/app/api/projects/[id]/uploads/route";
import {
  captures,
  type FosterTermRow,
  type Part,
  pendingUploads,
  projectCandidates,
  projects,
} from "@/db/schema";
import { CAPTURE_QUEUE, jobQueue, RETRY_LIMIT } from "@/lib/jobs/boss";
import { presignUpload } from "@/lib/library/curve-upload";
import { checkProject } from "@/lib/projects/check";
import { powerFromVI, waveformRise } from "@/lib/soa/thermal-waveform";
import { createStorage } from "@/lib/storage/storage";
import {
  addCurveSet,
  addMember,
  addPart,
  addProject,
  call,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  type TestWorkspace,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { storageConfig, waitForMail } from "@/test/services";
import { GAVE_UP_WORDS, processCaptureJob, recheckCapture, startCaptureWorkers } from "./job";
import { captureMappingSchema, previewCaptureText } from "./parse";
import { parseCaptureText } from "./parse-stream";
import { processCapture } from "./process";
import { loadCaptureSamples, registerCapture, samplesKeyOf } from "./store";

const storage = createStorage(storageConfig());
const { db } = testDb;

/**
 * A bench capture of a pre-charge: 24 V into 470 µF, the MOSFET's gate holding 24 V/ms (11.3 A) for 1 ms,
 * sampled every µs from 0.2 ms before the gate, with a few lines of scope settings first.
 */
function inrushCsv(samples = 2000): string {
  const lines = [
    "Instrument,Bench scope (simulated)",
    "Sample Interval,1e-06",
    "Probe CH2,current probe 100 mV/A",
    "",
  ];
  lines.push("Time (s),CH1 (V),CH2 (A)");
  for (let k = 0; k < samples; k++) {
    const t = (k - 200) * 1e-6;
    const charging = t >= 0 && t < 1e-3;
    const wobble = 0.01 * Math.sin(k * 1.7);
    const vds = (t < 0 ? 24 : charging ? 24 - 24_000 * t : 0.02) + wobble;
    const id = (charging ? 470e-6 * 24_000 : t >= 1e-3 ? 0.4 : 0) + wobble;
    lines.push(`${t.toExponential(6)},${vds.toFixed(4)},${id.toFixed(4)}`);
  }
  return `${lines.join("\r\n")}\r\n`;
}

const network: FosterTermRow[] = [
  { r: 0.1, tau: 1e-4 },
  { r: 0.4, tau: 1e-3 },
  { r: 0.8, tau: 1e-2 },
  { r: 0.7, tau: 0.1 },
];

const ws = workspaceForFile("Captures");
let other: TestWorkspace;
let cookies: Record<"technician" | "otherTechnician" | "engineer" | "lead" | "outsider", string>;
let projectId: string;
let secondProjectId: string;
let small: Part;
let big: Part;

async function newPart(name: string, scale: number, foster: FosterTermRow[] | null): Promise<Part> {
  const part = await addPart(ws.id, {
    partNumber: `${name}-${crypto.randomUUID().slice(0, 6)}`,
    foster,
    status: "verified",
  });
  await addCurveSet(ws.id, part.id, [
    {
      duration: 1e-4,
      points: [
        [1, 150 * scale],
        [100, 5 * scale],
      ],
    },
    {
      duration: 1e-3,
      points: [
        [1, 50 * scale],
        [100, 1.5 * scale],
      ],
    },
    {
      // A 10 ms curve: a capture's low-power samples are read at widths up to the record's own length
      // (METHODS.md §6), beyond 1 ms here.
      duration: 1e-2,
      points: [
        [1, 20 * scale],
        [100, 0.6 * scale],
      ],
    },
  ]);
  return part;
}

async function newProject(name: string): Promise<string> {
  return (await addProject(ws.id, { name, caseTemp: 40, ownerId: ws.members.engineer.id })).id;
}

/** What the browser does: ask for a ticket, PUT the file to the presigned URL. */
async function browserUpload(text: string, cookie = cookies.technician, project = projectId) {
  const res = await call(uploadPost, "POST", {
    cookie,
    params: { id: project },
    body: { fileName: "precharge-run-3.csv", size: Buffer.byteLength(text), purpose: "capture" },
  });
  expect(res.status).toBe(201);
  const ticket = (await res.json()) as { uploadId: string; objectKey: string; url: string };
  const put = await fetch(ticket.url, { method: "PUT", body: text, headers: { "content-type": "text/csv" } });
  expect(put.status).toBe(200);
  return ticket;
}

async function register(text: string, body: Record<string, unknown> = {}, cookie = cookies.technician) {
  const ticket = await browserUpload(text, cookie);
  const mapping = previewCaptureText(text.slice(0, 65_536)).mapping;
  const res = await call(capturesPost, "POST", {
    cookie,
    params: { id: projectId },
    body: { uploadId: ticket.uploadId, name: "Pre-charge, run 3", mapping, ...body },
  });
  return { res, ticket, mapping };
}

async function pendingFor(keys: string[]) {
  return db.select().from(pendingUploads).where(inArray(pendingUploads.objectKey, keys));
}

beforeAll(async () => {
  other = await createTestWorkspace("Elsewhere");
  const otherTechnician = await addMember(ws.id, "technician");
  cookies = {
    technician: await sessionCookie(ws.members.technician.id, ws.id),
    otherTechnician: await sessionCookie(otherTechnician.id, ws.id),
    engineer: await sessionCookie(ws.members.engineer.id, ws.id),
    lead: await sessionCookie(ws.members.lead.id, ws.id),
    outsider: await sessionCookie(other.members.engineer.id, other.id),
  };
  projectId = await newProject("Pre-charge stage");
  secondProjectId = await newProject("Fan driver");
  small = await newPart("PFT-S", 1, network);
  big = await newPart("PFT-B", 10, null);
  await db.insert(projectCandidates).values([
    { projectId, partId: small.id },
    { projectId, partId: big.id },
  ]);
});

afterAll(async () => {
  await deleteWorkspace(other.id);
});

/** Registers, then runs the capture's job here (the queue's worker does the same in the app). */
async function registerAndProcess(text: string, body: Record<string, unknown> = {}) {
  const registered = await register(text, body);
  expect(registered.res.status).toBe(202);
  const answer = await registered.res.json();
  const outcome = await processCaptureJob(storage, answer.capture.id);
  return { ...registered, answer, outcome };
}

async function detail(captureId: string, cookie = cookies.technician) {
  const res = await call(captureGet, "GET", { cookie, params: { id: projectId, captureId } });
  expect(res.status).toBe(200);
  return res.json();
}

describe("capture upload", () => {
  it("answers 202 at once with the queued capture; its job stores the samples, summary, trace, size and SHA-256", async () => {
    const text = inrushCsv();
    const { res, ticket, mapping } = await register(text, { note: "ambient 23 °C", boardSerial: "PC-0042" });
    expect(res.status).toBe(202);
    const body = await res.json();
    expect(body).toEqual({
      capture: { id: expect.any(String), name: "Pre-charge, run 3", status: "queued" },
      jobId: expect.any(String),
    });
    const [queued] = await db.select().from(captures).where(eq(captures.id, body.capture.id));
    expect(queued).toMatchObject({ status: "queued", summary: null, trace: null, sha256: null });
    // The capture keeps its own copy of the CSV from the start; the presigned object is removed.
    expect(queued.objectKey).not.toBe(ticket.objectKey);
    expect((await storage.get(queued.objectKey))?.toString()).toBe(text);
    expect(await storage.head(ticket.objectKey)).toBeNull();
    expect((await detail(body.capture.id)).capture).toMatchObject({ status: "queued", summary: null });

    expect(await processCaptureJob(storage, body.capture.id)).toBe("done");
    const [row] = await db.select().from(captures).where(eq(captures.id, body.capture.id));
    const parsed = parseCaptureText(text, captureMappingSchema.parse(mapping));
    const { summary, trace } = processCapture(parsed);
    expect(row).toMatchObject({
      projectId,
      status: "done",
      error: null,
      attempts: 1,
      samplesKey: samplesKeyOf(ticket.objectKey),
      fileName: "precharge-run-3.csv",
      size: Buffer.byteLength(text),
      sha256: createHash("sha256").update(text).digest("hex"),
      mapping: { ...mapping, skipRows: 4, header: true },
      note: "ambient 23 °C",
      boardSerial: "PC-0042",
      probe: null,
      createdBy: ws.members.technician.id,
    });
    expect(row.summary).toEqual(summary);
    expect(row.summary?.samples).toBe(2000);
    expect(row.trace).toEqual(trace);
    expect((await storage.head(row.samplesKey))?.size).toBe(16 + 24 * 2000);
    expect(await pendingFor([row.objectKey, row.samplesKey])).toEqual([]);
    const samples = await loadCaptureSamples(storage, row);
    for (const key of ["t", "v", "i"] as const) {
      expect(Buffer.from(samples[key].buffer, samples[key].byteOffset, samples[key].byteLength)).toEqual(
        Buffer.from(parsed[key].buffer, parsed[key].byteOffset, parsed[key].byteLength),
      );
    }
    // A job run again for a capture already done changes nothing.
    expect(await processCaptureJob(storage, body.capture.id)).toBe("skipped");
  });

  it("stores each candidate's verdict when the job finishes and e-mails the owner once when one fails", async () => {
    const { answer, outcome } = await registerAndProcess(inrushCsv(1500));
    expect(outcome).toBe("done");
    const body = await detail(answer.capture.id);
    const of = (part: Part) => body.candidates.find((c: { partId: string }) => c.partId === part.id);
    expect(of(small).result).toMatchObject({
      verdict: "fail",
      flags: expect.arrayContaining(["equivalent-rectangle"]),
    });
    expect(of(big).result).toMatchObject({ verdict: "pass", tjPeak: null });
    const mail = await waitForMail(ws.members.engineer.email);
    expect(mail.text).toContain(answer.capture.id);
  });

  it("marks a malformed file failed, saying what and where, without retrying it", async () => {
    const lines = inrushCsv().split("\r\n");
    lines[206] = lines[206].replace(/,[^,]+,/, ",23.97G0,");
    const text = lines.join("\r\n");
    const { answer, outcome, ticket } = await registerAndProcess(text);
    expect(outcome).toBe("failed");
    const body = await detail(answer.capture.id);
    expect(body.capture).toMatchObject({ status: "failed", summary: null, attempts: 1 });
    expect(body.capture.error).toMatch(/^Failed while reading the CSV: .*row 207.*CH1 \(V\)/);
    expect(body.candidates.every((c: { result: unknown }) => c.result === null)).toBe(true);
    expect(await storage.head(ticket.objectKey)).toBeNull();
    expect(await storage.head(samplesKeyOf(ticket.objectKey))).toBeNull();
    expect(await pendingFor([ticket.objectKey, samplesKeyOf(ticket.objectKey)])).toEqual([]);
  });

  it("retries a failure of storage a bounded number of times, then marks the capture failed", async () => {
    const { res } = await register(inrushCsv(100), { name: "storage down" });
    const { capture } = await res.json();
    const down = {
      ...storage,
      head: async () => {
        throw Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" });
      },
    };
    const state = async () => (await db.select().from(captures).where(eq(captures.id, capture.id)))[0];
    for (const retryCount of [0, 1]) {
      await expect(
        processCaptureJob(down, capture.id, { attempt: { retryCount, retryLimit: RETRY_LIMIT } }),
      ).rejects.toThrow("ECONNREFUSED");
      expect(await state()).toMatchObject({
        status: "queued",
        attempts: retryCount + 1,
        error: `Failed while reading the file from storage: an unexpected error (ECONNREFUSED). Try ${retryCount + 1} of ${RETRY_LIMIT + 1}; trying again shortly.`,
      });
    }
    expect(
      await processCaptureJob(down, capture.id, { attempt: { retryCount: 2, retryLimit: RETRY_LIMIT } }),
    ).toBe("failed");
    expect(await state()).toMatchObject({
      status: "failed",
      attempts: 3,
      error:
        "Failed while reading the file from storage: an unexpected error (ECONNREFUSED). Gave up after 3 tries.",
    });
    expect((await detail(capture.id)).capture.status).toBe("failed");
  });

  it("removes the stored samples again when the row cannot be written", async () => {
    const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
    const gone = { ...project, id: crypto.randomUUID() };
    const text = inrushCsv(50);
    const ticket = await presignUpload(storage, {
      workspaceId: ws.id,
      userId: ws.members.technician.id,
      owner: `projects/${gone.id}`,
      fileName: "late-failure.csv",
      size: Buffer.byteLength(text),
      purpose: "capture",
      maxBytes: 200e6,
    });
    await fetch(ticket.url, { method: "PUT", body: text, headers: { "content-type": "text/csv" } });
    const caller = { workspaceId: ws.id, user: { id: ws.members.technician.id } } as Parameters<
      typeof registerCapture
    >[1]["caller"];
    await expect(
      registerCapture(storage, {
        project: gone,
        caller,
        upload: { id: ticket.uploadId, objectKey: ticket.objectKey, fileName: "late-failure.csv" },
        name: "orphan",
        mapping: captureMappingSchema.parse({ time: 0, voltage: 1, current: 2 }),
      }),
    ).rejects.toThrow();
    expect(await storage.head(ticket.objectKey)).toBeNull();
    expect(await storage.head(samplesKeyOf(ticket.objectKey))).toBeNull();
    expect(await pendingFor([ticket.objectKey, samplesKeyOf(ticket.objectKey)])).toEqual([]);
  });

  it("refuses an upload made for another project, and other purposes and sizes at the ticket", async () => {
    const ticket = await browserUpload(inrushCsv(50), cookies.technician, secondProjectId);
    const res = await call(capturesPost, "POST", {
      cookie: cookies.technician,
      params: { id: projectId },
      body: {
        uploadId: ticket.uploadId,
        name: "wrong project",
        mapping: { time: 0, voltage: 1, current: 2 },
      },
    });
    expect(res.status).toBe(404);
    expect(await storage.head(ticket.objectKey)).not.toBeNull();
    const ask = (body: Record<string, unknown>) =>
      call(uploadPost, "POST", {
        cookie: cookies.technician,
        params: { id: projectId },
        body: { fileName: "x.csv", size: 10, purpose: "capture", ...body },
      });
    expect((await ask({ purpose: "curve-set" })).status).toBe(400);
    expect((await ask({ size: 200_000_001 })).status).toBe(413);
    expect((await ask({ fileName: "capture.xlsx" })).status).toBe(400);
  });
});

describe("capture routes", () => {
  let captureId: string;

  beforeAll(async () => {
    const { answer } = await registerAndProcess(inrushCsv(), { name: "for the chart" });
    captureId = answer.capture.id;
  });

  it("GET draws the capture and, per candidate with a Foster network, the engine's Tj through it", async () => {
    const body = await detail(captureId);
    expect(body.capture).not.toHaveProperty("objectKey");
    expect(body.capture).not.toHaveProperty("samplesKey");
    expect(body.capture.trace.t).toHaveLength(2000);
    const [row] = await db.select().from(captures).where(eq(captures.id, captureId));
    const samples = await loadCaptureSamples(storage, row);
    const rise = waveformRise(samples.t, powerFromVI(samples.v, samples.i), network);
    const bySmall = body.candidates.find((c: { partId: string }) => c.partId === small.id);
    expect(bySmall.junction.tjPeak).toBe(40 + rise.maxRise);
    expect(bySmall.junction.tPeak).toBe(rise.maxTime);
    expect(bySmall.junction.trace.t).toEqual(body.capture.trace.t);
    expect(bySmall.result.tjPeak).toBe(40 + rise.maxRise);
    expect(body.candidates.find((c: { partId: string }) => c.partId === big.id).junction).toBeNull();
    const list = await (
      await call(capturesGet, "GET", { cookie: cookies.lead, params: { id: projectId } })
    ).json();
    expect(list.captures.map((c: { id: string }) => c.id)).toContain(captureId);
    expect(list.captures[0]).not.toHaveProperty("trace");
    expect(body.case).toBeNull();
  });

  it("GET heats the case through the project's case path when it applies one, as the check does", async () => {
    const casePath = [{ r: 0.3, tau: 0.05 }];
    await db
      .update(projects)
      .set({ caseNetwork: casePath, applyCaseNetwork: true })
      .where(eq(projects.id, projectId));
    try {
      // A changed case path is an input of the stored results: stale until rechecked.
      expect((await detail(captureId)).stale).toBe(true);
      expect(await recheckCapture(storage, captureId)).toBe(true);
      const res = await call(captureGet, "GET", {
        cookie: cookies.technician,
        params: { id: projectId, captureId },
      });
      const body = await res.json();
      const [row] = await db.select().from(captures).where(eq(captures.id, captureId));
      const samples = await loadCaptureSamples(storage, row);
      const p = powerFromVI(samples.v, samples.i);
      // METHODS.md §14: both networks driven by the same power, so T_j rides on the heated case.
      expect(body.case.tjPeak).toBe(40 + waveformRise(samples.t, p, casePath).maxRise);
      const bySmall = body.candidates.find((c: { partId: string }) => c.partId === small.id);
      expect(bySmall.junction.tjPeak).toBe(
        40 + waveformRise(samples.t, p, [...network, ...casePath]).maxRise,
      );
      expect(bySmall.junction.tjPeak).toBeGreaterThan(40 + waveformRise(samples.t, p, network).maxRise);
    } finally {
      await db.update(projects).set({ applyCaseNetwork: false }).where(eq(projects.id, projectId));
      await recheckCapture(storage, captureId);
    }
  });

  it("viewing a capture and checking its project never read its samples again", async () => {
    const [row] = await db.select().from(captures).where(eq(captures.id, captureId));
    const kept = await storage.get(row.samplesKey);
    await storage.remove(row.samplesKey);
    try {
      const body = await detail(captureId);
      expect(body.stale).toBe(false);
      expect(body.candidates.every((c: { result: unknown }) => c.result !== null)).toBe(true);
      const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
      const checked = await checkProject(project);
      expect(checked.results[small.id][captureId].verdict).toBe(body.candidates[0].result.verdict);
      expect(checked.pendingCaptures).toEqual([]);
    } finally {
      await storage.put(row.samplesKey, kept!);
    }
  });

  it("a candidate added later makes the stored results stale, never shown as current, until a recheck", async () => {
    const late = await newPart("PFT-L", 3, network);
    await db.insert(projectCandidates).values({ projectId, partId: late.id });
    try {
      const body = await detail(captureId);
      expect(body.stale).toBe(true);
      const byLate = body.candidates.find((c: { partId: string }) => c.partId === late.id);
      expect(byLate).toMatchObject({ stale: true, result: null, junction: null });
      // The candidates already checked keep their current results.
      expect(body.candidates.find((c: { partId: string }) => c.partId === small.id).stale).toBe(false);
      const [project] = await db.select().from(projects).where(eq(projects.id, projectId));
      const checked = await checkProject(project);
      expect(checked.pendingCaptures).toContain(captureId);
      expect(checked.results[late.id][captureId]).toBeUndefined();

      expect(await recheckCapture(storage, captureId)).toBe(true);
      const after = await detail(captureId);
      expect(after.stale).toBe(false);
      expect(after.candidates.find((c: { partId: string }) => c.partId === late.id).result.verdict).toMatch(
        /pass|marginal|fail/,
      );
      expect(await recheckCapture(storage, captureId)).toBe(false);

      // A changed project (its case temperature) is an input too.
      await db.update(projects).set({ caseTemp: 60 }).where(eq(projects.id, projectId));
      expect((await detail(captureId)).stale).toBe(true);
      const [hot] = await db.select().from(projects).where(eq(projects.id, projectId));
      const recomputed = await checkProject(hot, { staleCaptures: "recompute" });
      expect(recomputed.pendingCaptures).not.toContain(captureId);
      expect(recomputed.results[small.id][captureId].tjPeak).toBeGreaterThan(
        checked.results[small.id][captureId].tjPeak!,
      );
    } finally {
      await db.update(projects).set({ caseTemp: 40 }).where(eq(projects.id, projectId));
      await db.delete(projectCandidates).where(eq(projectCandidates.partId, late.id));
    }
  });

  it("is a 404 from another workspace, from another project and for a malformed id", async () => {
    const get = (cookie: string, id: string, capture: string) =>
      call(captureGet, "GET", { cookie, params: { id, captureId: capture } });
    expect((await get(cookies.outsider, projectId, captureId)).status).toBe(404);
    expect((await get(cookies.technician, secondProjectId, captureId)).status).toBe(404);
    expect((await get(cookies.technician, projectId, "not-a-uuid")).status).toBe(404);
  });

  it("DELETE is for whoever uploaded it, or a lead; it removes the row and both objects", async () => {
    const [row] = await db.select().from(captures).where(eq(captures.id, captureId));
    const del = (cookie: string, capture = captureId) =>
      call(captureDelete, "DELETE", { cookie, params: { id: projectId, captureId: capture } });
    expect((await del(cookies.otherTechnician)).status).toBe(403);
    expect((await del(cookies.engineer)).status).toBe(403);
    expect((await del(cookies.technician)).status).toBe(200);
    expect(await db.select().from(captures).where(eq(captures.id, captureId))).toEqual([]);
    expect(await storage.head(row.objectKey)).toBeNull();
    expect(await storage.head(row.samplesKey)).toBeNull();
    expect(await pendingFor([row.objectKey, row.samplesKey])).toEqual([]);
    expect((await del(cookies.technician)).status).toBe(404);

    const { res } = await register(inrushCsv(100), { name: "lead removes it" });
    expect((await del(cookies.lead, (await res.json()).capture.id)).status).toBe(200);
  });
});

describe("the job queue", () => {
  it("marks a capture failed, not processing for ever, when its job fails for good without a word", async () => {
    const boss = await jobQueue();
    const { res } = await register(inrushCsv(300), { name: "worker lost" });
    const { capture } = await res.json();
    // No worker runs yet in this process: take every waiting job, as workers that then die would.
    await boss.fetch(CAPTURE_QUEUE, { batchSize: 100 });
    await db.update(captures).set({ status: "processing" }).where(eq(captures.id, capture.id));
    // Its last try, taken and lost: the queue fails it (as it does when the job expires) and gives it up.
    const last = await boss.send(CAPTURE_QUEUE, { captureId: capture.id }, { retryLimit: 0 });
    const [taken] = await boss.fetch(CAPTURE_QUEUE);
    expect(taken.id).toBe(last);
    await boss.fail(CAPTURE_QUEUE, taken.id, { message: "worker lost" });
    await startCaptureWorkers(() => storage, 1);
    await expect
      .poll(async () => (await detail(capture.id)).capture.status, { timeout: 15_000, interval: 200 })
      .toBe("failed");
    expect((await detail(capture.id)).capture.error).toBe(GAVE_UP_WORDS);
  });

  it("a worker of the queue processes a registered capture", async () => {
    await startCaptureWorkers(() => storage, 1);
    const { res } = await register(inrushCsv(300), { name: "through the queue" });
    const { capture } = await res.json();
    await expect
      .poll(async () => (await detail(capture.id)).capture.status, { timeout: 30_000, interval: 100 })
      .toBe("done");
    const body = await detail(capture.id);
    expect(
      body.candidates.find((c: { partId: string }) => c.partId === small.id).result.verdict,
    ).toBeTruthy();
  });
});
