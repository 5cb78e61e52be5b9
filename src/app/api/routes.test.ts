// Long file: the pinned route table, its fixtures and the checks generated from it belong in one place.
// Every route handler against a pinned table of what each method needs, checked against the files on disk: a route
// file or an exported method that is not in the table fails, and so does a handler whose guard declares another
// action than the one pinned here (a destructive route declared with a read action cannot pass). Each method is
// called as Next.js dispatches it (HEAD and OPTIONS implemented by the framework) by: nobody, a session cookie of
// each role, an API token of each role, a member of another workspace, and a cookie from another site's page.
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { autoImplementMethods } from "next/dist/server/route-modules/app-route/helpers/auto-implement-methods";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiTokens,
  captures,
  decisions,
  faultCases,
  invitations,
  measuredPulses,
  memberships,
  pendingUploads,
  projectCandidates,
  type Role,
} from "@/db/schema";
import type { Access, GuardedHandler } from "@/lib/auth/guard";
import { type Action, can, roles } from "@/lib/auth/permissions";
import { hashToken, randomToken } from "@/lib/auth/tokens";
import { captureMappingSchema } from "@/lib/capture/parse";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import { answer } from "@/server/api-server";
import { nextAuthClear } from "@/test/auth-clear";
import {
  addCurveSet,
  addMember,
  addPart,
  addProject,
  type CallOptions,
  call,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  type TestWorkspace,
  testDb,
} from "@/test/fixtures";

