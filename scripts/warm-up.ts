// Warms freshly started app processes before the first user does (start_app in services.sh): a process compiles
// and optimises its code over its first thousands of requests, and its first minute under load was several times
// slower than the rest. Each process on the given loopback ports is asked, one request at a time, ROUNDS times:
// - app processes: the public pages and the sign-in redirects of the main pages (no session);
// - lean API servers: health and an unauthenticated check (401).
// Where the demo workspace is seeded (`npm start`), a session of the demo engineer's is then started in the database
// (no password tried), and each process renders the main signed-in pages (app processes) or answers their reads
// and the check contract (API servers) with it, half as many rounds; the session is ended at the end. What is
// written: that session's row, and whatever those pages write when opened (queued rechecks of stale capture
// results). Prints what it did; a failure is printed and the start goes on.
// Run: `tsx --conditions=react-server scripts/warm-up.ts ROUNDS app:PORT… api:PORT…` with the app's environment.
import { and, eq } from "drizzle-orm";
import { db } from "../src/db";
import { memberships, users, workspaces } from "../src/db/schema";
import { endSession, startSession } from "../src/lib/auth/session";
import { hashToken } from "../src/lib/auth/tokens";
import { demoUsers, demoWorkspace } from "../src/lib/demo/users";
import { checkBody } from "./load/check-body";

const [rounds, ...targets] = process.argv.slice(2);
const pagePaths = ["/", "/sign-in", "/sign-up", "/forgot", "/app", "/projects", "/library", "/team"];
const apps = targets.filter((t) => t.startsWith("app:")).map((t) => t.slice(4));
const apis = targets.filter((t) => t.startsWith("api:")).map((t) => t.slice(4));

async function ask(port: string, path: string, init: RequestInit = {}): Promise<void> {
  const res = await fetch(`http://127.0.0.1:${port}${path}`, { ...init, redirect: "manual" });
  await res.arrayBuffer();
}

/**
 * A session of the demo engineer's in the demo workspace, started in the database as a sign-in would (no password
 * is tried, so no sign-in attempt is counted), or null where the demo workspace is not seeded.
 */
async function demoSession(): Promise<{ cookie: string; sessionId: string } | null> {
  const engineer = demoUsers.find((u) => u.role === "engineer");
  if (!engineer) return null;
  const [member] = await db
    .select({ userId: users.id, workspaceId: workspaces.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(and(eq(users.email, engineer.email), eq(workspaces.slug, demoWorkspace.slug)));
  if (!member) return null;
  const cookie = (await startSession(member.userId, member.workspaceId)).split(";")[0];
  return { cookie, sessionId: hashToken(cookie.slice(cookie.indexOf("=") + 1)) };
}

/** The signed-in pages a member opens first (the lists, the first project and part), and the reads they make. */
async function memberPaths(port: string, cookie: string): Promise<{ pages: string[]; reads: string[] }> {
  const read = async <T>(path: string): Promise<T> =>
    (await fetch(`http://127.0.0.1:${port}${path}`, { headers: { cookie } })).json() as Promise<T>;
  const { projects } = await read<{ projects: { id: string }[] }>("/api/projects");
  const { rows: parts } = await read<{ rows: { id: string }[] }>("/api/parts");
  const pages = ["/app", "/projects", "/library", "/team"];
  const reads = ["/api/projects", "/api/parts"];
  if (projects[0]) {
    pages.push(`/projects/${projects[0].id}`, `/projects/${projects[0].id}/compare`);
    reads.push(`/api/projects/${projects[0].id}`, `/api/projects/${projects[0].id}/check`);
  }
  if (parts[0]) {
    pages.push(`/library/${parts[0].id}`);
    reads.push(`/api/parts/${parts[0].id}`);
  }
  return { pages, reads };
}

const started = performance.now();
let signedIn = 0;
try {
  await Promise.all([
    ...apps.map(async (port) => {
      for (let round = 0; round < Number(rounds); round++)
        for (const path of pagePaths) await ask(port, path);
    }),
    ...apis.map(async (port) => {
      for (let round = 0; round < Number(rounds); round++) {
        await ask(port, "/api/health");
        await ask(port, "/api/v1/check", { method: "POST", body: "{}" });
      }
    }),
  ]);
  const demo = apps[0] ? await demoSession() : null;
  if (demo) {
    const { cookie } = demo;
    try {
      const { pages, reads } = await memberPaths(apps[0], cookie);
      const body = JSON.stringify(checkBody());
      const memberRounds = Math.ceil(Number(rounds) / 2);
      // A user agent of its own per round: the memory of pages and reads keys on it, so every round renders.
      const as = (round: number) => ({ cookie, "user-agent": `pulsefence-warm-up/${round}` });
      await Promise.all([
        ...apps.map(async (port) => {
          for (let round = 0; round < memberRounds; round++)
            for (const path of pages) await ask(port, path, { headers: as(round) });
        }),
        ...apis.map(async (port) => {
          const headers = { cookie, origin: `http://127.0.0.1:${port}`, "content-type": "application/json" };
          for (let round = 0; round < memberRounds; round++) {
            for (const path of reads) await ask(port, path, { headers: as(round) });
            for (let k = 0; k < 10; k++) await ask(port, "/api/v1/check", { method: "POST", headers, body });
          }
        }),
      ]);
      signedIn = pages.length;
    } finally {
      await endSession(demo.sessionId);
    }
  }
} catch (error) {
  console.error(`warm-up stopped early: ${error}`);
}
console.log(
  `warmed ${targets.length} processes, ${rounds} rounds` +
    (signedIn
      ? `, ${signedIn} signed-in pages, their reads and the check contract as the demo engineer`
      : "") +
    `, in ${((performance.now() - started) / 1000).toFixed(1)} s`,
);
process.exit(0);
