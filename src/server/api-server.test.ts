// The lean API server answers exactly as the app's route would, over real HTTP: same access checks, same body
// limits, same errors and headers, and the same result for the same request; it serves the check contract, health
// and the API's reads, nothing else.
import { readdirSync, readFileSync } from "node:fs";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiTokens, memberships } from "@/db/schema";
import { whenListening } from "@/lib/auth/auth-memory";
import { newApiToken } from "@/test/api-token";
import { insidePulse, overVoltagePulse, smallCheckRequest } from "@/test/check-request";
import {
  addMember,
  addProject,
  call,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  testDb,
  workspaceForFile,
} from "@/test/fixtures";
import { GET as projectGet } from "../app/api/projects/[id]/route";
import { POST as checkPost } from "../app/api/v1/check/route";
import { createApiServer } from "./api-server";
import { leanRoutes } from "./lean-routes";

const body = smallCheckRequest([insidePulse, overVoltagePulse]);

const ws = workspaceForFile("Lean API");
let server: ReturnType<typeof createApiServer>;
let base: string;
beforeAll(async () => {
  await whenListening();
  server = createApiServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
});

const post = (headers: Record<string, string>, payload: string, path = "/api/v1/check") =>
  fetch(`${base}${path}`, {
    method: "POST",
    headers: { "content-type": "application/json", ...headers },
    body: payload,
  });

