// The in-process memory of API tokens, sessions and memberships (auth-cache.ts): how long it remembers, what clears it, and
// that a database read racing a clear is not remembered. A hand-driven clock, no timers.
import { describe, expect, it } from "vitest";
import { AUTH_CACHE_TTL_MS, AuthCache, LAST_USED_INTERVAL_MS } from "./auth-cache";

function clock() {
  let now = 1_000;
  return { now: () => now, advance: (ms: number) => (now += ms) };
}

const user = { id: "u1", email: "u@example.test", name: "U" };
const token = { id: "t1", workspaceId: "w1", user };
const member = { role: "admin", leadRights: true, workspaceName: "W" } as const;
const session = { userId: "u1", workspaceId: "w1", expiresAt: 9e12, createdAt: 0, user };

describe("AuthCache", () => {
  it("remembers a token for at most the TTL (5 s), then asks again", () => {
    const time = clock();
    const cache = new AuthCache(time);
    expect(AUTH_CACHE_TTL_MS).toBe(5_000);
    cache.rememberToken("h", token, cache.generation());
    expect(cache.token("h")).toEqual({ value: token });
    time.advance(AUTH_CACHE_TTL_MS - 1);
    expect(cache.token("h")).toEqual({ value: token });
    time.advance(2);
    expect(cache.token("h")).toBeUndefined();
  });

  it("remembers a session and a workspace list for at most the TTL too", () => {
    const time = clock();
    const cache = new AuthCache(time);
    cache.rememberSession("s", session, cache.generation());
    cache.rememberWorkspaces("u1", [{ id: "w1", name: "W", role: "admin" }], cache.generation());
    time.advance(AUTH_CACHE_TTL_MS - 1);
    expect(cache.session("s")).toEqual(session);
    expect(cache.workspaces("u1")).toEqual([{ id: "w1", name: "W", role: "admin" }]);
    time.advance(2);
    expect(cache.session("s")).toBeUndefined();
    expect(cache.workspaces("u1")).toBeUndefined();
  });

  it("remembers an unknown token as null (a flood of bad tokens does not reach the database each time)", () => {
    const cache = new AuthCache(clock());
    cache.rememberToken("bad", null, cache.generation());
    expect(cache.token("bad")).toEqual({ value: null });
  });

  it("forgets every token, session, membership and workspace list at a clear, and tells its listeners", () => {
    const cache = new AuthCache(clock());
    cache.rememberToken("h", token, cache.generation());
    cache.rememberMembership(
      "w1",
      "u1",
      { ...member, role: "engineer", leadRights: false },
      cache.generation(),
    );
    cache.rememberSession("s", session, cache.generation());
    cache.rememberWorkspaces("u1", [{ id: "w1", name: "W", role: "engineer" }], cache.generation());
    expect(cache.session("s")).toEqual(session);
    expect(cache.workspaces("u1")).toHaveLength(1);
    let heard = 0;
    const stop = cache.onClear(() => heard++);
    cache.clear();
    expect(cache.token("h")).toBeUndefined();
    expect(cache.membership("w1", "u1")).toBeUndefined();
    expect(cache.session("s")).toBeUndefined();
    expect(cache.workspaces("u1")).toBeUndefined();
    expect(heard).toBe(1);
    stop();
    cache.clear();
    expect(heard).toBe(1);
  });

  it("drops a read that started before a clear (a revocation racing a lookup leaves nothing behind)", () => {
    const cache = new AuthCache(clock());
    const before = cache.generation();
    cache.clear();
    cache.rememberToken("h", token, before);
    cache.rememberMembership("w1", "u1", member, before);
    cache.rememberSession("s", session, before);
    cache.rememberWorkspaces("u1", [], before);
    expect(cache.token("h")).toBeUndefined();
    expect(cache.membership("w1", "u1")).toBeUndefined();
    expect(cache.session("s")).toBeUndefined();
    expect(cache.workspaces("u1")).toBeUndefined();
  });

  it("remembers nothing while disabled (not listening for changes)", () => {
    const cache = new AuthCache(clock(), { enabled: false });
    cache.rememberToken("h", token, cache.generation());
    expect(cache.token("h")).toBeUndefined();
    cache.enabled = true;
    expect(cache.token("h")).toBeUndefined();
  });

  it("has last_used_at written at most once a minute per token, whatever the clears", () => {
    const time = clock();
    const cache = new AuthCache(time);
    expect(cache.lastUsedDue("t1")).toBe(true);
    expect(cache.lastUsedDue("t1")).toBe(false);
    cache.clear();
    time.advance(LAST_USED_INTERVAL_MS - 1);
    expect(cache.lastUsedDue("t1")).toBe(false);
    expect(cache.lastUsedDue("t2")).toBe(true);
    time.advance(1);
    expect(cache.lastUsedDue("t1")).toBe(true);
  });
});
