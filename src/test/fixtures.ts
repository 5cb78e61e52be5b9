// Fixtures for integration tests of route handlers: real database rows, real sessions, direct handler calls.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll } from "vitest";
import { createDb } from "@/db/client";
import {
  curveSets,
  curves,
  memberships,
  type NewPart,
  type Part,
  type Project,
  parts,
  projectCandidates,
  projects,
  type Role,
  users,
  workspaces,
} from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { startSession } from "@/lib/auth/session";
import { type DemoPart, demoCurves } from "@/lib/demo/parts";
import type { Curve, PartLimits } from "@/lib/soa/types";
import { requireEnv } from "./services";

export const testDb = createDb(requireEnv("DATABASE_URL"), { max: 3 });
export const appUrl = process.env.APP_URL ?? "http://127.0.0.1:3100";
export const testPassword = "correct horse battery";

let passwordHash: Promise<string> | undefined;

export interface TestUser {
  id: string;
  email: string;
  role: Role;
}

export interface TestWorkspace {
  id: string;
  name: string;
  members: Record<Role, TestUser>;
}

const uid = () => crypto.randomUUID().slice(0, 8);

/** A workspace with one member of each role, all with the password `testPassword`. */
export async function createTestWorkspace(label = "Bench"): Promise<TestWorkspace> {
  const { db } = testDb;
  passwordHash ??= hashPassword(testPassword);
  const hash = await passwordHash;
  const [workspace] = await db
    .insert(workspaces)
    .values({ name: `${label} ${uid()}`, slug: `test-${uid()}-${uid()}` })
    .returning();
  const members = {} as Record<Role, TestUser>;
  for (const role of ["admin", "lead", "engineer", "technician"] as const) {
    const email = `${role}-${uid()}@example.test`;
    const [user] = await db
      .insert(users)
      .values({ email, name: `${role} ${label}`, passwordHash: hash })
      .returning({ id: users.id });
    await db.insert(memberships).values({ workspaceId: workspace.id, userId: user.id, role });
    members[role] = { id: user.id, email, role };
  }
  return { id: workspace.id, name: workspace.name, members };
}

/**
 * The test file's workspace (one member per role): made before the file's own beforeAll hooks, deleted after its
 * afterAll hooks, and then the file's database pool is closed. The object is filled in before the tests run.
 */
export function workspaceForFile(label: string): TestWorkspace {
  const ws = {} as TestWorkspace;
  beforeAll(async () => {
    Object.assign(ws, await createTestWorkspace(label));
  });
  afterAll(async () => {
    await deleteWorkspace(ws.id);
    await testDb.sql.end();
  });
  return ws;
}

export async function addMember(workspaceId: string, role: Role): Promise<TestUser> {
  const { db } = testDb;
  passwordHash ??= hashPassword(testPassword);
  const email = `${role}-${uid()}@example.test`;
  const [user] = await db
    .insert(users)
    .values({ email, name: `extra ${role}`, passwordHash: await passwordHash })
    .returning({ id: users.id });
  await db.insert(memberships).values({ workspaceId, userId: user.id, role });
  return { id: user.id, email, role };
}

/** A fresh session cookie ("name=value") for a user in a workspace. */
export async function sessionCookie(userId: string, workspaceId: string | null): Promise<string> {
  return cookiePair(await startSession(userId, workspaceId));
}

export function cookiePair(setCookie: string): string {
  return setCookie.split(";")[0];
}

/** Any route handler: `never` params accept a handler typed for its own route's params. */
export type RouteHandler = (req: Request, context: { params: Promise<never> }) => Promise<Response>;

export interface CallOptions {
  cookie?: string;
  bearer?: string;
  body?: unknown;
  params?: Record<string, string>;
  headers?: Record<string, string>;
  path?: string;
}

