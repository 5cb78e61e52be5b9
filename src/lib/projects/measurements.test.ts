// Bench evidence: paste → preview verdicts → save in one transaction → one e-mail per failing pulse.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE as deleteMeasurement } from "@/app/api/projects/[id]/measurements/[measurementId]/route";
import { POST as previewPost } from "@/app/api/projects/[id]/measurements/preview/route";
import { POST as savePost } from "@/app/api/projects/[id]/measurements/route";
import { mailOutbox, measuredPulses, projectCandidates } from "@/db/schema";
import {
  addCurveSet,
  addPart,
  addProject,
  call,
  sessionCookie,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { waitForMail } from "@/test/services";

const ws = workspaceForFile("Bench");
let projectId: string;

beforeAll(async () => {
  const project = await addProject(ws.id, {
    name: `Bench evidence ${crypto.randomUUID().slice(0, 4)}`,
    caseTemp: 25,
    ownerId: ws.members.engineer.id,
  });
  projectId = project.id;
  const part = await addPart(ws.id, { partNumber: "BN-1", maker: "Bench Devices" });
  await addCurveSet(ws.id, part.id, [
    {
      duration: 1e-3,
      points: [
        [1, 100],
        [10, 40],
        [60, 5],
      ],
    },
    {
      duration: 1e-2,
      points: [
        [1, 60],
        [10, 16],
        [60, 2],
      ],
    },
  ]);
  await testDb.db.insert(projectCandidates).values({ projectId, partId: part.id });
});

const paste = [
  "label\tV_DS [V]\tI_D [A]\tt_p",
  "P1\t12\t5\t1 ms",
  "P2\t24\t40\t1 ms",
  "P3\t30\tabc\t1 ms",
  "P4\t48\t1\t5 ms",
  "P5\t20\t10\t2 ms",
].join("\r\n");

describe("measured pulses", () => {
  it("previews every row with its problems and its verdict on each candidate, saving nothing", async () => {
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const res = await call(previewPost, "POST", {
      cookie,
      params: { id: projectId },
      body: { text: paste },
    });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.rows).toHaveLength(5);
    const [candidate] = body.candidates;
    const verdict = (label: string) =>
      body.rows.find((r: { label: string }) => r.label === label).verdicts[candidate.partId]?.verdict;
    expect(verdict("P1")).toBe("pass");
    expect(verdict("P2")).toBe("fail");
    expect(body.rows.find((r: { label: string }) => r.label === "P3").errors[0].message).toMatch(
      /row 4, column I_D \[A\]/,
    );
    expect(
      await testDb.db.select().from(measuredPulses).where(eq(measuredPulses.projectId, projectId)),
    ).toEqual([]);
  });

  it("saves the rows in one transaction, attributed, and e-mails the owner exactly once per failing pulse", async () => {
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const rows = [
      { label: "Q1", kind: "rect", v: 12, i: 5, duration: 1e-3 },
      { label: "Q2", kind: "rect", v: 24, i: 40, duration: 1e-3 },
    ];
    const res = await call(savePost, "POST", {
      cookie,
      params: { id: projectId },
      body: { rows, note: "after rework", boardSerial: "TW-0042", probe: "100:1 diff, 30 A clamp" },
    });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.saved).toHaveLength(2);
    expect(body.notified).toBe(1);
    const mail = await waitForMail(ws.members.engineer.email);
    expect(mail.subject).toContain('"Q2" fails');
    const link = /http\S+\/projects\/[0-9a-f-]+\?pulse=[0-9a-f-]+/.exec(mail.text)?.[0];
    expect(link).toContain(`/projects/${projectId}?pulse=${body.saved[1]}`);
    const saved = await testDb.db
      .select()
      .from(measuredPulses)
      .where(eq(measuredPulses.projectId, projectId));
    expect(saved.map((r) => [r.label, r.createdBy, r.boardSerial])).toEqual([
      ["Q1", ws.members.technician.id, "TW-0042"],
      ["Q2", ws.members.technician.id, "TW-0042"],
    ]);
    // Saving more evidence re-checks the project but never mails about Q2 again. Mail exists only as an outbox row
    // written in the saving transaction, so once the answer is in, the outbox holds every e-mail it will ever send.
    const again = await call(savePost, "POST", {
      cookie,
      params: { id: projectId },
      body: { rows: [rows[0]] },
    });
    expect(again.status).toBe(201);
    expect((await again.json()).notified).toBe(0);
    const toOwner = await testDb.db
      .select({ subject: mailOutbox.subject })
      .from(mailOutbox)
      .where(eq(mailOutbox.to, ws.members.engineer.email));
    expect(toOwner.map((m) => m.subject)).toEqual([mail.subject]);
  });

  it("saves nothing when one row is invalid", async () => {
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const count = async () =>
      (await testDb.db.select().from(measuredPulses).where(eq(measuredPulses.projectId, projectId))).length;
    const n = await count();
    const res = await call(savePost, "POST", {
      cookie,
      params: { id: projectId },
      body: {
        rows: [
          { label: "ok", kind: "rect", v: 1, i: 1, duration: 1e-3 },
          { label: "bad", kind: "rect", v: -1, i: 1, duration: 1e-3 },
        ],
      },
    });
    expect(res.status).toBe(400);
    expect(await count()).toBe(n);
  });

  it("lets a technician delete their own rows but not another's; a lead deletes any", async () => {
    const [other] = await testDb.db
      .insert(measuredPulses)
      .values({
        projectId,
        label: "E1",
        kind: "rect",
        v: 5,
        i: 1,
        duration: 1e-3,
        createdBy: ws.members.engineer.id,
      })
      .returning();
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const denied = await call(deleteMeasurement, "DELETE", {
      cookie: tech,
      params: { id: projectId, measurementId: other.id },
    });
    expect(denied.status).toBe(403);
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const ok = await call(deleteMeasurement, "DELETE", {
      cookie: lead,
      params: { id: projectId, measurementId: other.id },
    });
    expect(ok.status).toBe(200);
  });
});