const apiDir = path.join(import.meta.dirname);
/** The methods a route file may export. HEAD and OPTIONS are left to Next.js (checked below), never exported. */
const exportable = ["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"] as const;
type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
const unsafe = new Set<string>(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * What a method needs and what an allowed caller gets back: `need` is "public", "signed-in" (the caller's own
 * account) or an action of the permission table; `bearer` when an API token is accepted (only under /api/v1);
 * `ok` the status an allowed caller gets with `body` (default {}): a success, or the validation answer (400) of a
 * request without the required fields.
 */
interface Pin {
  need: "public" | "signed-in" | Action;
  ok: number;
  bearer?: true;
  body?: unknown;
}
const pin = (need: Pin["need"], ok: number, extra: Omit<Pin, "need" | "ok"> = {}): Pin => ({
  need,
  ok,
  ...extra,
});

// The pinned table. Adding a route or a method, or changing what one needs, is a decision: it is made here.
const table: Record<string, Partial<Record<Method, Pin>>> = {
  "/api/account/notices": { GET: pin("signed-in", 200), PATCH: pin("signed-in", 400) },
  "/api/account/password": { POST: pin("signed-in", 400) },
  "/api/account/profile": { PATCH: pin("signed-in", 400) },
  "/api/account/tokens": {
    GET: pin("signed-in", 200),
    POST: pin("workspace.read", 201, { body: { name: "bench" } }),
  },
  "/api/account/tokens/[id]": { DELETE: pin("signed-in", 200) },
  "/api/auth/forgot-password": { POST: pin("public", 400) },
  "/api/auth/reset-password": { POST: pin("public", 400) },
  "/api/auth/sign-in": { POST: pin("public", 400) },
  "/api/auth/sign-out": { POST: pin("signed-in", 200) },
  "/api/auth/sign-out-everywhere": { POST: pin("signed-in", 200) },
  "/api/auth/sign-up": { POST: pin("public", 400) },
  "/api/auth/sign-up/confirm": { POST: pin("public", 400) },
  "/api/health": { GET: pin("public", 200) },
  "/api/invitations/accept": { POST: pin("public", 400) },
  "/api/parts": { GET: pin("workspace.read", 200), POST: pin("part.write", 400) },
  "/api/parts/[id]": { GET: pin("workspace.read", 200), PATCH: pin("part.write", 400) },
  "/api/parts/[id]/archive": { POST: pin("part.write", 200, { body: { archived: true } }) },
  "/api/parts/[id]/curve-sets": { POST: pin("part.write", 400) },
  "/api/parts/[id]/curve-sets/[setId]/activate": { POST: pin("part.write", 200) },
  "/api/parts/[id]/curve-sets/[setId]/file": { GET: pin("workspace.read", 302) },
  "/api/parts/[id]/limits": { GET: pin("workspace.read", 200) },
  "/api/parts/[id]/thermal": { PUT: pin("part.write", 400) },
  "/api/parts/[id]/thermal/fit": { POST: pin("part.write", 400) },
  "/api/parts/[id]/transfer": { PUT: pin("part.write", 400), DELETE: pin("part.write", 200) },
  "/api/parts/[id]/uploads": { POST: pin("part.write", 400) },
  "/api/parts/[id]/verify": { POST: pin("part.verify", 200, { body: { acceptances: [] } }) },
  "/api/projects": { GET: pin("workspace.read", 200), POST: pin("project.write", 400) },
  "/api/projects/sample": { POST: pin("project.write", 201) },
  "/api/projects/[id]": { GET: pin("workspace.read", 200), PATCH: pin("project.write", 400) },
  "/api/projects/[id]/archive": { POST: pin("project.write", 200, { body: { archived: true } }) },
  "/api/projects/[id]/audit": { GET: pin("audit.read", 200) },
  "/api/projects/[id]/candidates": { POST: pin("project.write", 400) },
  "/api/projects/[id]/candidates/[partId]": { DELETE: pin("project.write", 200) },
  "/api/projects/[id]/captures": { GET: pin("workspace.read", 200), POST: pin("measurement.write", 400) },
  "/api/projects/[id]/captures/[captureId]": {
    GET: pin("workspace.read", 200),
    DELETE: pin("measurement.write", 200),
  },
  "/api/projects/[id]/check": { GET: pin("workspace.read", 200) },
  "/api/projects/[id]/decisions": { GET: pin("workspace.read", 200), POST: pin("decision.sign", 400) },
  "/api/projects/[id]/decisions/[decisionId]": { GET: pin("workspace.read", 200) },
  "/api/projects/[id]/decisions/[decisionId]/csv": { GET: pin("workspace.read", 200) },
  "/api/projects/[id]/decisions/[decisionId]/report": { GET: pin("workspace.read", 200) },
  "/api/projects/[id]/fault-cases": { POST: pin("project.write", 400) },
  "/api/projects/[id]/fault-cases/[caseId]": {
    PATCH: pin("project.write", 400),
    DELETE: pin("project.write", 200),
  },
  "/api/projects/[id]/matrix": { GET: pin("workspace.read", 200) },
  "/api/projects/[id]/measurements": { POST: pin("measurement.write", 400) },
  "/api/projects/[id]/measurements/[measurementId]": {
    PATCH: pin("measurement.write", 400),
    DELETE: pin("measurement.write", 200),
  },
  "/api/projects/[id]/measurements/preview": { POST: pin("measurement.write", 400) },
  "/api/projects/[id]/uploads": { POST: pin("measurement.write", 400) },
  "/api/team/invitations": { GET: pin("member.invite", 200), POST: pin("member.invite", 400) },
  "/api/team/invitations/[id]": { DELETE: pin("member.invite", 200) },
  "/api/team/invitations/[id]/resend": { POST: pin("member.invite", 201) },
  "/api/team/members/[userId]": { PATCH: pin("member.manage", 400), DELETE: pin("member.manage", 200) },
  "/api/v1/check": { POST: pin("check.run", 400, { bearer: true }) },
  "/api/v1/projects/[id]/measurements": { POST: pin("measurement.write", 400, { bearer: true }) },
  "/api/workspaces/switch": { POST: pin("signed-in", 400) },
};

function findRoutes(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return findRoutes(full);
    return name === "route.ts" ? [full] : [];
  });
}

const routeFiles = findRoutes(apiDir).map((file) => ({
  file,
  route: `/api/${path.relative(apiDir, path.dirname(file)).split(path.sep).join("/")}`,
}));

