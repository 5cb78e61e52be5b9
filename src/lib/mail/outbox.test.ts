// E-mail through the durable outbox with the mail server down (the app's SMTP port points where nothing listens),
// then back: nothing is marked sent before it is, and nothing is lost.
import { and, eq } from "drizzle-orm";
import { describe, expect, it, vi } from "vitest";
import { POST as forgotPassword } from "@/app/api/auth/forgot-password/route";
import { POST as signUp } from "@/app/api/auth/sign-up/route";
import { POST as acceptInvitation } from "@/app/api/invitations/accept/route";
import { POST as saveMeasurements } from "@/app/api/projects/[id]/measurements/route";
import { POST as resend } from "@/app/api/team/invitations/[id]/resend/route";
import { POST as invite } from "@/app/api/team/invitations/route";
import { invitations, mailOutbox, notices } from "@/db/schema";
import { DEMO_PARTS } from "@/lib/demo/parts";
import {
  addDemoCandidate,
  addProject,
  call,
  sessionCookie,
  testDb,
  testPassword,
  workspaceForFile,
} from "@/test/fixtures";
import { waitForMail } from "@/test/services";
import { createMailer } from "./mailer";
import { deliverOutbox, listOutbox, outboxIdle } from "./outbox";

const realSmtpPort = vi.hoisted(() => {
  const port = process.env.SMTP_PORT;
  process.env.SMTP_PORT = "1"; // nothing listens on port 1: the app's mailer is down
  return Number(port);
});
const workingMailer = () =>
  createMailer({ host: "127.0.0.1", port: realSmtpPort, secure: false, from: "Pulsefence <t@example.test>" });
const later = () => new Date(Date.now() + 60 * 60 * 1000);

const ws = workspaceForFile("Outbox");

async function outboxTo(to: string) {
  return testDb.db.select().from(mailOutbox).where(eq(mailOutbox.to, to));
}

describe("with the mail server down", () => {
  it("a failing measurement's notice stays queued, and is sent once mail returns", async () => {
    const project = await addProject(ws.id, {
      name: "Outbox board",
      caseTemp: 25,
      ownerId: ws.members.engineer.id,
    });
    await addDemoCandidate(ws.id, project.id, DEMO_PARTS[0]);
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const res = await call(saveMeasurements, "POST", {
      cookie: tech,
      params: { id: project.id },
      body: { rows: [{ label: "Overload", kind: "rect", v: 40, i: 900, duration: 10e-3 }] },
    });
    expect(res.status).toBe(201);
    await outboxIdle();
    const [pulseId] = (await res.json()).saved;
    expect(await testDb.db.select().from(notices).where(eq(notices.subjectId, pulseId))).toHaveLength(1);
    const [queued] = await outboxTo(ws.members.engineer.email);
    expect(queued).toMatchObject({ status: "pending", kind: "failing-pulse" });
    expect(queued.attempts).toBeGreaterThanOrEqual(1);
    expect(queued.lastError).toBeTruthy();

    const { sent } = await deliverOutbox(workingMailer(), later());
    expect(sent).toBeGreaterThanOrEqual(1);
    const mail = await waitForMail(ws.members.engineer.email);
    expect(mail.subject).toContain('"Overload" fails');
    const [after] = await outboxTo(ws.members.engineer.email);
    expect(after).toMatchObject({ status: "sent", text: "" });
  });

  it("resending an invitation keeps a working link waiting in the outbox, delivered when mail returns", async () => {
    const admin = await sessionCookie(ws.members.admin.id, ws.id);
    const email = `resend-${crypto.randomUUID().slice(0, 8)}@example.test`;
    expect((await call(invite, "POST", { cookie: admin, body: { email, role: "engineer" } })).status).toBe(
      201,
    );
    await outboxIdle();
    const [first] = await testDb.db.select().from(invitations).where(eq(invitations.email, email));
    const resent = await call(resend, "POST", { cookie: admin, params: { id: first.id } });
    expect(resent.status).toBe(201);
    await outboxIdle();
    const open = await testDb.db
      .select()
      .from(invitations)
      .where(and(eq(invitations.email, email)));
    expect(open.filter((i) => !i.revokedAt)).toHaveLength(1);
    expect((await outboxTo(email)).every((m) => m.status === "pending")).toBe(true);

    await deliverOutbox(workingMailer(), later());
    const mail = await waitForMail(email);
    const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
    const accepted = await call(acceptInvitation, "POST", {
      body: { token, name: "Rae Outbox", password: testPassword },
    });
    expect(accepted.status).toBe(200);
  });

  it("forgot-password answers a known and an unknown address alike, each queuing one e-mail, none sent on the request", async () => {
    const known = ws.members.lead.email;
    const unknown = `nobody-${crypto.randomUUID().slice(0, 8)}@example.test`;
    const answers = [];
    for (const email of [known, unknown]) {
      const res = await call(forgotPassword, "POST", { body: { email } });
      answers.push({ status: res.status, body: await res.text(), cookie: res.headers.get("set-cookie") });
    }
    // Mail is down: a known address is not a 503 (nor any other answer than the unknown one's).
    expect(answers[0]).toEqual(answers[1]);
    expect(answers[0].status).toBe(200);
    await outboxIdle();
    for (const email of [known, unknown]) {
      const rows = (await outboxTo(email)).filter((m) => m.kind === "password-reset");
      expect(rows.map((r) => r.status)).toEqual(["pending"]);
    }
  });

  it("sign-up answers a new address and one with an account alike, each queuing one e-mail", async () => {
    const known = ws.members.technician.email;
    const fresh = `new-${crypto.randomUUID().slice(0, 8)}@example.test`;
    const answers = [];
    for (const email of [known, fresh]) {
      const res = await call(signUp, "POST", {
        body: { name: "Ida Probe", email, password: testPassword, workspaceName: "Probe Lab" },
      });
      answers.push({ status: res.status, body: await res.text(), cookie: res.headers.get("set-cookie") });
    }
    expect(answers[0]).toEqual(answers[1]);
    expect(answers[0]).toMatchObject({ status: 202, cookie: null });
    await outboxIdle();
    expect((await outboxTo(known)).filter((m) => m.kind === "sign-up-existing")).toHaveLength(1);
    expect((await outboxTo(fresh)).map((m) => [m.kind, m.status])).toEqual([["sign-up", "pending"]]);
  });

  it("lists the workspace's e-mails and their state for admins, without bodies", async () => {
    const rows = await listOutbox({ workspaceId: ws.id });
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows[0]).not.toHaveProperty("text");
    expect(rows.map((r) => r.status)).toContain("sent");
  });
});
