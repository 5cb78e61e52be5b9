// Notices by e-mail, through the outbox and the mail fake: one e-mail per action listing every failing pulse, a
// drifting standing decision told to the project's owner and the lead who signed, and each person's choice honoured.
import { and, eq, gte } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getNotices, PATCH as setNotices } from "@/app/api/account/notices/route";
import { POST as activate } from "@/app/api/parts/[id]/curve-sets/[setId]/activate/route";
import { PUT as thermalPut } from "@/app/api/parts/[id]/thermal/route";
import { POST as signPost } from "@/app/api/projects/[id]/decisions/route";
import { POST as savePost } from "@/app/api/projects/[id]/measurements/route";
import { faultCases, mailOutbox, notices, parts, projectCandidates, projects } from "@/db/schema";
import {
  addCurveSet,
  addPart,
  addProject,
  call,
  sessionCookie,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { type InboxMail, readInbox } from "@/test/services";

const ws = workspaceForFile("Notices");
let partId: string;
const setIds: Record<"generous" | "tight" | "tighter", string> = { generous: "", tight: "", tighter: "" };

// One 1 ms limit line per set; at 24 V they allow about 14.5 A, 1.45 A and 0.72 A (log-log between the points).
const lines = { generous: 1, tight: 10, tighter: 20 } as const;

async function newProject(name: string) {
  const project = await addProject(ws.id, {
    name: `${name} ${crypto.randomUUID().slice(0, 4)}`,
    caseTemp: 25,
  });
  await testDb.db
    .update(projects)
    .set({ ownerId: ws.members.engineer.id })
    .where(eq(projects.id, project.id));
  await testDb.db.insert(projectCandidates).values({ projectId: project.id, partId });
  return project;
}

beforeAll(async () => {
  partId = (await addPart(ws.id, { partNumber: "NT-7", maker: "Notice Devices" })).id;
  for (const [name, divide] of Object.entries(lines) as [keyof typeof lines, number][]) {
    const line = {
      duration: 1e-3,
      points: [
        [1, 100 / divide],
        [10, 40 / divide],
        [60, 5 / divide],
      ] as [number, number][],
    };
    setIds[name] = await addCurveSet(ws.id, partId, [line], {
      active: name === "generous",
      fileName: `${name}.csv`,
    });
  }
});

/** Where the inbox stands before an action, and when: later e-mails and outbox rows are the action's. */
async function mark() {
  return { inbox: (await readInbox()).length, at: new Date() };
}
type Mark = Awaited<ReturnType<typeof mark>>;

/** The e-mails to `address` that arrived after `before`, once at least `expected` have (the fake stores mail late). */
async function newMailTo(address: string, before: Mark, expected: number): Promise<InboxMail[]> {
  const fresh = async () =>
    (await readInbox()).slice(before.inbox).filter((m) => m.to.some((t) => t.address === address));
  await expect
    .poll(async () => (await fresh()).length, { timeout: 5000, interval: 100 })
    .toBeGreaterThanOrEqual(expected);
  return fresh();
}

/**
 * The e-mails to `address` queued after `before`. An action writes its e-mail to the outbox in its own transaction,
 * so once it has answered the outbox tells at once, without waiting on the mail fake, that it sent none.
 */
function queuedFor(address: string, before: Mark) {
  return testDb.db
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.to, address), gte(mailOutbox.createdAt, before.at)));
}

const row = (label: string, i: number) => ({ label, kind: "rect", v: 24, i, duration: 1e-3 });

describe("failing evidence", () => {
  it("one pasted table of five failing rows is one e-mail to the owner, listing all five", async () => {
    const project = await newProject("Batch board");
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const before = await mark();
    const res = await call(savePost, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: {
        rows: [row("F1", 30), row("OK", 2), row("F2", 40), row("F3", 50), row("F4", 60), row("F5", 70)],
      },
    });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.notified).toBe(5);
    const mails = await newMailTo(ws.members.engineer.email, before, 1);
    expect(mails).toHaveLength(1);
    const [mail] = mails;
    expect(mail.subject).toContain("5 new pulses fail");
    for (const label of ["F1", "F2", "F3", "F4", "F5"]) expect(mail.text).toContain(`: ${label} (`);
    expect(mail.text).not.toContain(": OK (");
    // Words and figures as the screens write them (lib/vocabulary.ts, lib/format.ts): the source in the vocabulary's
    // words, quantities with a thin space, utilisation as a percentage with a thin space, verdicts in words.
    expect(mail.text).toContain("Measured pulse: F1 (24\u2009V, 30\u2009A, 1\u2009ms) fails");
    expect(mail.text).toMatch(/: fail \(utilisation \d+\u2009%/);
    expect(mail.text).not.toContain("no-data");
    const failingIds = body.saved.filter((_: string, k: number) => k !== 1);
    for (const id of failingIds) expect(mail.text).toContain(`/projects/${project.id}?pulse=${id}`);
    const queued = await testDb.db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.to, ws.members.engineer.email), eq(mailOutbox.kind, "failing-pulse")));
    expect(queued).toHaveLength(1);
    expect(await testDb.db.select().from(notices).where(eq(notices.workspaceId, ws.id))).toHaveLength(5);
  });

  it("an owner who turned failing-evidence notices off gets none; on again, the next paste mails", async () => {
    const project = await newProject("Quiet board");
    const engineer = await sessionCookie(ws.members.engineer.id, ws.id);
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const off = await call(setNotices, "PATCH", {
      cookie: engineer,
      body: { failingEvidence: false, decisionDrift: true, verificationLapsed: true },
    });
    expect(off.status).toBe(200);
    const read = await (await call(getNotices, "GET", { cookie: engineer })).json();
    expect(read.preferences).toEqual({
      failingEvidence: false,
      decisionDrift: true,
      verificationLapsed: true,
    });

    const before = await mark();
    const quiet = await call(savePost, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: { rows: [row("Q1", 30), row("Q2", 40)] },
    });
    expect((await quiet.json()).notified).toBe(0);
    expect(await queuedFor(ws.members.engineer.email, before)).toHaveLength(0);

    await call(setNotices, "PATCH", {
      cookie: engineer,
      body: { failingEvidence: true, decisionDrift: true, verificationLapsed: true },
    });
    const loud = await call(savePost, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: { rows: [row("L1", 30)] },
    });
    expect((await loud.json()).notified).toBe(1);
    const mails = await newMailTo(ws.members.engineer.email, before, 1);
    expect(mails.map((m) => m.subject)).toEqual([expect.stringContaining('"L1" fails')]);
  });

  it("refuses a preference change without a session or with a malformed body", async () => {
    const engineer = await sessionCookie(ws.members.engineer.id, ws.id);
    expect((await call(setNotices, "PATCH", { body: { failingEvidence: true } })).status).toBe(401);
    expect(
      (await call(setNotices, "PATCH", { cookie: engineer, body: { failingEvidence: "yes" } })).status,
    ).toBe(400);
  });
});

