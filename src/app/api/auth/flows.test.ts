// Long file: every account flow (sign-up, sign-in, invitations, reset, tokens, secrets) on the same handlers and fixtures.
// The account flows end to end through the real route handlers, PostgreSQL and the mail fake.
import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeEach, describe, expect, it } from "vitest";
import { apiTokens, invitations, memberships, sessions, users } from "@/db/schema";
import { smallCheckRequest } from "@/test/check-request";
import {
  call,
  cookiePair,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  type TestWorkspace,
  testDb,
  testPassword,
} from "@/test/fixtures";
import { waitForMail, waitForMails } from "@/test/services";
import { POST as changePassword } from "../account/password/route";
import { DELETE as revokeToken } from "../account/tokens/[id]/route";
import { POST as createToken, GET as listTokens } from "../account/tokens/route";
import { GET as health } from "../health/route";
import { POST as acceptInvitation } from "../invitations/accept/route";
import { POST as invite, GET as listInvitations } from "../team/invitations/route";
import { POST as checkPost } from "../v1/check/route";
import { POST as forgotPassword } from "./forgot-password/route";
import { POST as resetPassword } from "./reset-password/route";
import { POST as signIn } from "./sign-in/route";
import { POST as signOutEverywhere } from "./sign-out-everywhere/route";
import { POST as confirmSignUp } from "./sign-up/confirm/route";
import { POST as signUp } from "./sign-up/route";

const unique = () => crypto.randomUUID().slice(0, 8);
const linkToken = (text: string, path: string) =>
  new RegExp(`${path}/([A-Za-z0-9_-]+)`).exec(text)?.[1] ?? "";

/** The latest e-mail to `address` whose subject matches (the fake stores mail asynchronously). */
async function mailTo(address: string, subject: RegExp) {
  return (await waitForMails(address, 1, { subject })).at(-1)!;
}

/** Each test gets its own workspace (one member of each role, all on `testPassword`), so none sees another's changes. */
let ws: TestWorkspace;
beforeEach(async () => {
  ws = await createTestWorkspace("Flows");
});
afterEach(async () => {
  await deleteWorkspace(ws.id);
});
afterAll(async () => {
  await testDb.sql.end();
});

/** Signs up a new address and confirms it by the e-mailed link; returns the address and the confirm response. */
async function signUpAndConfirm(label: string) {
  const email = `${label}-${unique()}@example.test`;
  const body = { name: "Mara Quill", email, password: testPassword, workspaceName: "Quill Bench Lab" };
  const requested = await call(signUp, "POST", { body });
  const token = linkToken((await mailTo(email, /Finish creating/)).text, "/sign-up/confirm");
  const confirmed = await call(confirmSignUp, "POST", { body: { token } });
  return { email, body, requested, confirmed, token };
}

