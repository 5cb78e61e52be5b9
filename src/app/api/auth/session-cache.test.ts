// Sessions, memberships and the switcher's workspace list are remembered for a few seconds per process
// (src/lib/auth/auth-cache.ts). These tests hold the rules on the real database: a remembered session is served
// without asking again; a change made by another process (here: another connection, not this process's routes)
// reaches this one through the triggers' NOTIFY (drizzle/0014) and is seen at once after it is heard; a remembered
// session past its expiry is read again, and the database's answer stands.
import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { memberships, sessions, users, workspaces } from "@/db/schema";
import { AUTH_CHANNEL } from "@/lib/auth/auth-cache";
import {
  rememberedMembers,
  rememberedMembership,
  rememberedWorkspaces,
  whenListening,
} from "@/lib/auth/auth-memory";
import type { GuardedHandler } from "@/lib/auth/guard";
import { lucia } from "@/lib/auth/lucia";
import { validateSessionCookie } from "@/lib/auth/session";
import { hashToken } from "@/lib/auth/tokens";
import { nextAuthClear } from "@/test/auth-clear";
import {
  addMember,
  call,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  type TestWorkspace,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { GET as listProjects } from "../projects/route";

const ws = workspaceForFile("Session cache");
let other: TestWorkspace;
beforeAll(async () => {
  other = await createTestWorkspace("Session cache other");
  await whenListening();
});
afterEach(() => {
  vi.restoreAllMocks();
  vi.useRealTimers();
});
afterAll(async () => {
  await deleteWorkspace(other.id);
});

/**
 * The notifications on the auth channel committed while `change` ran, in commit order: read on a connection of the
 * test's own between two marker notifications sent before and after it.
 */
async function notificationsDuring(change: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  let ended: () => void = () => {};
  const end = new Promise<void>((resolve) => (ended = resolve));
  const marker = crypto.randomUUID();
  const listening = await testDb.sql.listen(AUTH_CHANNEL, (payload) => {
    if (payload === `end ${marker}`) ended();
    else seen.push(payload);
  });
  await testDb.sql`select pg_notify(${AUTH_CHANNEL}, ${`start ${marker}`})`;
  await change();
  await testDb.sql`select pg_notify(${AUTH_CHANNEL}, ${`end ${marker}`})`;
  await end;
  await listening.unlisten();
  return seen.slice(seen.indexOf(`start ${marker}`) + 1);
}

/** The session row's id (the hash of the cookie's token). */
function sessionId(cookie: string): string {
  return hashToken(cookie.slice(cookie.indexOf("=") + 1));
}

describe("remembered sessions", () => {
  it("are served without asking the database again", async () => {
    const user = await addMember(ws.id, "engineer");
    const cookie = await sessionCookie(user.id, ws.id);
    const asked = vi.spyOn(lucia, "validateSession");
    const first = await validateSessionCookie(cookie);
    const second = await validateSessionCookie(cookie);
    expect(first?.user.id).toBe(user.id);
    expect(second).toEqual({ ...first, setCookie: null });
    expect(asked).toHaveBeenCalledTimes(1);
  });

  it("are read once for the requests that miss at the same moment (an expiry under load), a renewal sent to each", async () => {
    const user = await addMember(ws.id, "engineer");
    const cookie = await sessionCookie(user.id, ws.id);
    // Due a renewal (sliding expiry): the one shared read renews it, and every request sends the renewed cookie.
    await testDb.db
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() + 60_000) })
      .where(eq(sessions.id, sessionId(cookie)));
    const asked = vi.spyOn(lucia, "validateSession");
    const answers = await Promise.all(Array.from({ length: 12 }, () => validateSessionCookie(cookie)));
    expect(asked).toHaveBeenCalledTimes(1);
    expect(new Set(answers.map((answer) => answer?.user.id))).toEqual(new Set([user.id]));
    const renewed = `${lucia.sessionCookieName}=`;
    expect(answers.every((answer) => answer?.setCookie?.startsWith(renewed))).toBe(true);
  });

  it("end once another process deletes the session (sign-out elsewhere), and a route answers 401", async () => {
    const user = await addMember(ws.id, "engineer");
    const cookie = await sessionCookie(user.id, ws.id);
    expect((await call(listProjects as unknown as GuardedHandler, "GET", { cookie })).status).toBe(200);
    const heard = nextAuthClear();
    await testDb.db.delete(sessions).where(eq(sessions.id, sessionId(cookie)));
    await heard;
    expect(await validateSessionCookie(cookie)).toBeNull();
    expect((await call(listProjects as unknown as GuardedHandler, "GET", { cookie })).status).toBe(401);
  });

  it("end once another process expires them", async () => {
    const user = await addMember(ws.id, "engineer");
    const cookie = await sessionCookie(user.id, ws.id);
    expect(await validateSessionCookie(cookie)).not.toBeNull();
    const heard = nextAuthClear();
    await testDb.db
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(sessions.id, sessionId(cookie)));
    await heard;
    expect(await validateSessionCookie(cookie)).toBeNull();
  });

  it("follow a move to another workspace made by another process", async () => {
    const user = await addMember(ws.id, "engineer");
    const cookie = await sessionCookie(user.id, ws.id);
    expect((await validateSessionCookie(cookie))?.workspaceId).toBe(ws.id);
    const heard = nextAuthClear();
    await testDb.db
      .update(sessions)
      .set({ workspaceId: other.id })
      .where(eq(sessions.id, sessionId(cookie)));
    await heard;
    expect((await validateSessionCookie(cookie))?.workspaceId).toBe(other.id);
  });

  it("are read again once past their expiry, and the database's answer stands", async () => {
    const user = await addMember(ws.id, "engineer");
    const cookie = await sessionCookie(user.id, ws.id);
    const remembered = await validateSessionCookie(cookie);
    expect(remembered).not.toBeNull();
    const [row] = await testDb.db
      .select()
      .from(sessions)
      .where(eq(sessions.id, sessionId(cookie)));
    // Only the wall clock moves (the memory's TTL runs on performance.now()): the entry is still remembered.
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(row.expiresAt.getTime() + 1000);
    const asked = vi.spyOn(lucia, "validateSession");
    expect(await validateSessionCookie(cookie)).toBeNull();
    expect(asked).toHaveBeenCalledTimes(1);
  });
});