describe("bench scripts", () => {
  it("post measurements with an API token and get each verdict back", async () => {
    const { POST: createToken } = await import("@/app/api/account/tokens/route");
    const { POST: v1Save } = await import("@/app/api/v1/projects/[id]/measurements/route");
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const { token } = await (await call(createToken, "POST", { cookie, body: { name: "rig 1" } })).json();
    const res = await call(v1Save, "POST", {
      bearer: token.secret,
      params: { id: projectId },
      body: { rows: [{ label: "R1", kind: "rect", v: 12, i: 5, duration: 1e-3 }], boardSerial: "TW-9" },
    });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.verdicts[0]).toMatchObject({ worst: "pass", byCandidate: { "BN-1": { verdict: "pass" } } });
  });

  it("post their instrument's table with a column mapping; an unread repetition column or key is refused", async () => {
    const { POST: createToken } = await import("@/app/api/account/tokens/route");
    const { POST: v1Save } = await import("@/app/api/v1/projects/[id]/measurements/route");
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const { token } = await (await call(createToken, "POST", { cookie, body: { name: "rig 2" } })).json();
    const post = (body: unknown) =>
      call(v1Save, "POST", { bearer: token.secret, params: { id: projectId }, body });
    const table = "Acq;Vds max;Id max;+Width;rep spacing [ms];Mean\n7;12,5 V;5 A;1 ms;50;2 A\n";

    const unread = await post({ text: table });
    expect(unread.status).toBe(400);
    const refused = await unread.json();
    expect(refused.error.message).toBe(
      "The table was not saved: column rep spacing [ms]: the column is not read: it looks like repetition, and " +
        "reading the pulses without it would check a train as a single pulse; choose what it holds under Columns, " +
        "or leave it out",
    );
    expect(refused.error.details.issues).toHaveLength(2);

    const saved = await post({ text: table, mapping: { 4: "period", 5: "skip" }, boardSerial: "TW-9" });
    expect(saved.status).toBe(201);
    const [row] = await testDb.db.select().from(measuredPulses).where(eq(measuredPulses.label, "7"));
    expect(row).toMatchObject({ v: 12.5, i: 5, duration: 1e-3, repeatPeriod: 0.05, repeatCount: null });

    const key = await post({
      rows: [{ label: "R2", kind: "rect", v: 12, i: 5, duration: 1e-3, repeatPeriod: 0.05 }],
    });
    expect(key.status).toBe(400);
    expect((await key.json()).error.message).toContain(
      "'repeatPeriod' is not read: give repetition as repeat",
    );
  });
});