describe("sign-up and sign-in", () => {
  it("answers a new address and one with an account alike, and creates the account only by the e-mailed link", async () => {
    const email = `founder-${unique()}@example.test`;
    const body = { name: "Mara Quill", email, password: testPassword, workspaceName: "Quill Bench Lab" };
    const fresh = await call(signUp, "POST", { body });
    expect(fresh.status).toBe(202);
    expect(fresh.headers.get("set-cookie")).toBeNull();
    const freshBody = await fresh.text();
    expect(await testDb.db.select().from(users).where(eq(users.email, email))).toHaveLength(0);

    const token = linkToken((await mailTo(email, /Finish creating/)).text, "/sign-up/confirm");
    const confirmed = await call(confirmSignUp, "POST", { body: { token } });
    expect(confirmed.status).toBe(201);
    const cookie = cookiePair(confirmed.headers.get("set-cookie")!);
    expect(confirmed.headers.get("set-cookie")).toMatch(/HttpOnly/i);
    expect(confirmed.headers.get("set-cookie")).toMatch(/SameSite=Lax/i);
    const tokens = await call(listTokens, "GET", { cookie });
    expect(tokens.status).toBe(200);
    expect((await call(confirmSignUp, "POST", { body: { token } })).status).toBe(404);
    const [created] = await testDb.db.select().from(users).where(eq(users.email, email));
    const founded = await testDb.db.select().from(memberships).where(eq(memberships.userId, created.id));
    expect(founded.map((m) => [m.role, m.leadRights])).toEqual([["admin", true]]);

    // The same address again: the same status and body, no session, no second account or workspace; the owner
    // is told by e-mail, with a reset link that works.
    const again = await call(signUp, "POST", { body: { ...body, workspaceName: "Other" } });
    expect(again.status).toBe(202);
    expect(again.headers.get("set-cookie")).toBeNull();
    expect(await again.text()).toBe(freshBody);
    expect(await testDb.db.select().from(users).where(eq(users.email, email))).toHaveLength(1);
    expect(await testDb.db.select().from(memberships).where(eq(memberships.userId, created.id))).toHaveLength(
      1,
    );
    const told = await mailTo(email, /tried to sign up/);
    const resetToken = linkToken(told.text, "/reset-password");
    expect(told.text).not.toContain("/sign-up/confirm/");
    expect(
      (await call(resetPassword, "POST", { body: { token: resetToken, password: "after a sign-up try" } }))
        .status,
    ).toBe(200);
  });

  it("names the invalid fields of a sign-up", async () => {
    const res = await call(signUp, "POST", {
      body: { name: "", email: "not-an-address", password: "short" },
    });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.error.details.fieldErrors).sort()).toEqual([
      "email",
      "name",
      "password",
      "workspaceName",
    ]);
  });

  it("answers the 6th failed sign-in within 15 minutes with 429 and Retry-After", async () => {
    const ip = `10.${unique().length}.0.${Math.floor(Math.random() * 250)}-${unique()}`;
    const headers = { "x-forwarded-for": ip };
    for (let k = 0; k < 5; k++) {
      const res = await call(signIn, "POST", {
        body: { email: ws.members.engineer.email, password: "wrong" },
        headers,
      });
      expect(res.status).toBe(401);
    }
    const sixth = await call(signIn, "POST", {
      body: { email: ws.members.engineer.email, password: testPassword },
      headers,
    });
    expect(sixth.status).toBe(429);
    const retryAfter = Number(sixth.headers.get("retry-after"));
    expect(retryAfter).toBeGreaterThan(800);
    expect(retryAfter).toBeLessThanOrEqual(900);
  });

  it("without a proxy's client address, one person's failures do not lock out another", async () => {
    for (let k = 0; k < 6; k++) {
      await call(signIn, "POST", {
        body: { email: `victim-${unique()}@example.test`, password: "wrong" },
      });
      await call(signIn, "POST", { body: { email: ws.members.admin.email, password: "wrong guess" } });
    }
    const other = await call(signIn, "POST", {
      body: { email: ws.members.lead.email, password: testPassword },
    });
    // Without a trusted client address the throttle keys on the account alone: the lead's right password works.
    expect(other.status).toBe(200);
    const locked = await call(signIn, "POST", {
      body: { email: ws.members.admin.email, password: testPassword },
    });
    expect(locked.status).toBe(429);
  });

  it("signs in with the right password", async () => {
    const res = await call(signIn, "POST", {
      body: { email: ws.members.technician.email, password: testPassword },
      headers: { "x-forwarded-for": `ip-${unique()}` },
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("set-cookie")).toMatch(/^pulsefence_session=/);
  });
});

