// Credentials do not outlive the changes that should end them: reset links, API tokens and sessions.
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { apiTokens, passwordResets, sessions } from "@/db/schema";
import { newApiToken } from "@/test/api-token";
import { nextAuthClear } from "@/test/auth-clear";
import { smallCheckRequest } from "@/test/check-request";
import { addMember, call, cookiePair, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";
import { mailsTo, waitForMails } from "@/test/services";
import { GET as listTokens } from "../account/tokens/route";
import { POST as checkPost } from "../v1/check/route";
import { POST as forgotPassword } from "./forgot-password/route";
import { POST as resetPassword } from "./reset-password/route";
import { POST as signIn } from "./sign-in/route";
import { POST as signOutEverywhere } from "./sign-out-everywhere/route";

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");
const ws = workspaceForFile("Credentials");

// The smallest valid check contract (METHODS.md §9): one curve, one pulse.
const checkRequest = smallCheckRequest();

/** Asks for `count` reset links for `email`, one after another, and answers their tokens in order. */
async function resetLinks(email: string, count: number): Promise<string[]> {
  for (let k = 0; k < count; k++) {
    expect((await call(forgotPassword, "POST", { body: { email } })).status).toBe(200);
    await waitForMails(email, k + 1);
  }
  return (await mailsTo(email)).map((m) => /\/reset-password\/([A-Za-z0-9_-]+)/.exec(m.text)?.[1] ?? "");
}

const check = (secret: string) => call(checkPost, "POST", { bearer: secret, body: checkRequest });

describe("reset links", () => {
  it("an older link stops working once a newer one is used, and a link lives about an hour", async () => {
    const user = await addMember(ws.id, "engineer");
    const [older, newer] = await resetLinks(user.email, 2);
    const rows = await testDb.db.select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    for (const row of rows) {
      expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeLessThanOrEqual(60 * 60 * 1000 + 5000);
    }
    const body = (token: string) => ({ body: { token, password: "a newer long passphrase" } });
    expect((await call(resetPassword, "POST", body(newer))).status).toBe(200);
    expect((await call(resetPassword, "POST", body(older))).status).toBe(404);
  });
});

describe("API tokens", () => {
  it("stop working after a password reset", async () => {
    const user = await addMember(ws.id, "technician");
    const token = await newApiToken(user.id, ws.id, "bench");
    expect((await check(token.secret)).status).toBe(200);
    const [link] = await resetLinks(user.email, 1);
    const reset = await call(resetPassword, "POST", {
      body: { token: link, password: "reset long passphrase" },
    });
    expect(reset.status).toBe(200);
    expect((await check(token.secret)).status).toBe(401);
  });

  it("stop working after sign-out everywhere", async () => {
    const user = await addMember(ws.id, "technician");
    const token = await newApiToken(user.id, ws.id, "bench");
    const cookie = await sessionCookie(user.id, ws.id);
    expect((await call(signOutEverywhere, "POST", { cookie })).status).toBe(200);
    expect((await check(token.secret)).status).toBe(401);
  });

  it("expire", async () => {
    const user = await addMember(ws.id, "technician");
    const token = await newApiToken(user.id, ws.id, "bench");
    const [row] = await testDb.db.select().from(apiTokens).where(eq(apiTokens.id, token.id));
    expect(row.expiresAt.getTime()).toBeLessThanOrEqual(Date.now() + 91 * 24 * 3600 * 1000);
    await testDb.db
      .update(apiTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(apiTokens.id, token.id));
    expect((await check(token.secret)).status).toBe(401);
  });
});

describe("sessions", () => {
  it("store only the hash of the cookie's token, and the cookie lives days, not 400", async () => {
    const user = await addMember(ws.id, "lead");
    const res = await call(signIn, "POST", {
      body: { email: user.email, password: "correct horse battery" },
    });
    expect(res.status).toBe(200);
    const setCookie = res.headers.get("set-cookie")!;
    const token = cookiePair(setCookie).split("=")[1];
    const rows = await testDb.db.select().from(sessions).where(eq(sessions.userId, user.id));
    expect(rows.map((r) => r.id)).toEqual([sha256(token)]);
    const maxAge = Number(/Max-Age=(\d+)/i.exec(setCookie)?.[1]);
    expect(maxAge).toBeGreaterThan(0);
    expect(maxAge).toBeLessThanOrEqual(30 * 24 * 3600);
  });

  it("end 30 days after sign-in however often they are used", async () => {
    const user = await addMember(ws.id, "lead");
    const cookie = await sessionCookie(user.id, ws.id);
    expect((await call(listTokens, "GET", { cookie })).status).toBe(200);
    // Changed through another connection, as another app process would: heard here through NOTIFY.
    const heard = nextAuthClear();
    await testDb.db
      .update(sessions)
      .set({ createdAt: new Date(Date.now() - 31 * 24 * 3600 * 1000) })
      .where(eq(sessions.userId, user.id));
    await heard;
    expect((await call(listTokens, "GET", { cookie })).status).toBe(401);
  });
});