type Module = Partial<Record<(typeof exportable)[number], GuardedHandler>>;
type Dispatch = Record<
  string,
  (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>
>;
const modules = new Map<string, Module>();
async function load(route: string): Promise<Module> {
  const found = routeFiles.find((r) => r.route === route);
  if (!found) throw new Error(`no route file for ${route}`);
  if (!modules.has(route)) modules.set(route, (await import(found.file)) as Module);
  return modules.get(route)!;
}

/** The route's handler for `method` as Next.js picks it: HEAD runs GET, OPTIONS is answered, others are 405. */
async function dispatch(route: string, method: string, options: CallOptions = {}): Promise<Response> {
  const handlers = autoImplementMethods((await load(route)) as never) as unknown as Dispatch;
  const handler = handlers[method];
  const withBody = method !== "GET" && method !== "HEAD" && method !== "OPTIONS";
  return call(handler as never, method, { ...options, body: withBody ? (options.body ?? {}) : undefined });
}

/**
 * Every way production answers the request: the app's route, and for GET and HEAD also the lean API servers
 * (src/server/api-server.ts), where nginx sends every read of the API, reached by the request's real path.
 */
async function answersOf(
  route: string,
  method: string,
  options: CallOptions = {},
): Promise<{ via: string; res: Response }[]> {
  const app = { via: "app", res: await dispatch(route, method, options) };
  if (method !== "GET" && method !== "HEAD") return [app];
  const values = options.params ?? {};
  const search = options.path?.includes("?") ? options.path.slice(options.path.indexOf("?")) : "";
  const path = route.replace(/\[(\w+)\]/g, (_, name: string) => encodeURIComponent(values[name] ?? ""));
  const lean = await call(answer as never, method, { ...options, path: `${path}${search}`, body: undefined });
  return [app, { via: "lean server", res: lean }];
}

let a: TestWorkspace; // the workspace whose resources are addressed
let b: TestWorkspace; // another team: must never reach a's resources
/** The workspace the resource fixtures below create in: a, except while `inWorkspace` makes another's. */
let home: TestWorkspace;
async function inWorkspace<T>(ws: TestWorkspace, make: () => Promise<T>): Promise<T> {
  home = ws;
  try {
    return await make();
  } finally {
    home = a;
  }
}
interface Caller {
  who: string;
  role: Role;
  id: string;
  leadRights: boolean;
}
/**
 * Every member of a: one per role, and an admin and a technician who hold lead rights beside their role. Each call
 * gets a fresh session or token, so that no call depends on what an earlier one did (sign-out-everywhere revokes).
 */
const callers: Caller[] = [];

// Fresh resources of workspace a for each call of a route with parameters (a call may consume them).
const paramFixtures: Record<string, () => Promise<Record<string, string>>> = {
  "/api/team/invitations/[id]": async () => ({ id: await pendingInvitation() }),
  "/api/team/invitations/[id]/resend": async () => ({ id: await pendingInvitation() }),
  "/api/team/members/[userId]": async () => ({ userId: (await addMember(a.id, "engineer")).id }),
  "/api/account/tokens/[id]": async () => ({ id: await apiToken() }),
  "/api/parts/[id]": async () => ({ id: await part() }),
  "/api/parts/[id]/archive": async () => ({ id: await part() }),
  "/api/parts/[id]/verify": async () => partWithCurveSet(),
  "/api/parts/[id]/thermal": async () => ({ id: await part() }),
  "/api/parts/[id]/transfer": async () => ({ id: await part() }),
  "/api/parts/[id]/thermal/fit": async () => ({ id: await part() }),
  "/api/parts/[id]/uploads": async () => ({ id: await part() }),
  "/api/parts/[id]/curve-sets": async () => ({ id: await part() }),
  "/api/parts/[id]/limits": async () => partWithCurveSet(),
  "/api/parts/[id]/curve-sets/[setId]/file": async () => partWithCurveSet(),
  "/api/projects/[id]": async () => ({ id: await project() }),
  "/api/projects/[id]/archive": async () => ({ id: await project() }),
  "/api/projects/[id]/check": async () => ({ id: await project() }),
  "/api/projects/[id]/decisions": async () => ({ id: await project() }),
  "/api/projects/[id]/matrix": async () => ({ id: await project() }),
  "/api/projects/[id]/audit": async () => ({ id: await project() }),
  "/api/projects/[id]/decisions/[decisionId]": async () => projectWithDecision(),
  "/api/projects/[id]/decisions/[decisionId]/report": async () => projectWithDecision(),
  "/api/projects/[id]/decisions/[decisionId]/csv": async () => projectWithDecision(),
  "/api/projects/[id]/candidates": async () => ({ id: await project() }),
  "/api/projects/[id]/fault-cases": async () => ({ id: await project() }),
  "/api/projects/[id]/measurements": async () => ({ id: await project() }),
  "/api/v1/projects/[id]/measurements": async () => ({ id: await project() }),
  "/api/projects/[id]/captures/[captureId]": async () => {
    const id = await project();
    const key = `${home.id}/projects/${id}/capture/${crypto.randomUUID()}`;
    const [row] = await testDb.db
      .insert(captures)
      .values({
        projectId: id,
        name: "C1",
        objectKey: `${key}.csv`,
        samplesKey: `${key}.samples.f64`,
        fileName: "c.csv",
        size: 1,
        sha256: "0".repeat(64),
        mapping: captureMappingSchema.parse({ time: 0, voltage: 1, current: 2 }),
        summary: {
          samples: 2,
          uniform: true,
          tStart: 0,
          tEnd: 1e-6,
          vMax: 1,
          iMaxAbs: 1,
          pPeak: 1,
          tPeak: 0,
          energy: 1e-6,
          equivalent: { ok: false, flag: "no-power" },
        },
        trace: { t: [], v: [], i: [], p: [] },
        createdBy: tokenOwner || null,
      })
      .returning({ id: captures.id });
    return { id, captureId: row.id };
  },
  "/api/projects/[id]/measurements/preview": async () => ({ id: await project() }),
  "/api/projects/[id]/uploads": async () => ({ id: await project() }),
  "/api/projects/[id]/captures": async () => ({ id: await project() }),
  "/api/projects/[id]/candidates/[partId]": async () => {
    const id = await project();
    const partId = await part();
    await testDb.db.insert(projectCandidates).values({ projectId: id, partId });
    return { id, partId };
  },
  "/api/projects/[id]/fault-cases/[caseId]": async () => {
    const id = await project();
    const [row] = await testDb.db
      .insert(faultCases)
      .values({ projectId: id, name: "short", kind: "rect", v: 48, i: 30, duration: 1e-3 })
      .returning({ id: faultCases.id });
    return { id, caseId: row.id };
  },
  "/api/projects/[id]/measurements/[measurementId]": async () => {
    const id = await project();
    const [row] = await testDb.db
      .insert(measuredPulses)
      .values({
        projectId: id,
        label: "P1",
        kind: "rect",
        v: 48,
        i: 3,
        duration: 1e-3,
        createdBy: tokenOwner || null,
      })
      .returning({ id: measuredPulses.id });
    return { id, measurementId: row.id };
  },
  "/api/parts/[id]/curve-sets/[setId]/activate": async () => partWithCurveSet(),
};

async function part(): Promise<string> {
  return (await addPart(home.id, { vdsMax: 80 })).id;
}

async function project(): Promise<string> {
  const row = await addProject(home.id, {
    name: `Route test ${crypto.randomUUID().slice(0, 6)}`,
    caseTemp: 60,
  });
  return row.id;
}

async function projectWithDecision(): Promise<{ id: string; decisionId: string }> {
  const id = await project();
  const snapshot: DecisionSnapshot = {
    takenAt: new Date().toISOString(),
    project: { id, name: "Route test", description: null, caseTemp: 60 },
    policy: {
      caseTemp: 60,
      utilisationLimit: 0.8,
      tjGuard: 25,
      voltageLimit: 0.8,
      betweenCurves: "loglog",
      caseNetwork: null,
    },
    candidates: [],
    pulses: [],
    results: {},
    worstByPulse: {},
    ranking: [],
  };
  const [row] = await testDb.db
    .insert(decisions)
    .values({
      workspaceId: home.id,
      projectId: id,
      chosenLabel: "none",
      rationale: "route test",
      snapshot,
      signedByName: "lead",
    })
    .returning({ id: decisions.id });
  return { id, decisionId: row.id };
}

async function partWithCurveSet(): Promise<{ id: string; setId: string }> {
  const id = await part();
  const setId = await addCurveSet(home.id, id, [
    {
      duration: 1e-3,
      points: [
        [1, 100],
        [50, 2],
      ],
    },
  ]);
  return { id, setId };
}

async function pendingInvitation(): Promise<string> {
  const [row] = await testDb.db
    .insert(invitations)
    .values({
      workspaceId: a.id,
      email: `invitee-${crypto.randomUUID().slice(0, 8)}@example.test`,
      role: "technician",
      tokenHash: hashToken(randomToken()),
      invitedBy: a.members.admin.id,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning({ id: invitations.id });
  return row.id;
}

// Tokens belong to a user: every role's caller is given its own token to act on.
let tokenOwner = "";
async function apiToken(): Promise<string> {
  const [row] = await testDb.db
    .insert(apiTokens)
    .values({
      userId: tokenOwner,
      workspaceId: a.id,
      name: "bench",
      tokenHash: hashToken(randomToken()),
      prefix: "pf_",
    })
    .returning({ id: apiTokens.id });
  return row.id;
}

async function apiTokenFor(userId: string, workspaceId: string): Promise<string> {
  const secret = randomToken("pf_");
  await testDb.db.insert(apiTokens).values({
    userId,
    workspaceId,
    name: "route test",
    tokenHash: hashToken(secret),
    prefix: secret.slice(0, 9),
  });
  return secret;
}

async function pendingUpload(workspaceId: string, purpose: string): Promise<string> {
  const [row] = await testDb.db
    .insert(pendingUploads)
    .values({
      workspaceId,
      objectKey: `${workspaceId}/test/${crypto.randomUUID()}`,
      fileName: "x.csv",
      purpose,
    })
    .returning({ id: pendingUploads.id });
  return row.id;
}

beforeAll(async () => {
  a = await createTestWorkspace("Routes A");
  b = await createTestWorkspace("Routes B");
  home = a;
  for (const role of roles) {
    const id = a.members[role].id;
    callers.push({ who: role, role, id, leadRights: false });
  }
  for (const role of ["admin", "technician"] as const) {
    const { id } = await addMember(a.id, role);
    await testDb.db
      .update(memberships)
      .set({ leadRights: true })
      .where(and(eq(memberships.userId, id), eq(memberships.workspaceId, a.id)));
    callers.push({ who: `${role} with lead rights`, role, id, leadRights: true });
  }
});
afterAll(async () => {
  await deleteWorkspace(a.id);
  await deleteWorkspace(b.id);
  await testDb.sql.end();
});

const allows = (need: Pin["need"], c: Pick<Caller, "role" | "leadRights">) =>
  need === "signed-in" || need === "public" || can(c.role, need, c.leadRights);
const pinnedMethods = (route: string) => Object.keys(table[route] ?? {}) as Method[];
/** The methods each route is called with: its pinned ones, and HEAD for a GET (Next.js runs GET for it). */
const calledMethods = (route: string) => [...pinnedMethods(route), ...(table[route]?.GET ? ["HEAD"] : [])];
const pinOf = (route: string, method: string) =>
  table[route][(method === "HEAD" ? "GET" : method) as Method]!;
const params = (route: string, owner = a.members.engineer.id) => {
  tokenOwner = owner;
  return paramFixtures[route]?.() ?? Promise.resolve({});
};

describe("the pinned route table", () => {
  it("lists exactly the route files and the methods they export", async () => {
    const onDisk: string[] = [];
    for (const { route } of routeFiles) {
      const mod = await load(route);
      for (const method of exportable) if (mod[method]) onDisk.push(`${method} ${route}`);
    }
    const pinned = Object.keys(table).flatMap((route) => pinnedMethods(route).map((m) => `${m} ${route}`));
    expect(onDisk.sort()).toEqual(pinned.sort());
  });

  it("has a fixture for every route with parameters", () => {
    for (const route of Object.keys(table))
      if (route.includes("[")) expect(paramFixtures[route], `add a fixture for ${route}`).toBeDefined();
  });
});

for (const route of Object.keys(table)) {
  describe(route, () => {
    it("declares the guard pinned for each method", async () => {
      const mod = await load(route);
      for (const method of pinnedMethods(route)) {
        const { need, bearer } = table[route][method]!;
        const access = mod[method]?.access as Access | undefined;
        const expected: Access =
          need === "public"
            ? { public: true }
            : need === "signed-in"
              ? { signedIn: true }
              : { action: need, ...(bearer ? { bearer } : {}) };
        expect(access, `${method} ${route}`).toEqual(expected);
      }
    });

    it("answers anonymous callers 401, or the public answer", async () => {
      for (const method of calledMethods(route)) {
        const { need, ok, body } = pinOf(route, method);
        for (const { via, res } of await answersOf(route, method, { body, params: await params(route) }))
          expect(res.status, `${via}: ${method} ${route} without a session`).toBe(
            need === "public" ? ok : 401,
          );
      }
    });

    it("OPTIONS names the methods without running a handler; other methods are 405", async () => {
      const res = await dispatch(route, "OPTIONS", { params: await params(route) });
      expect(res.status).toBe(204);
      const allow = [...calledMethods(route), "OPTIONS"].sort().join(", ");
      expect(res.headers.get("allow")).toBe(allow);
      for (const method of ["GET", "POST", "PUT", "PATCH", "DELETE"].filter(
        (m) => !table[route][m as Method],
      )) {
        const other = await dispatch(route, method, { params: await params(route) });
        expect(other.status, `${method} ${route}`).toBe(405);
      }
    });

    if (Object.values(table[route]).every((p) => p.need === "public")) return;

    it("allows or refuses a session cookie of each role as the table says", async () => {
      for (const method of calledMethods(route)) {
        const { need, ok, body } = pinOf(route, method);
        for (const caller of callers) {
          const expected = allows(need, caller) ? ok : 403;
          for (const { via, res } of await answersOf(route, method, {
            cookie: await sessionCookie(caller.id, a.id),
            body,
            params: await params(route, caller.id),
          }))
            expect(res.status, `${via}: ${caller.who}: ${method} ${route}`).toBe(expected);
        }
      }
    });

    it("accepts an API token only under /api/v1, by the same table", async () => {
      for (const method of calledMethods(route)) {
        const { need, ok, body, bearer } = pinOf(route, method);
        for (const caller of callers) {
          const expected = !bearer ? 401 : allows(need, caller) ? ok : 403;
          for (const { via, res } of await answersOf(route, method, {
            bearer: await apiTokenFor(caller.id, a.id),
            body,
            params: await params(route, caller.id),
          }))
            expect(res.status, `${via}: ${caller.who} by token: ${method} ${route}`).toBe(expected);
        }
      }
    });

    const changes = pinnedMethods(route).filter((m) => unsafe.has(m));
    if (changes.length > 0)
      it("refuses a cookie-authenticated change from another site or without an Origin", async () => {
        for (const method of changes) {
          const { need, ok, body, bearer } = pinOf(route, method);
          const caller = callers.find((c) => allows(need, c))!;
          const cookie = await sessionCookie(caller.id, a.id);
          for (const origin of ["https://elsewhere.example", null]) {
            const headers: Record<string, string> = origin ? { origin } : {};
            const res = await callWithout(route, method, origin === null, {
              cookie,
              headers,
              body,
              params: await params(route, caller.id),
            });
            expect(res.status, `${method} ${route} from ${origin ?? "no origin"}`).toBe(403);
          }
          // A token is not sent by a browser on its own: the Origin does not matter to it.
          if (bearer) {
            const res = await dispatch(route, method, {
              bearer: await apiTokenFor(caller.id, a.id),
              headers: { origin: "https://elsewhere.example" },
              body,
              params: await params(route, caller.id),
            });
            expect(res.status, `${method} ${route} by token from another site`).toBe(ok);
          }
        }
      });

    if (!route.includes("[")) return;
    it("answers 404 to a member of another workspace addressing this workspace's ids in the path", async () => {
      for (const method of calledMethods(route)) {
        const { need, body } = pinOf(route, method);
        // An outsider whose role in their own workspace would allow the action: only the wall stops them.
        const role = roles.find((r) => allows(need, { role: r, leadRights: false })) ?? "admin";
        const outsider = b.members[role];
        for (const { via, res } of await answersOf(route, method, {
          cookie: await sessionCookie(outsider.id, b.id),
          body: body ?? { role: "lead" },
          params: await params(route),
        }))
          expect(res.status, `${via}: ${method} ${route} from another workspace`).toBe(404);
      }
    });
  });
}

// A nested route's own parent with a child id that is not its own: another parent's child in the same workspace,
// or another workspace's. Generated from the table, so a new nested route is covered by adding it there. Handlers
// load the child by its parent (DEVELOPERS.md, Access control): either is a 404, never the other record.
const nestedRoutes = Object.keys(table).filter((route) => (route.match(/\[/g) ?? []).length > 1);
describe("an own parent with a foreign child id in the path", () => {
  it("finds the nested routes", () => {
    expect(nestedRoutes.length).toBeGreaterThan(8);
    for (const route of nestedRoutes)
      expect(route, "the parent is the route's first [id]").toMatch(/\/\[id\]\//);
  });

  for (const route of nestedRoutes)
    it(`${route}: another parent's or another workspace's child is 404`, async () => {
      for (const method of calledMethods(route)) {
        const { need, body } = pinOf(route, method);
        const caller = callers.find((c) => allows(need, c))!;
        const own = await params(route, caller.id);
        const children = {
          "another parent's": await params(route, caller.id),
          "another workspace's": await inWorkspace(b, () => params(route, caller.id)),
        };
        for (const [whose, other] of Object.entries(children)) {
          expect(other.id, "a different parent").not.toBe(own.id);
          const res = await dispatch(route, method, {
            cookie: await sessionCookie(caller.id, a.id),
            body,
            params: { ...other, id: own.id },
          });
          expect(res.status, `${caller.who}: ${method} ${route} with ${whose} child`).toBe(404);
        }
      }
    });
});

/** Calls a change with a cookie, optionally without any Origin header (a script or an old browser). */
async function callWithout(route: string, method: string, noOrigin: boolean, options: CallOptions) {
  if (!noOrigin) return dispatch(route, method, options);
  const handlers = autoImplementMethods((await load(route)) as never) as unknown as Dispatch;
  const headers = new Headers({ host: new URL(process.env.APP_URL ?? "http://127.0.0.1:3100").host });
  if (options.cookie) headers.set("cookie", options.cookie);
  headers.set("content-type", "application/json");
  const req = new Request(new URL("/api/test", process.env.APP_URL ?? "http://127.0.0.1:3100"), {
    method,
    headers,
    body: JSON.stringify(options.body ?? {}),
  });
  return handlers[method](req, { params: Promise.resolve(options.params ?? {}) });
}

// Ids of another workspace's resources in a request's body or query string: 404 or 400, never a success.
describe("foreign ids in bodies and query strings", () => {
  const cookieOf = (role: Role) => sessionCookie(a.members[role].id, a.id);
  let foreignPart = "";
  let foreignProject = "";
  beforeAll(async () => {
    foreignPart = (await addPart(b.id, { partNumber: "FOREIGN-1", maker: "Elsewhere", vdsMax: 80 })).id;
    foreignProject = (await addProject(b.id, { name: "Foreign project", caseTemp: 25 })).id;
  });

  it("a candidate from another workspace's library is 404", async () => {
    const res = await dispatch("/api/projects/[id]/candidates", "POST", {
      cookie: await cookieOf("engineer"),
      body: { partId: foreignPart },
      params: { id: await project() },
    });
    expect(res.status).toBe(404);
  });

  it("signing another workspace's part as the choice is 400", async () => {
    const res = await dispatch("/api/projects/[id]/decisions", "POST", {
      cookie: await cookieOf("lead"),
      body: { partId: foreignPart, rationale: "The other team's part looked fine to us." },
      params: { id: await project() },
    });
    expect(res.status).toBe(400);
  });

  it("a project owner from another workspace is 400, on create and on edit", async () => {
    const body = { name: "Owned elsewhere", caseTemp: "25", ownerId: b.members.engineer.id };
    const cookie = await cookieOf("engineer");
    expect((await dispatch("/api/projects", "POST", { cookie, body })).status).toBe(400);
    const edit = await dispatch("/api/projects/[id]", "PATCH", {
      cookie,
      body,
      params: { id: await project() },
    });
    expect(edit.status).toBe(400);
  });

  it("switching to a workspace the user is not a member of is 404", async () => {
    const res = await dispatch("/api/workspaces/switch", "POST", {
      cookie: await cookieOf("engineer"),
      body: { workspaceId: b.id },
    });
    expect(res.status).toBe(404);
  });

  it("an upload registered by another workspace is 404 for curve sets, Z_th fits and captures", async () => {
    const cookie = await cookieOf("engineer");
    const curve = await dispatch("/api/parts/[id]/curve-sets", "POST", {
      cookie,
      body: { uploadId: await pendingUpload(b.id, "curve-set") },
      params: { id: await part() },
    });
    expect(curve.status).toBe(404);
    const fit = await dispatch("/api/parts/[id]/thermal/fit", "POST", {
      cookie,
      body: { uploadId: await pendingUpload(b.id, "zth") },
      params: { id: await part() },
    });
    expect(fit.status).toBe(404);
    const capture = await dispatch("/api/projects/[id]/captures", "POST", {
      cookie,
      body: {
        uploadId: await pendingUpload(b.id, "capture"),
        name: "C1",
        mapping: { time: 0, voltage: 1, current: 2 },
      },
      params: { id: await project() },
    });
    expect(capture.status).toBe(404);
  });

  it("ids of another workspace in the query string change nothing a GET answers", async () => {
    const query = `?workspaceId=${b.id}&projectId=${foreignProject}&partId=${foreignPart}&id=${foreignPart}`;
    const cookie = await cookieOf("lead");
    for (const route of Object.keys(table).filter((r) => table[r].GET && table[r].GET?.need !== "public")) {
      for (const { via, res } of await answersOf(route, "GET", {
        cookie,
        path: `/api/x${query}`,
        params: await params(route),
      })) {
        expect(res.status, `${via}: GET ${route}${query}`).toBe(table[route].GET!.ok);
        const text = res.status === 302 ? (res.headers.get("location") ?? "") : await res.text();
        for (const id of [b.id, foreignProject, foreignPart])
          expect(text, `${via}: GET ${route}`).not.toContain(id);
      }
    }
  });
});

// measurement.write lets a member change what they recorded; measurement.manage, what anyone recorded.
describe("measured pulses and captures recorded by another member", () => {
  for (const route of [
    "/api/projects/[id]/measurements/[measurementId]",
    "/api/projects/[id]/captures/[captureId]",
  ])
    it(`DELETE ${route}: 403 for an engineer, 200 for a lead and an admin`, async () => {
      const author = a.members.technician.id;
      for (const role of ["engineer", "lead", "admin"] as const) {
        const res = await dispatch(route, "DELETE", {
          cookie: await sessionCookie(a.members[role].id, a.id),
          params: await params(route, author),
        });
        expect(res.status, role).toBe(role === "engineer" ? 403 : 200);
      }
    });
});

describe("sessions and workspaces", () => {
  it("a session cannot act in a workspace its user is not a member of", async () => {
    const res = await dispatch("/api/team/invitations", "GET", {
      cookie: await sessionCookie(b.members.admin.id, a.id),
    });
    expect(res.status).toBe(403);
  });

  it("a member removed from the workspace loses access at once", async () => {
    const lead = await addMember(a.id, "lead");
    const cookie = await sessionCookie(lead.id, a.id);
    expect((await dispatch("/api/team/invitations", "GET", { cookie })).status).toBe(200);
    // Removed through another connection, as another app process would: heard here through NOTIFY.
    const heard = nextAuthClear();
    await testDb.db
      .delete(memberships)
      .where(and(eq(memberships.userId, lead.id), eq(memberships.workspaceId, a.id)));
    await heard;
    expect((await dispatch("/api/team/invitations", "GET", { cookie })).status).toBe(403);
  });
});
