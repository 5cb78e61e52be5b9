// The smaller holes: login CSRF, open redirects after sign-in, spreadsheet formulas in the matrix CSV, non-ASCII
// download names, throttled reset links and archived projects, through the real route handlers.
import { describe, expect, it } from "vitest";
import { safeNext } from "@/app/(auth)/_components/safe-next";
import { POST as resetPassword } from "@/app/api/auth/reset-password/route";
import { POST as signIn } from "@/app/api/auth/sign-in/route";
import { POST as archivePost } from "@/app/api/projects/[id]/archive/route";
import { POST as faultCasePost } from "@/app/api/projects/[id]/fault-cases/route";
import { GET as matrixGet } from "@/app/api/projects/[id]/matrix/route";
import { faultCases } from "@/db/schema";
import { DEMO_PARTS } from "@/lib/demo/parts";
import { contentSecurityPolicy } from "@/proxy";
import {
  addDemoCandidate,
  addProject,
  appUrl,
  call,
  sessionCookie,
  testDb,
  testPassword,
  workspaceForFile,
} from "@/test/fixtures";

const ws = workspaceForFile("Holes");

describe("login CSRF", () => {
  it("a cross-origin text/plain sign-in gets 403 and no session", async () => {
    const req = new Request(new URL("/api/auth/sign-in", appUrl), {
      method: "POST",
      headers: { origin: "https://evil.example", "content-type": "text/plain" },
      body: JSON.stringify({ email: ws.members.engineer.email, password: testPassword }),
    });
    const res = await signIn(req, { params: Promise.resolve({}) });
    expect(res.status).toBe(403);
    expect(res.headers.get("set-cookie")).toBeNull();
  });

  it("a same-origin sign-in still works", async () => {
    const res = await call(signIn, "POST", {
      body: { email: ws.members.lead.email, password: testPassword },
    });
    expect(res.status).toBe(200);
  });
});

describe("the redirect after sign-in", () => {
  it("refuses targets the browser would resolve to another origin", () => {
    for (const target of [
      "/\t/evil.example",
      "//evil.example",
      "/\\evil.example",
      "/\n/evil.example",
      "https://evil.example",
    ]) {
      expect(safeNext(target)).toBeNull();
    }
  });

  it("keeps paths of this site", () => {
    expect(safeNext("/projects/abc?tab=bench")).toBe("/projects/abc?tab=bench");
  });
});

describe("the matrix CSV", () => {
  it("escapes cells a spreadsheet would run as formulas, and names the file in UTF-8 too", async () => {
    const project = await addProject(ws.id, { name: "Prüfstand 試験", caseTemp: 25 });
    await addDemoCandidate(ws.id, project.id, DEMO_PARTS[0]);
    await testDb.db.insert(faultCases).values({
      projectId: project.id,
      name: '=HYPERLINK("https://evil.example","x")',
      kind: "rect",
      v: 48,
      i: 10,
      duration: 1e-3,
    });
    const cookie = await sessionCookie(ws.members.engineer.id, ws.id);
    const res = await call(matrixGet, "GET", { cookie, params: { id: project.id } });
    expect(res.status).toBe(200);
    const csv = await res.text();
    expect(csv).not.toMatch(/(^|,)"?=HYPERLINK/m);
    expect(csv).toContain("'=HYPERLINK");
    const disposition = res.headers.get("content-disposition") ?? "";
    expect(disposition).toMatch(/filename="[\x20-\x7e]+"/);
    expect(disposition).toContain(`filename*=UTF-8''${encodeURIComponent("Prüfstand-試験")}`);
  });
});

describe("reset links", () => {
  it("tries with one link are throttled", async () => {
    const token = `bogus-${crypto.randomUUID()}`;
    const statuses: number[] = [];
    for (let k = 0; k < 7; k++) {
      const res = await call(resetPassword, "POST", {
        body: { token, password: "a long new passphrase" },
      });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5)).toEqual([404, 404, 404, 404, 404]);
    expect(statuses.slice(5)).toEqual([429, 429]);
  });
});

describe("archived projects", () => {
  it("refuse changes with 409 until restored", async () => {
    const project = await addProject(ws.id, { name: "Old board", caseTemp: 25 });
    const cookie = await sessionCookie(ws.members.engineer.id, ws.id);
    const body = { name: "Short", kind: "rect", v: "48", i: "10", duration: "1 ms" };
    const archive = (archived: boolean) =>
      call(archivePost, "POST", { cookie, params: { id: project.id }, body: { archived } });
    expect((await archive(true)).status).toBe(200);
    const refused = await call(faultCasePost, "POST", { cookie, params: { id: project.id }, body });
    expect(refused.status).toBe(409);
    expect((await archive(false)).status).toBe(200);
    const accepted = await call(faultCasePost, "POST", { cookie, params: { id: project.id }, body });
    expect(accepted.status).toBe(201);
  });
});

describe("the content security policy", () => {
  it("allows only nonce'd scripts, no framing, and uploads to the storage origin", () => {
    const policy = contentSecurityPolicy("abc", "http://127.0.0.1:9579", false);
    expect(policy).toContain("script-src 'self' 'nonce-abc' 'strict-dynamic'");
    expect(policy).not.toContain("unsafe-eval");
    expect(policy).toContain("frame-ancestors 'none'");
    expect(policy).toContain("connect-src 'self' http://127.0.0.1:9579");
  });
});
