// API tokens are remembered for a few seconds per process (src/lib/auth/auth-cache.ts). These tests hold the rules
// on the real database: a change made by another process (here: another connection, not this process's routes)
// reaches this one through the triggers' NOTIFY and ends the access within the stated TTL; last_used_at is
// written off the response path at most once a minute; a wrong workspace is still a 404.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { apiTokens, memberships } from "@/db/schema";
import { authCache, whenListening } from "@/lib/auth/auth-memory";
import { settleTokenWrites } from "@/lib/auth/token-auth";
import { newApiToken } from "@/test/api-token";
import { nextAuthClear } from "@/test/auth-clear";
import { smallCheckRequest } from "@/test/check-request";
import {
  addMember,
  addProject,
  call,
  createTestWorkspace,
  deleteWorkspace,
  type TestWorkspace,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { POST as checkPost } from "../v1/check/route";
import { POST as postMeasurements } from "../v1/projects/[id]/measurements/route";

const checkRequest = smallCheckRequest();

const ws = workspaceForFile("Token cache");
let other: TestWorkspace;
beforeAll(async () => {
  other = await createTestWorkspace("Token cache other");
  await whenListening();
});
afterAll(async () => {
  await deleteWorkspace(other.id);
});

const check = (secret: string) => call(checkPost, "POST", { bearer: secret, body: checkRequest });

describe("remembered API tokens", () => {
  it("listen for changes, so they are remembered at all", () => {
    expect(authCache.enabled).toBe(true);
  });

  it("answer 401 once another process revokes the token (heard through NOTIFY, within the TTL)", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "cache");
    expect((await check(token.secret)).status).toBe(200);
    // Remembered now: the second answer needs no database.
    expect((await check(token.secret)).status).toBe(200);
    const heard = nextAuthClear();
    // Another connection, as another app process would: this process's routes do not clear anything.
    await testDb.db.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, token.id));
    await heard;
    expect((await check(token.secret)).status).toBe(401);
  });

  it("answer 403 once another process removes the member, and 200 again for a member re-added", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "cache");
    expect((await check(token.secret)).status).toBe(200);
    const heard = nextAuthClear();
    await testDb.db.delete(memberships).where(eq(memberships.userId, user.id));
    await heard;
    expect((await check(token.secret)).status).toBe(403);
  });

  it("are not cleared by a last_used_at write (no notification for it)", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "cache");
    let cleared = 0;
    const stop = authCache.onClear(() => cleared++);
    await testDb.db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, token.id));
    // A statement that does notify, after it: once it is heard, the earlier write would have been too.
    const heard = nextAuthClear();
    await testDb.db.update(apiTokens).set({ revokedAt: null }).where(eq(apiTokens.id, token.id));
    await heard;
    stop();
    expect(cleared).toBe(1);
  });

  it("have last_used_at written after the answer, once, not at every request", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "cache");
    const lastUsed = async () =>
      (await testDb.db.select().from(apiTokens).where(eq(apiTokens.id, token.id)))[0].lastUsedAt;
    expect(await lastUsed()).toBeNull();
    expect((await check(token.secret)).status).toBe(200);
    await settleTokenWrites();
    const first = await lastUsed();
    expect(first).toBeInstanceOf(Date);
    for (let k = 0; k < 5; k++) expect((await check(token.secret)).status).toBe(200);
    await settleTokenWrites();
    expect((await lastUsed())?.getTime()).toBe(first?.getTime());
  });

  it("still answer 404 for a project of another workspace, remembered or not", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "cache");
    const foreign = await addProject(other.id, { name: "Elsewhere", caseTemp: 60 });
    for (let k = 0; k < 2; k++) {
      const res = await call(postMeasurements, "POST", {
        bearer: token.secret,
        params: { id: foreign.id },
        body: { pulses: [] },
      });
      expect(res.status).toBe(404);
    }
  });

  it("are read once, not once per request, when many requests miss at the same moment", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "cache");
    authCache.clear(); // nothing remembered, as when the entries expire under load
    const reads: string[] = [];
    const shared = authCache.sharedRead.bind(authCache);
    const spy = vi.spyOn(authCache, "sharedRead").mockImplementation((key, read) =>
      shared(key, () => {
        reads.push(key.split(":")[0]);
        return read();
      }),
    );
    try {
      const answers = await Promise.all(Array.from({ length: 24 }, () => check(token.secret)));
      expect(answers.map((res) => res.status)).toEqual(Array(24).fill(200));
    } finally {
      spy.mockRestore();
    }
    // One token lookup and one membership lookup for all 24 (an expired entry under load costs the same).
    expect(reads.sort()).toEqual(["membership", "token"]);
  });
});
