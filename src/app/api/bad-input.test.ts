// Bad input answers 4xx, never 5xx: NUL characters, deep nesting and oversized bodies, through real route handlers.
import { beforeAll, describe, expect, it } from "vitest";
import { POST as tokenPost } from "@/app/api/account/tokens/route";
import { POST as signUp } from "@/app/api/auth/sign-up/route";
import { POST as partPost } from "@/app/api/parts/route";
import { POST as faultCasePost } from "@/app/api/projects/[id]/fault-cases/route";
import { POST as projectPost } from "@/app/api/projects/route";
import { POST as invitePost } from "@/app/api/team/invitations/route";
import { POST as checkPost } from "@/app/api/v1/check/route";
import {
  addProject,
  appUrl,
  call,
  type RouteHandler,
  sessionCookie,
  workspaceForFile,
} from "@/test/fixtures";

const ws = workspaceForFile("Fuzz");
let admin: string;
let projectId: string;
beforeAll(async () => {
  admin = await sessionCookie(ws.members.admin.id, ws.id);
  const project = await addProject(ws.id, { name: "Fuzz board", caseTemp: 25 });
  projectId = project.id;
});

const nul = "bad\u0000value";
const part = {
  partNumber: "FZ-1",
  maker: "Fuzz Devices",
  technology: "si-mosfet",
  package: "TO-220",
  vdsMax: "80",
  tjMax: "175",
};
const faultCase = { name: "Short", kind: "rect", v: "48", i: "10", duration: "1 ms" };

// Every text field of these forms, each with a NUL character in turn.
const cases: {
  name: string;
  handler: RouteHandler;
  params?: Record<string, string>;
  body: Record<string, unknown>;
  field: string;
  cookie?: boolean;
}[] = [
  ...["name", "email", "password", "workspaceName"].map((field) => ({
    name: `sign-up ${field}`,
    handler: signUp,
    body: {
      name: "Ada Fuzz",
      email: `fz-${crypto.randomUUID().slice(0, 6)}@example.test`,
      password: "long enough pw",
      workspaceName: "Fuzz lab",
    },
    field,
    cookie: false,
  })),
  ...["name", "description"].map((field) => ({
    name: `project ${field}`,
    handler: projectPost,
    body: { name: "P", description: "d" },
    field,
  })),
  ...["partNumber", "maker", "package", "datasheetRevision", "notes"].map((field) => ({
    name: `part ${field}`,
    handler: partPost,
    body: { ...part, partNumber: `FZ-${crypto.randomUUID().slice(0, 6)}` },
    field,
  })),
  ...["name", "notes"].map((field) => ({
    name: `fault case ${field}`,
    handler: faultCasePost,
    params: { id: "" },
    body: faultCase,
    field,
  })),
  { name: "token name", handler: tokenPost, body: { name: "bench" }, field: "name" },
  {
    name: "invitation email",
    handler: invitePost,
    body: { email: "x@example.test", role: "engineer" },
    field: "email",
  },
];

describe("a NUL character in a text field", () => {
  for (const c of cases) {
    it(`${c.name}: 400, never 500`, async () => {
      const params = c.params ? { id: projectId } : undefined;
      const res = await call(c.handler, "POST", {
        cookie: c.cookie === false ? undefined : admin,
        params,
        body: { ...c.body, [c.field]: nul },
      });
      expect(res.status).toBe(400);
    });
  }
});

describe("oversized or deeply nested bodies", () => {
  it("a JSON body nested 5,000 deep answers 400", async () => {
    const deep = `${"[".repeat(5000)}${"]".repeat(5000)}`;
    const res = await call(projectPost, "POST", { cookie: admin, body: deep });
    expect(res.status).toBe(400);
    const check = await call(checkPost, "POST", { cookie: admin, body: `{"part":${deep}}` });
    expect(check.status).toBe(400);
  });

  it("a fault case with a 20 MB origin.input answers 413", async () => {
    const res = await call(faultCasePost, "POST", {
      cookie: admin,
      params: { id: projectId },
      body: {
        ...faultCase,
        origin: { builder: "inrush", input: { blob: "x".repeat(20_000_000) }, figures: {} },
      },
    });
    expect(res.status).toBe(413);
  });

  it("a 100 MB body without a declared length is refused after reading at most a little over the limit", async () => {
    let pulled = 0;
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled >= 100_000_000) return controller.close();
        pulled += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const req = new Request(new URL("/api/projects", appUrl), {
      method: "POST",
      headers: { origin: new URL(appUrl).origin, cookie: admin, "content-type": "application/json" },
      body,
      duplex: "half",
    } as RequestInit);
    const res = await projectPost(req, { params: Promise.resolve({}) });
    expect(res.status).toBe(413);
    expect(pulled).toBeLessThan(5_000_000);
  });
});
