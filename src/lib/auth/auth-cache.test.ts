// The in-process memory of API tokens, sessions and memberships (auth-cache.ts): how long it remembers, what clears it, and
// that a database read racing a clear is not remembered. A hand-driven clock, no timers.
import { describe, expect, it } from "vitest";
import { AUTH_CACHE_TTL_MS, AuthCache, LAST_USED_INTERVAL_MS, SHARED_READ_MS } from "./auth-cache";

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

  it("shares one read among requests that miss at once, and starts afresh once it is done", async () => {
    const cache = new AuthCache(clock());
    const gate = deferred<string>();
    let reads = 0;
    const read = () => {
      reads++;
      return gate.promise;
    };
    const first = cache.sharedRead("token:h", read);
    const second = cache.sharedRead("token:h", read);
    const other = cache.sharedRead("token:other", async () => "other");
    gate.resolve("row");
    expect(await Promise.all([first, second, other])).toEqual(["row", "row", "other"]);
    expect(reads).toBe(1);
    await cache.sharedRead("token:h", async () => "again");
    expect(await cache.sharedRead("token:h", async () => "once more")).toBe("once more");
  });

  it("never lets a request after a clear join a read from before it (a revocation is seen at once)", async () => {
    const cache = new AuthCache(clock());
    const before = deferred<string>();
    const old = cache.sharedRead("token:h", () => before.promise);
    cache.clear();
    const after = cache.sharedRead("token:h", async () => "revoked");
    before.resolve("live");
    expect(await old).toBe("live");
    expect(await after).toBe("revoked");
    // The read from before the clear, ending last, does not remove the newer one from the reads in flight.
    const late = deferred<string>();
    const newer = cache.sharedRead("token:k", () => late.promise);
    cache.clear();
    const newest = deferred<string>();
    const third = cache.sharedRead("token:k", () => newest.promise);
    late.resolve("a");
    await newer;
    expect(cache.sharedRead("token:k", async () => "joined? no")).toBe(third);
    newest.resolve("b");
    expect(await third).toBe("b");
  });

  it("lets a read be joined only in its first second: one that hangs holds up no one after that", async () => {
    const time = clock();
    const cache = new AuthCache(time);
    const hung = deferred<string>();
    const first = cache.sharedRead("membership:w:u", () => hung.promise);
    time.advance(SHARED_READ_MS - 1);
    expect(cache.sharedRead("membership:w:u", async () => "own")).toBe(first);
    time.advance(1);
    expect(await cache.sharedRead("membership:w:u", async () => "own")).toBe("own");
    hung.resolve("late");
    expect(await first).toBe("late");
  });

  it("hands a failed read to every request that shared it, and the next request reads again", async () => {
    const cache = new AuthCache(clock());
    const gate = deferred<string>();
    const a = cache.sharedRead("session:s", () => gate.promise);
    const b = cache.sharedRead("session:s", () => gate.promise);
    gate.reject(new Error("database down"));
    await expect(a).rejects.toThrow("database down");
    await expect(b).rejects.toThrow("database down");
    expect(await cache.sharedRead("session:s", async () => "back")).toBe("back");
  });

  it("shares nothing while disabled (not listening for changes)", async () => {
    const cache = new AuthCache(clock(), { enabled: false });
    let reads = 0;
    const read = async () => ++reads;
    await Promise.all([cache.sharedRead("token:h", read), cache.sharedRead("token:h", read)]);
    expect(reads).toBe(2);
  });
});

function deferred<T>() {
  let resolve!: (value: T) => void;
  let reject!: (error: Error) => void;
  const promise = new Promise<T>((ok, fail) => {
    resolve = ok;
    reject = fail;
  });
  return { promise, resolve, reject };
}
