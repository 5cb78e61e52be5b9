// Every route handler against every role and against a member of another workspace.
// The route files are found on disk: a new route without a guard, or without a fixture here, fails this test.
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiTokens,
  captures,
  curveSets,
  curves,
  decisions,
  faultCases,
  invitations,
  measuredPulses,
  parts,
  projectCandidates,
  projects,
} from "@/db/schema";
import type { Access, GuardedHandler } from "@/lib/auth/guard";
import { can, roles } from "@/lib/auth/permissions";
import { hashToken, randomToken } from "@/lib/auth/tokens";
import {
  addMember,
  call,
  createTestWorkspace,
  deleteWorkspace,
  sessionCookie,
  type TestWorkspace,
  testDb,
} from "@/test/fixtures";

const apiDir = path.join(import.meta.dirname);
const methods = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

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

// Routes anyone may call. Making a route public is a decision: it must be listed here.
const publicRoutes = new Set([
  "POST /api/auth/sign-up",
  "POST /api/auth/sign-up/confirm",
  "POST /api/auth/sign-in",
  "POST /api/auth/forgot-password",
  "POST /api/auth/reset-password",
  "POST /api/invitations/accept",
  "GET /api/health",
]);

let a: TestWorkspace; // the workspace whose resources are addressed
// Members of a who hold lead rights beside their role (one-person teams): an admin and a technician.
const withLeadRights: { role: (typeof roles)[number]; id: string }[] = [];
let b: TestWorkspace; // another team: must never reach a's resources

// Fresh resources of workspace a for each call of a route with parameters (a call may consume them).
const paramFixtures: Record<string, () => Promise<Record<string, string>>> = {
  "/api/team/invitations/[id]": async () => ({ id: await pendingInvitation() }),
  "/api/team/invitations/[id]/resend": async () => ({ id: await pendingInvitation() }),
  "/api/team/members/[userId]": async () => ({ userId: (await addMember(a.id, "engineer")).id }),
  "/api/account/tokens/[id]": async () => ({ id: await apiToken() }),
  "/api/parts/[id]": async () => ({ id: await part() }),
  "/api/parts/[id]/archive": async () => ({ id: await part() }),
  "/api/parts/[id]/verify": async () => ({ id: await part() }),
  "/api/parts/[id]/thermal": async () => ({ id: await part() }),
  "/api/parts/[id]/transfer": async () => ({ id: await part() }),
  "/api/parts/[id]/thermal/fit": async () => ({ id: await part() }),
  "/api/parts/[id]/uploads": async () => ({ id: await part() }),
  "/api/parts/[id]/curve-sets": async () => ({ id: await part() }),
  "/api/parts/[id]/limits": async () => ({ id: await part() }),
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
    const key = `${a.id}/projects/${id}/capture/${crypto.randomUUID()}`;
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
        mapping: {},
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
  const [row] = await testDb.db
    .insert(parts)
    .values({
      workspaceId: a.id,
      partNumber: `RT-${crypto.randomUUID().slice(0, 8)}`,
      maker: "Route Test Devices",
      technology: "si-mosfet",
      package: "TO-220",
      vdsMax: 80,
      tjMax: 175,
    })
    .returning({ id: parts.id });
  return row.id;
}

async function project(): Promise<string> {
  const [row] = await testDb.db
    .insert(projects)
    .values({ workspaceId: a.id, name: `Route test ${crypto.randomUUID().slice(0, 6)}`, caseTemp: 60 })
    .returning({ id: projects.id });
  return row.id;
}