describe("the lean API server", () => {
  it("answers a token's check with the route's own result", async () => {
    const user = await addMember(ws.id, "technician");
    const token = await newApiToken(user.id, ws.id, "lean");
    const res = await post({ authorization: `Bearer ${token.secret}` }, JSON.stringify(body));
    expect(res.status).toBe(200);
    const lean = await res.json();
    const viaRoute = await (await call(checkPost, "POST", { bearer: token.secret, body })).json();
    expect(lean).toEqual(viaRoute);
    expect(lean.results.map((r: { verdict: string }) => r.verdict)).toEqual(["pass", "fail"]);
  });

  it("refuses a missing or unknown token with the route's 401", async () => {
    const none = await post({}, JSON.stringify(body));
    expect(none.status).toBe(401);
    expect((await none.json()).error.code).toBe("unauthenticated");
    const unknown = await post({ authorization: "Bearer pf_not-a-token" }, JSON.stringify(body));
    expect(unknown.status).toBe(401);
    expect((await unknown.json()).error.code).toBe("unauthenticated:token");
  });

  it("refuses a revoked token and a removed member", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "lean");
    expect((await post({ authorization: `Bearer ${token.secret}` }, JSON.stringify(body))).status).toBe(200);
    await testDb.db.delete(memberships).where(eq(memberships.userId, user.id));
    await expect
      .poll(async () => (await post({ authorization: `Bearer ${token.secret}` }, "{}")).status, {
        timeout: 6_000,
      })
      .toBe(403);
    await testDb.db.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, token.id));
    await expect
      .poll(async () => (await post({ authorization: `Bearer ${token.secret}` }, "{}")).status, {
        timeout: 6_000,
      })
      .toBe(401);
  });

  it("names the field of invalid input, and bounds the body as the app does", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "lean");
    const auth = { authorization: `Bearer ${token.secret}` };
    const broken = await post(auth, "{");
    expect(broken.status).toBe(400);
    expect((await broken.json()).error.path).toBe("");
    const invalid = await post(auth, JSON.stringify({ ...body, caseTemp: "hot" }));
    expect(invalid.status).toBe(400);
    expect((await invalid.json()).error.path).toBe("caseTemp");
    const huge = await post(auth, JSON.stringify({ ...body, pad: "x".repeat(5 * 1024 * 1024) }));
    expect(huge.status).toBe(413);
  });

  it("answers 64 requests at once, each with its own result", async () => {
    const user = await addMember(ws.id, "engineer");
    const token = await newApiToken(user.id, ws.id, "lean");
    const answers = await Promise.all(
      Array.from({ length: 64 }, async (_, k) => {
        const own = smallCheckRequest([{ ...insidePulse, id: `p${k}` }]);
        const res = await post({ authorization: `Bearer ${token.secret}` }, JSON.stringify(own));
        return { status: res.status, id: (await res.json()).results[0].id };
      }),
    );
    expect(answers).toEqual(Array.from({ length: 64 }, (_, k) => ({ status: 200, id: `p${k}` })));
  });

  it("answers health with the route's probes, for GET and HEAD, with the app's headers", async () => {
    const get = await fetch(`${base}/api/health`);
    expect(get.status).toBe(200);
    expect(await get.json()).toEqual({ db: "ok", storage: "ok", mail: "ok" });
    expect(get.headers.get("cache-control")).toBe("no-store");
    expect(get.headers.get("x-content-type-options")).toBe("nosniff");
    expect(get.headers.get("x-frame-options")).toBe("DENY");
    const head = await fetch(`${base}/api/health`, { method: "HEAD" });
    expect(head.status).toBe(200);
    expect(await head.text()).toBe("");
  });

  it("serves nothing but the check contract, health and reads", async () => {
    const get = await fetch(`${base}/api/v1/check`);
    expect(get.status).toBe(404);
    expect((await get.json()).error.code).toBe("not_found:route");
    expect((await post({}, "{}", "/api/projects")).status).toBe(404);
    const deleted = await fetch(`${base}/api/projects/${crypto.randomUUID()}`, { method: "DELETE" });
    expect(deleted.status).toBe(404);
  });

  it("serves every read the app's route files export, and only those", async () => {
    // The route files on disk whose module exports GET (read from the source, as the framework reads exports).
    const apiDir = path.join(import.meta.dirname, "../app/api");
    const withGet = readdirSync(apiDir, { recursive: true, encoding: "utf8" })
      .filter((file) => path.basename(file) === "route.ts")
      .filter((file) => /export const GET\b/.test(readFileSync(path.join(apiDir, file), "utf8")))
      .map((file) => `/api/${path.dirname(file).split(path.sep).join("/")}`);
    // They run outside the framework here, so none may reach for its request helpers.
    for (const route of withGet) {
      const source = readFileSync(path.join(apiDir, route.slice("/api/".length), "route.ts"), "utf8");
      expect(source, route).not.toMatch(/from "next\/(headers|server)"/);
    }
    const leanReads = leanRoutes.filter((r) => r.method === "GET").map((r) => r.route);
    expect(new Set(leanReads)).toEqual(new Set(withGet));
    expect(leanReads).toHaveLength(withGet.length);
  });

  it("answers a session's read as the route does, and keeps another workspace's out", async () => {
    const own = await addProject(ws.id, { name: "Lean read" });
    const cookie = await sessionCookie(ws.members.technician.id, ws.id);
    const res = await fetch(`${base}/api/projects/${own.id}`, { headers: { cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    const viaRoute = await call(projectGet, "GET", { cookie, params: { id: own.id } });
    expect(await res.json()).toEqual(await viaRoute.json());
    const head = await fetch(`${base}/api/projects/${own.id}`, { method: "HEAD", headers: { cookie } });
    expect(head.status).toBe(200);
    expect(await head.text()).toBe("");
    expect((await fetch(`${base}/api/projects/${own.id}`)).status).toBe(401);
    const other = await createTestWorkspace("Lean other");
    try {
      const foreign = await sessionCookie(other.members.lead.id, other.id);
      const refused = await fetch(`${base}/api/projects/${own.id}`, { headers: { cookie: foreign } });
      expect(refused.status).toBe(404);
      expect((await refused.json()).error.code).toBe("not_found:project");
    } finally {
      await deleteWorkspace(other.id);
    }
  });

  it("sends a path with a trailing slash to the one without, as the app does", async () => {
    const res = await fetch(`${base}/api/projects/?archived=true`, { redirect: "manual" });
    expect(res.status).toBe(308);
    expect(res.headers.get("location")).toBe("/api/projects?archived=true");
  });
});