describe("remembered memberships and workspace lists", () => {
  it("show a workspace's new name once another process renames it", async () => {
    const user = await addMember(ws.id, "engineer");
    expect((await rememberedMembership(ws.id, user.id))?.workspaceName).toBe(ws.name);
    expect((await rememberedWorkspaces(user.id)).map((w) => w.name)).toEqual([ws.name]);
    const heard = nextAuthClear();
    const renamed = `${ws.name} (renamed)`;
    await testDb.db.update(workspaces).set({ name: renamed }).where(eq(workspaces.id, ws.id));
    await heard;
    expect((await rememberedMembership(ws.id, user.id))?.workspaceName).toBe(renamed);
    expect((await rememberedWorkspaces(user.id)).map((w) => w.name)).toEqual([renamed]);
    await testDb.db.update(workspaces).set({ name: ws.name }).where(eq(workspaces.id, ws.id));
  });

  it("list a workspace's members as another process changes a role, a name or removes one", async () => {
    const user = await addMember(ws.id, "engineer");
    const find = async () => (await rememberedMembers(ws.id)).find((m) => m.userId === user.id);
    expect((await find())?.role).toBe("engineer");
    expect(Object.isFrozen(await rememberedMembers(ws.id))).toBe(true);
    let heard = nextAuthClear();
    await testDb.db.update(memberships).set({ role: "lead" }).where(eq(memberships.userId, user.id));
    await heard;
    expect((await find())?.role).toBe("lead");
    heard = nextAuthClear();
    await testDb.db.update(users).set({ name: "Renamed Member" }).where(eq(users.id, user.id));
    await heard;
    expect((await find())?.name).toBe("Renamed Member");
    heard = nextAuthClear();
    await testDb.db.delete(memberships).where(eq(memberships.userId, user.id));
    await heard;
    expect(await find()).toBeUndefined();
  });

  it("are not cleared by a new session (a sign-in notifies nothing)", async () => {
    const user = await addMember(ws.id, "engineer");
    const heard = await notificationsDuring(() => sessionCookie(user.id, ws.id));
    expect(heard).toEqual([]);
    // The same watch sees a change that does notify.
    const renamed = await notificationsDuring(() =>
      testDb.db.update(workspaces).set({ name: ws.name }).where(eq(workspaces.id, ws.id)),
    );
    expect(renamed).toEqual([""]);
  });
});