describe("decision drift", () => {
  it("tells the owner and the signing lead once per change, with a link to the decision; choices honoured", async () => {
    const project = await newProject("Drift board");
    await testDb.db.insert(faultCases).values([
      { projectId: project.id, name: "Short", kind: "rect", v: 24, i: 5, duration: 1e-3 },
      { projectId: project.id, name: "Surge", kind: "rect", v: 24, i: 1, duration: 1e-3 },
    ]);
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const signed = await call(signPost, "POST", {
      cookie: lead,
      params: { id: project.id },
      body: { partId, rationale: "Both fault cases pass with margin." },
    });
    expect(signed.status).toBe(201);
    const { decision } = await signed.json();
    const link = `/projects/${project.id}/decisions/${decision.id}#drift`;
    const { engineer: owner, lead: signer } = ws.members;

    // A tighter curve set made active: "Short" now fails. One e-mail each, listing the changed verdict.
    let before = await mark();
    const res = await call(activate, "POST", {
      cookie: lead,
      params: { id: partId, setId: setIds.tight },
    });
    expect(res.status).toBe(200);
    for (const person of [owner, signer]) {
      const mails = await newMailTo(person.email, before, 1);
      expect(mails).toHaveLength(1);
      expect(mails[0].subject).toContain("has drifted");
      expect(mails[0].text).toContain("NT-7 × Short: pass when signed, fail now");
      expect(mails[0].text).not.toContain("Surge");
      expect(mails[0].text).toContain(link);
    }

    // The same change again leaves the same verdicts changed: nobody hears of it twice.
    before = await mark();
    await call(activate, "POST", { cookie: lead, params: { id: partId, setId: setIds.tight } });
    expect(await queuedFor(owner.email, before)).toHaveLength(0);
    expect(await queuedFor(signer.email, before)).toHaveLength(0);

    // The lead turns drift notices off; the next change ("Surge" fails too) reaches the owner only.
    const off = await call(setNotices, "PATCH", {
      cookie: lead,
      body: { failingEvidence: true, decisionDrift: false, verificationLapsed: true },
    });
    expect(off.status).toBe(200);
    before = await mark();
    await call(activate, "POST", { cookie: lead, params: { id: partId, setId: setIds.tighter } });
    const toOwner = await newMailTo(owner.email, before, 1);
    expect(toOwner).toHaveLength(1);
    expect(toOwner[0].text).toContain("Surge: pass when signed, fail now");
    expect(await queuedFor(signer.email, before)).toHaveLength(0);
    const driftRows = await testDb.db
      .select()
      .from(notices)
      .where(and(eq(notices.subjectType, "decision-drift"), eq(notices.subjectId, decision.id)));
    expect(driftRows).toHaveLength(2);
  });
});

describe("verification lapsed", () => {
  it("a verifier who turned these notices off hears nothing when the part returns to draft", async () => {
    const part = await addPart(ws.id, {
      partNumber: "NT-8",
      maker: "Notice Devices",
      status: "verified",
      verifiedBy: ws.members.admin.id,
      verifiedAt: new Date(),
    });
    const admin = await sessionCookie(ws.members.admin.id, ws.id);
    const engineer = await sessionCookie(ws.members.engineer.id, ws.id);
    await call(setNotices, "PATCH", {
      cookie: admin,
      body: { failingEvidence: true, decisionDrift: true, verificationLapsed: false },
    });
    const before = await mark();
    const res = await call(thermalPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { terms: [{ r: 0.5, tau: 0.01 }] },
    });
    expect(res.status).toBe(200);
    const [after] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(after.status).toBe("draft");
    expect(await queuedFor(ws.members.admin.email, before)).toHaveLength(0);
    const queued = await testDb.db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.to, ws.members.admin.email), eq(mailOutbox.kind, "verification-lapsed")));
    expect(queued).toHaveLength(0);
  });
});