async function projectWithDecision(): Promise<{ id: string; decisionId: string }> {
  const id = await project();
  const snapshot = {
    takenAt: new Date().toISOString(),
    project: { id, name: "Route test", description: null, caseTemp: 60 },
    policy: { caseTemp: 60, utilisationLimit: 0.8, tjGuard: 25, betweenCurves: "loglog" },
    candidates: [],
    pulses: [],
    results: {},
    worstByPulse: {},
    ranking: [],
  };
  const [row] = await testDb.db
    .insert(decisions)
    .values({
      workspaceId: a.id,
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
  const [set] = await testDb.db
    .insert(curveSets)
    .values({
      workspaceId: a.id,
      partId: id,
      objectKey: `test/${crypto.randomUUID()}.csv`,
      fileName: "soa.csv",
      size: 10,
      sha256: "0".repeat(64),
      shape: "long",
      active: true,
    })
    .returning({ id: curveSets.id });
  await testDb.db.insert(curves).values({
    curveSetId: set.id,
    position: 0,
    duration: 1e-3,
    points: [
      [1, 100],
      [50, 2],
    ],
  });
  return { id, setId: set.id };
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

async function load(file: string): Promise<Partial<Record<(typeof methods)[number], GuardedHandler>>> {
  return (await import(file)) as Partial<Record<(typeof methods)[number], GuardedHandler>>;
}

beforeAll(async () => {
  a = await createTestWorkspace("Routes A");
  b = await createTestWorkspace("Routes B");
  const { memberships } = await import("@/db/schema");
  for (const role of ["admin", "technician"] as const) {
    const user = await addMember(a.id, role);
    await testDb.db
      .update(memberships)
      .set({ leadRights: true })
      .where(and(eq(memberships.userId, user.id), eq(memberships.workspaceId, a.id)));
    withLeadRights.push({ role, id: user.id });
  }
});
afterAll(async () => {
  await deleteWorkspace(a.id);
  await deleteWorkspace(b.id);
  await testDb.sql.end();
});

describe("route guards", () => {
  it("finds the route handlers on disk", () => {
    expect(routeFiles.length).toBeGreaterThanOrEqual(15);
  });

  for (const { file, route } of routeFiles) {
    describe(route, () => {
      it("wraps every exported handler in a guard; public ones are listed", async () => {
        const mod = await load(file);
        const exported = methods.filter((m) => mod[m]);
        expect(exported.length).toBeGreaterThan(0);
        for (const method of exported) {
          const access = mod[method]?.access as Access | undefined;
          expect(access, `${method} ${route} has no guard`).toBeTypeOf("object");
          expect(
            "public" in access! === publicRoutes.has(`${method} ${route}`),
            `${method} ${route} public?`,
          ).toBe(true);
        }
        if (route.includes("[")) expect(paramFixtures[route], `add a fixture for ${route}`).toBeDefined();
      });

      it("answers 401 without a session, allows or denies each role by the permission table", async () => {
        const mod = await load(file);
        for (const method of methods) {
          const handler = mod[method];
          if (!handler || "public" in handler.access) continue;
          const access = handler.access;
          const params = () => paramFixtures[route]?.() ?? Promise.resolve({});
          const anonymous = await call(handler, method, { body: {}, params: await params() });
          expect(anonymous.status, `${method} ${route} without a session`).toBe(401);
          const callers = [
            ...roles.map((role) => ({ role, id: a.members[role].id, leadRights: false })),
            ...withLeadRights.map((m) => ({ ...m, leadRights: true })),
          ];
          for (const { role, id, leadRights } of callers) {
            const who = leadRights ? `${role} with lead rights` : role;
            tokenOwner = id;
            const res = await call(handler, method, {
              cookie: await sessionCookie(id, a.id),
              body: {},
              params: await params(),
            });
            const allowed = "signedIn" in access || can(role, access.action, leadRights);
            if (allowed)
              expect([401, 403], `${who} ${method} ${route} → ${res.status}`).not.toContain(res.status);
            else expect(res.status, `${who} ${method} ${route}`).toBe(403);
          }
        }
      });

      if (!route.includes("[")) return;
      it("answers 404 to a member of another workspace", async () => {
        const mod = await load(file);
        for (const method of methods) {
          const handler = mod[method];
          if (!handler) continue;
          tokenOwner = a.members.engineer.id;
          // An outsider whose role in their own workspace would allow the action: only the wall stops them.
          const access = handler.access;
          const outsiderRole = "action" in access ? roles.find((r) => can(r, access.action))! : "admin";
          const outsider = b.members[outsiderRole];
          const res = await call(handler, method, {
            cookie: await sessionCookie(outsider.id, b.id),
            body: { role: "lead" },
            params: await paramFixtures[route]!(),
          });
          expect(res.status, `${method} ${route} from another workspace`).toBe(404);
        }
      });
    });
  }
});

describe("cross-workspace", () => {
  it("a session cannot act in a workspace its user is not a member of", async () => {
    const { GET } = await import("./team/invitations/route");
    const res = await call(GET as GuardedHandler, "GET", {
      cookie: await sessionCookie(b.members.admin.id, a.id),
    });
    expect(res.status).toBe(403);
  });

  it("a member removed from the workspace loses access at once", async () => {
    const { GET } = await import("./team/invitations/route");
    const lead = await addMember(a.id, "lead");
    const cookie = await sessionCookie(lead.id, a.id);
    expect((await call(GET as GuardedHandler, "GET", { cookie })).status).toBe(200);
    const { memberships } = await import("@/db/schema");
    await testDb.db
      .delete(memberships)
      .where(and(eq(memberships.userId, lead.id), eq(memberships.workspaceId, a.id)));
    expect((await call(GET as GuardedHandler, "GET", { cookie })).status).toBe(403);
  });
});