describe("invitations", () => {
  it("e-mails a link that works once, and never after expiry", async () => {
    const admin = await sessionCookie(ws.members.admin.id, ws.id);
    const email = `new-tech-${unique()}@example.test`;
    const res = await call(invite, "POST", { cookie: admin, body: { email, role: "technician" } });
    expect(res.status).toBe(201);
    const mail = await waitForMail(email);
    expect(mail.subject).toContain(ws.name);
    const token = linkToken(mail.text, "/invite");
    expect(token.length).toBeGreaterThan(20);
    const listed = await call(listInvitations, "GET", { cookie: admin });
    expect((await listed.json()).invitations.map((i: { email: string }) => i.email)).toContain(email);

    const accepted = await call(acceptInvitation, "POST", {
      body: { token, name: "Ivo Brandt", password: testPassword },
    });
    expect(accepted.status).toBe(200);
    const second = await call(acceptInvitation, "POST", {
      body: { token, name: "Ivo Brandt", password: testPassword },
    });
    expect(second.status).toBe(404);

    const late = `late-${unique()}@example.test`;
    await call(invite, "POST", { cookie: admin, body: { email: late, role: "engineer" } });
    const lateToken = linkToken((await waitForMail(late)).text, "/invite");
    await testDb.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invitations.email, late));
    const expired = await call(acceptInvitation, "POST", {
      body: { token: lateToken, name: "Late", password: testPassword },
    });
    expect(expired.status).toBe(404);
  });

  it("keeps one open invitation per address: a second invitation replaces the first", async () => {
    const admin = await sessionCookie(ws.members.admin.id, ws.id);
    const email = `twice-${unique()}@example.test`;
    await call(invite, "POST", { cookie: admin, body: { email, role: "technician" } });
    await call(invite, "POST", { cookie: admin, body: { email, role: "engineer" } });
    const listed = await (await call(listInvitations, "GET", { cookie: admin })).json();
    const mine = listed.invitations.filter((i: { email: string }) => i.email === email);
    expect(mine).toHaveLength(1);
    expect(mine[0].role).toBe("engineer");
  });

  it("refuses a lead handing out the admin role, and a technician inviting at all", async () => {
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const res = await call(invite, "POST", {
      cookie: lead,
      body: { email: `x-${unique()}@example.test`, role: "admin" },
    });
    expect(res.status).toBe(403);
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const denied = await call(invite, "POST", {
      cookie: tech,
      body: { email: `y-${unique()}@example.test`, role: "technician" },
    });
    expect(denied.status).toBe(403);
  });
});

describe("password reset", () => {
  it("resets once by e-mailed link and signs out every session", async () => {
    const user = ws.members.lead;
    const before = await sessionCookie(user.id, ws.id);
    const res = await call(forgotPassword, "POST", {
      body: { email: user.email },
      headers: { "x-forwarded-for": `ip-${unique()}` },
    });
    expect(res.status).toBe(200);
    const token = linkToken((await waitForMail(user.email)).text, "/reset-password");
    const newPassword = "a brand new passphrase";
    expect((await call(resetPassword, "POST", { body: { token, password: newPassword } })).status).toBe(200);
    expect((await call(resetPassword, "POST", { body: { token, password: newPassword } })).status).toBe(404);
    expect((await call(listTokens, "GET", { cookie: before })).status).toBe(401);
    const signedIn = await call(signIn, "POST", {
      body: { email: user.email, password: newPassword },
      headers: { "x-forwarded-for": `ip-${unique()}` },
    });
    expect(signedIn.status).toBe(200);
  });

  it("answers an unknown e-mail the same way; its e-mail says no account uses the address", async () => {
    const email = `nobody-${unique()}@example.test`;
    const res = await call(forgotPassword, "POST", {
      body: { email },
      headers: { "x-forwarded-for": `ip-${unique()}` },
    });
    expect(res.status).toBe(200);
    const mail = await mailTo(email, /Reset your Pulsefence password/);
    expect(mail.text).toContain("no account uses it");
    expect(mail.text).not.toContain("/reset-password/");
  });

  it("a password change ends the user's other sessions but keeps this one", async () => {
    const user = ws.members.engineer;
    const other = await sessionCookie(user.id, ws.id);
    const mine = await sessionCookie(user.id, ws.id);
    const res = await call(changePassword, "POST", {
      cookie: mine,
      body: { currentPassword: testPassword, newPassword: "another long passphrase" },
    });
    expect(res.status).toBe(200);
    expect((await call(listTokens, "GET", { cookie: other })).status).toBe(401);
    expect((await call(listTokens, "GET", { cookie: mine })).status).toBe(200);
  });
});

