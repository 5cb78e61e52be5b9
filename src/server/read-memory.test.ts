// The lean API server's memory of reads (page-cache.ts with `answers: "reads"`): first with a stand-in handler that
// counts its answers, then on the real server and database, where it must never show one member's or workspace's
// answer to another, nor an answer from before a change.
import { createServer, type Server, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { projects } from "@/db/schema";
import { authCache, whenListening } from "@/lib/auth/auth-memory";
import { SESSION_COOKIE } from "@/lib/auth/cookie-name";
import { freshNonce } from "@/lib/nonce";
import {
  addMember,
  addProject,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { createApiServer } from "./api-server";
import { answerVersion } from "./data-version";
import { answersFile } from "./lean-routes";
import { type Handler, PAGE_CACHE_HEADER, requestKey, withPageCache } from "./page-cache";

const listen = async (server: Server) => {
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
};
const close = (server: Server) => new Promise((resolve) => server.close(resolve));

describe("kept reads, with a stand-in", () => {
  let answers = 0;
  let answer: (res: ServerResponse) => void;
  let server: Server;
  let origin: string;
  beforeEach(async () => {
    answers = 0;
    answer = (res) => {
      res.setHeader("content-type", "application/json");
      res.end(JSON.stringify({ answer: answers }));
    };
    const handler: Handler = (_req, res) => {
      answers++;
      answer(res);
    };
    server = createServer(
      withPageCache(handler, {
        version: async () => "1:1:",
        sessionCookie: "pf_session",
        nonce: freshNonce,
        ttlMs: 5_000,
        maxBytes: 1024 * 1024,
        answers: "reads",
      }),
    );
    origin = await listen(server);
  });
  afterEach(() => close(server));

  const get = async (path: string, headers: Record<string, string>) => {
    const res = await fetch(`${origin}${path}`, { headers });
    return { status: res.status, body: await res.text(), served: res.headers.get(PAGE_CACHE_HEADER) };
  };

  it("answers a read asked again in the same state once, byte for byte, for a session or a token", async () => {
    for (const headers of [{ cookie: "pf_session=a" }, { authorization: "Bearer t" }] as Record<
      string,
      string
    >[]) {
      const first = await get("/api/projects", headers);
      const second = await get("/api/projects", headers);
      expect([first.served, second.served]).toEqual(["miss", "hit"]);
      expect(second.body).toBe(first.body);
    }
    expect(answers).toBe(2);
  });

  it("never keeps health, pages, anonymous reads, or answers that are not 200 JSON without a cookie set", async () => {
    await get("/api/health", { cookie: "pf_session=a" });
    await get("/api/health", { cookie: "pf_session=a" });
    await get("/projects", { cookie: "pf_session=a" });
    await get("/api/parts", {});
    await get("/api/parts", { cookie: "other=1" });
    expect(answers).toBe(5);
    for (const change of [
      (res: ServerResponse) => res.setHeader("set-cookie", "pf_session=b"),
      (res: ServerResponse) => (res.statusCode = 404),
      (res: ServerResponse) => res.setHeader("content-type", "text/csv"),
    ]) {
      const before = answers;
      answer = (res) => {
        res.setHeader("content-type", "application/json");
        change(res);
        res.end("{}");
      };
      await get("/api/parts/1", { cookie: "pf_session=a" });
      await get("/api/parts/1", { cookie: "pf_session=a" });
      expect(answers - before).toBe(2);
    }
  });
});

describe("requestKey for reads", () => {
  const req = (url: string, headers: Record<string, string>) =>
    ({ method: "GET", url, headers }) as unknown as Parameters<typeof requestKey>[0];
  it("keys on who asks and from where, and keeps nothing without a session or a token", () => {
    const base = { host: "h", cookie: "pf_session=a" };
    const keys = [
      requestKey(req("/api/parts", base), "pf_session", "reads"),
      requestKey(req("/api/parts", { ...base, cookie: "pf_session=b" }), "pf_session", "reads"),
      requestKey(req("/api/parts", { ...base, authorization: "Bearer x" }), "pf_session", "reads"),
      requestKey(req("/api/parts", { ...base, origin: "https://elsewhere.example" }), "pf_session", "reads"),
      requestKey(req("/api/parts", { ...base, "sec-fetch-site": "cross-site" }), "pf_session", "reads"),
    ];
    expect(new Set(keys).size).toBe(5);
    expect(requestKey(req("/api/parts", { host: "h" }), "pf_session", "reads")).toBeNull();
    expect(requestKey(req("/api/health", base), "pf_session", "reads")).toBeNull();
    expect(requestKey(req("/api/health?x=1", base), "pf_session", "reads")).toBeNull();
    expect(requestKey(req("/library", base), "pf_session", "reads")).toBeNull();
    // A bearer token alone is a read's credential, never a page's.
    expect(
      requestKey(req("/library", { host: "h", authorization: "Bearer x" }), "pf_session", "pages"),
    ).toBeNull();
  });
});

describe("kept reads on the lean API server and the real database", () => {
  const ws = workspaceForFile("Read memory");
  let other: Awaited<ReturnType<typeof createTestWorkspace>>;
  let server: Server;
  let base: string;
  const state = answerVersion(process.env.DATABASE_URL ?? "");
  beforeAll(async () => {
    await whenListening();
    other = await createTestWorkspace("Read memory other");
    server = createApiServer({
      version: state.version,
      sessionCookie: SESSION_COOKIE,
      nonce: freshNonce,
      ttlMs: 5_000,
      maxBytes: 8 * 1024 * 1024,
    });
    base = await listen(server);
  });
  afterAll(async () => {
    await close(server);
    await state.end();
    await deleteWorkspace(other.id);
  });

  const read = async (path: string, cookie: string) => {
    const res = await fetch(`${base}${path}`, { headers: { cookie } });
    return { status: res.status, body: await res.json(), served: res.headers.get(PAGE_CACHE_HEADER) };
  };
  /**
   * `path` read twice, again until the second is sent from memory, at most 10 times: any write anywhere in the
   * database between the two (the job queue's upkeep, another test's fixtures) is a new state, rightly a miss.
   */
  const readTwice = async (path: string, cookie: string) => {
    for (let attempt = 1; ; attempt++) {
      const first = await read(path, cookie);
      const again = await read(path, cookie);
      if (again.served === "hit" || attempt === 10) return [first, again];
    }
  };

  it("gives each member and workspace its own answer, and a changed project at the next read", async () => {
    const engineer = await sessionCookie((await addMember(ws.id, "engineer")).id, ws.id);
    const outsider = await sessionCookie((await addMember(other.id, "engineer")).id, other.id);
    const project = await addProject(ws.id, { name: "Kept read", caseTemp: 60 });
    const path = `/api/projects/${project.id}`;
    const [first, again] = await readTwice(path, engineer);
    expect([first.status, again.status, again.served]).toEqual([200, 200, "hit"]);
    expect(again.body).toEqual(first.body);
    // Another workspace's member asks the very same path in the same state: the route's own 404, not a replay.
    const foreign = await read(path, outsider);
    expect([foreign.status, foreign.served]).toEqual([404, "miss"]);
    await testDb.db.update(projects).set({ name: "Kept read, renamed" }).where(eq(projects.id, project.id));
    const after = await read(path, engineer);
    expect([after.served, after.body.project.name]).toEqual(["miss", "Kept read, renamed"]);
  });

  it("answers again once this process's auth memory is cleared (a sign-out or role change heard of)", async () => {
    const engineer = await sessionCookie((await addMember(ws.id, "engineer")).id, ws.id);
    const [, kept] = await readTwice("/api/projects", engineer);
    authCache.clear();
    expect([kept.served, (await read("/api/projects", engineer)).served]).toEqual(["hit", "miss"]);
  });

  it("neither keeps nor waits on reads that answer a file", () => {
    expect(answersFile("/api/projects/p1/matrix")).toBe(true);
    expect(answersFile("/api/projects/p1/decisions/d1/report?download=1")).toBe(true);
    expect(answersFile("/api/projects/p1/decisions/d1/csv")).toBe(true);
    expect(answersFile("/api/parts/x/curve-sets/y/file")).toBe(true);
    expect(answersFile("/api/projects/p1")).toBe(false);
    expect(answersFile("/api/projects/p1/decisions/d1")).toBe(false);
  });
});