/** Calls a route handler the way Next.js does, with a same-origin browser's headers. */
export async function call(
  handler: RouteHandler,
  method: string,
  options: CallOptions = {},
): Promise<Response> {
  const headers = new Headers({
    origin: new URL(appUrl).origin,
    host: new URL(appUrl).host,
    ...options.headers,
  });
  if (options.cookie) headers.set("cookie", options.cookie);
  if (options.bearer) headers.set("authorization", `Bearer ${options.bearer}`);
  let body: string | undefined;
  if (options.body !== undefined && method !== "GET") {
    headers.set("content-type", "application/json");
    body = typeof options.body === "string" ? options.body : JSON.stringify(options.body);
  }
  const req = new Request(new URL(options.path ?? "/api/test", appUrl), { method, headers, body });
  return handler(req, { params: Promise.resolve(options.params ?? {}) as Promise<never> });
}

export async function deleteWorkspace(id: string): Promise<void> {
  const { db } = testDb;
  const rows = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(eq(memberships.workspaceId, id));
  await db.delete(workspaces).where(eq(workspaces.id, id));
  for (const r of rows) await db.delete(users).where(eq(users.id, r.userId));
}

/**
 * A part in the workspace's library with a unique number: a 60 V, 175 °C MOSFET in TO-220 unless `values` says
 * otherwise.
 */
export async function addPart(workspaceId: string, values: Partial<NewPart> = {}): Promise<Part> {
  const [part] = await testDb.db
    .insert(parts)
    .values({
      workspaceId,
      partNumber: `TP-${uid()}`,
      maker: "Test Devices",
      technology: "si-mosfet",
      package: "TO-220",
      vdsMax: 60,
      tjMax: 175,
      ...values,
    })
    .returning();
  return part;
}

/** A project of the workspace (case temperature 25 °C unless `values` says otherwise). */
export async function addProject(
  workspaceId: string,
  values: Omit<typeof projects.$inferInsert, "workspaceId">,
): Promise<Project> {
  const [project] = await testDb.db
    .insert(projects)
    .values({ workspaceId, ...values })
    .returning();
  return project;
}

/**
 * A curve set of the part with its curves in order, as a registered upload leaves it (the file itself is not
 * stored); the part's active set unless `options.active` is false. Returns the set's id.
 */
export async function addCurveSet(
  workspaceId: string,
  partId: string,
  setCurves: readonly Curve[],
  options: { active?: boolean; fileName?: string } = {},
): Promise<string> {
  const { db } = testDb;
  const [set] = await db
    .insert(curveSets)
    .values({
      workspaceId,
      partId,
      objectKey: `test/${crypto.randomUUID()}`,
      fileName: options.fileName ?? "soa.csv",
      size: 1,
      sha256: "0".repeat(64),
      shape: "long",
      active: options.active ?? true,
    })
    .returning({ id: curveSets.id });
  await db.insert(curves).values(
    setCurves.map((c, position) => ({
      curveSetId: set.id,
      position,
      duration: c.duration === "DC" ? null : c.duration,
      points: c.points,
    })),
  );
  return set.id;
}

/**
 * A demo part (src/lib/demo/parts.ts) in the workspace's library with its modelled curves as the active curve set,
 * added as a candidate of the project. Returns the ids and the part as the engine takes it.
 */
export async function addDemoCandidate(
  workspaceId: string,
  projectId: string,
  demo: DemoPart,
  options: { foster?: boolean } = {},
): Promise<{ partId: string; setId: string; limits: PartLimits }> {
  const withFoster = options.foster ?? true;
  const part = await addPart(workspaceId, {
    partNumber: demo.partNumber,
    maker: demo.maker,
    package: demo.package,
    vdsMax: demo.vdsMax,
    idPulseMax: demo.idPulseMax,
    rdsOn: demo.rdsOn,
    tjMax: demo.tjMax,
    rthJc: demo.rthJc,
    foster: withFoster ? demo.foster : null,
    unitCost: demo.unitCost,
    currency: demo.currency,
  });
  const setCurves = demoCurves(demo);
  const setId = await addCurveSet(workspaceId, part.id, setCurves);
  await testDb.db.insert(projectCandidates).values({ projectId, partId: part.id });
  const limits: PartLimits = {
    vdsMax: demo.vdsMax,
    tjMax: demo.tjMax,
    rdsOn: demo.rdsOn,
    idPulseMax: demo.idPulseMax,
    rthJc: demo.rthJc,
    ...(withFoster ? { foster: demo.foster } : {}),
    soa: { refCaseTemp: 25, curves: setCurves },
  };
  return { partId: part.id, setId, limits };
}