describe("API tokens", () => {
  const request = smallCheckRequest();

  it("authenticates POST /api/v1/check with a bearer token until it is revoked", async () => {
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const created = await call(createToken, "POST", { cookie, body: { name: "bench 3" } });
    expect(created.status).toBe(201);
    const { token } = await created.json();
    expect(token.secret).toMatch(/^pf_/);

    const ok = await call(checkPost, "POST", { bearer: token.secret, body: request });
    expect(ok.status).toBe(200);
    const body = await ok.json();
    expect(body.results).toHaveLength(1);
    expect(body.results[0]).toMatchObject({ id: "p1", verdict: expect.any(String), derating: 1 });

    const listed = await call(listTokens, "GET", { cookie });
    expect(JSON.stringify(await listed.json())).not.toContain(token.secret);

    expect((await call(revokeToken, "DELETE", { cookie, params: { id: token.id } })).status).toBe(200);
    expect((await call(checkPost, "POST", { bearer: token.secret, body: request })).status).toBe(401);
  });

  it("answers an invalid check request 400 with the field path", async () => {
    const cookie = await sessionCookie(ws.members.engineer.id, ws.id);
    const res = await call(checkPost, "POST", { cookie, body: { ...request, caseTemp: "hot" } });
    expect(res.status).toBe(400);
    expect((await res.json()).error.path).toBe("caseTemp");
  });

  it("refuses a bearer token outside /api/v1", async () => {
    const cookie = await sessionCookie(ws.members.engineer.id, ws.id);
    const { token } = await (await call(createToken, "POST", { cookie, body: { name: "misuse" } })).json();
    expect((await call(listInvitations, "GET", { bearer: token.secret })).status).toBe(401);
  });
});

describe("secrets", () => {
  it("sign-out everywhere ends every session of the user", async () => {
    const user = ws.members.admin;
    const one = await sessionCookie(user.id, ws.id);
    const two = await sessionCookie(user.id, ws.id);
    expect((await call(signOutEverywhere, "POST", { cookie: one })).status).toBe(200);
    expect((await call(listTokens, "GET", { cookie: two })).status).toBe(401);
  });

  it("no response of the account flows contains a password hash, a token hash or another user's session id", async () => {
    // The flows run here, each response kept whole (headers but the session cookie, and body).
    const seen: string[] = [];
    const statuses: number[] = [];
    const record = async (res: Response) => {
      statuses.push(res.status);
      const headers = [...res.headers.entries()].filter(([k]) => k !== "set-cookie");
      seen.push(`${headers.join("\n")}\n${await res.clone().text()}`);
      return res;
    };
    const founder = await signUpAndConfirm("secret-founder");
    await record(founder.requested);
    const founderCookie = cookiePair((await record(founder.confirmed)).headers.get("set-cookie")!);
    await record(await call(listTokens, "GET", { cookie: founderCookie }));
    await record(
      await call(signIn, "POST", {
        body: { email: ws.members.technician.email, password: testPassword },
        headers: { "x-forwarded-for": `ip-${unique()}` },
      }),
    );
    const admin = await sessionCookie(ws.members.admin.id, ws.id);
    const invitee = `secret-invitee-${unique()}@example.test`;
    await record(await call(invite, "POST", { cookie: admin, body: { email: invitee, role: "engineer" } }));
    await record(await call(listInvitations, "GET", { cookie: admin }));
    const inviteToken = linkToken((await waitForMail(invitee)).text, "/invite");
    await record(
      await call(acceptInvitation, "POST", {
        body: { token: inviteToken, name: "Ivo Brandt", password: testPassword },
      }),
    );
    const tech = await sessionCookie(ws.members.technician.id, ws.id);
    const created = await record(await call(createToken, "POST", { cookie: tech, body: { name: "bench" } }));
    const { token } = await created.json();
    await record(await call(checkPost, "POST", { bearer: token.secret, body: smallCheckRequest() }));
    await record(await call(listTokens, "GET", { cookie: tech }));
    await record(await call(health, "GET"));
    // Every step succeeded, so the search below covers the answers that carry accounts, links and tokens.
    expect(statuses).toEqual([202, 201, 200, 200, 201, 200, 200, 201, 200, 200, 200]);

    const hashes = (await testDb.db.select({ h: users.passwordHash }).from(users)).map((r) => r.h);
    const tokenHashes = [
      ...(await testDb.db.select({ h: apiTokens.tokenHash }).from(apiTokens)).map((r) => r.h),
      ...(await testDb.db.select({ h: invitations.tokenHash }).from(invitations)).map((r) => r.h),
    ];
    const sessionIds = (await testDb.db.select({ id: sessions.id }).from(sessions)).map((r) => r.id);
    expect(hashes.length * tokenHashes.length * sessionIds.length).toBeGreaterThan(0);
    const all = seen.join("\n");
    for (const secret of [...hashes, ...tokenHashes, ...sessionIds]) expect(all.includes(secret)).toBe(false);
    expect(all).not.toMatch(/\$argon2id\$/);
  });
});
