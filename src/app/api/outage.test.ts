// With the database down (a port nothing listens on stands in for a stopped PostgreSQL), requests answer 503 with a
// retry hint, health names the service that is down without internals, and the log holds no secret.
import { connect, createServer, type Server, type Socket } from "node:net";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { GuardedHandler } from "@/lib/auth/guard";

// The app's address as the test profile sets it (the Origin check compares against it).
const appUrl = process.env.APP_URL ?? "http://127.0.0.1:3100";
const logged: string[] = [];
let handlers: { projects: GuardedHandler; health: GuardedHandler; signIn: GuardedHandler };
let downPort = 0;
let proxy: Server | null = null;

async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return port;
}

beforeAll(async () => {
  // The real database's address with a port nothing listens on yet; "bringing it back" starts a TCP relay there.
  const real = new URL(process.env.DATABASE_URL ?? "");
  downPort = await freePort();
  const down = new URL(real);
  down.port = String(downPort);
  vi.stubEnv("DATABASE_URL", down.toString());
  realDb = { host: real.hostname, port: Number(real.port) };
  for (const method of ["error", "warn", "log", "info"] as const) {
    vi.spyOn(console, method).mockImplementation((...args: unknown[]) => {
      logged.push(
        args.map((a) => (a instanceof Error ? `${a.stack} ${String(a.cause)}` : String(a))).join(" "),
      );
    });
  }
  handlers = {
    projects: (await import("./projects/route")).GET as unknown as GuardedHandler,
    health: (await import("./health/route")).GET as unknown as GuardedHandler,
    signIn: (await import("./auth/sign-in/route")).POST as unknown as GuardedHandler,
  };
});
afterAll(async () => {
  for (const socket of relayed) socket.destroy();
  await new Promise((resolve) => (proxy ? proxy.close(resolve) : resolve(null)));
  vi.unstubAllEnvs();
  vi.restoreAllMocks();
});

let realDb = { host: "", port: 0 };
const relayed: Socket[] = [];

/** Starts relaying the dead port to the real PostgreSQL: the database "returns". */
async function bringDatabaseBack(): Promise<void> {
  proxy = createServer((client) => {
    const upstream = connect(realDb.port, realDb.host);
    relayed.push(client, upstream);
    client.pipe(upstream).pipe(client);
    client.on("error", () => upstream.destroy());
    upstream.on("error", () => client.destroy());
  });
  await new Promise<void>((resolve) => proxy!.listen(downPort, "127.0.0.1", resolve));
}

const sessionSecret = `sessionsecret${crypto.randomUUID().replaceAll("-", "")}`;

function request(path: string, init: RequestInit = {}) {
  const headers = new Headers(init.headers);
  headers.set("origin", appUrl);
  headers.set("host", new URL(appUrl).host);
  return new Request(new URL(path, appUrl), { ...init, headers });
}

describe("with the database down", () => {
  it("GET /api/projects with a session cookie answers 503 with Retry-After, and logs no session id", async () => {
    const res = await handlers.projects(
      request("/api/projects", { headers: { cookie: `pulsefence_session=${sessionSecret}` } }),
      { params: Promise.resolve({}) },
    );
    expect(res.status).toBe(503);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = await res.json();
    expect(body.error.code).toBe("unavailable:database");
    expect(logged.length).toBeGreaterThan(0);
    expect(logged.join("\n")).not.toContain(sessionSecret);
    expect(logged.join("\n")).not.toMatch(/params:/);
  });

  it("a sign-in answers 503, and the log holds neither the address nor the password", async () => {
    const password = `pw-${crypto.randomUUID()}`;
    const email = `outage-${crypto.randomUUID().slice(0, 8)}@example.test`;
    const res = await handlers.signIn(
      request("/api/auth/sign-in", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ email, password }),
      }),
      { params: Promise.resolve({}) },
    );
    expect(res.status).toBe(503);
    expect(logged.join("\n")).not.toContain(password);
    expect(logged.join("\n")).not.toContain(email);
  });

  it("health says the database is unavailable, without the failed query or the address", async () => {
    const res = await handlers.health(request("/api/health"), { params: Promise.resolve({}) });
    expect(res.status).toBe(503);
    const body = await res.json();
    expect(body.db).toBe("unavailable");
    expect(JSON.stringify(body)).not.toMatch(/select|ECONNREFUSED|127\.0\.0\.1|query/i);
  });
});

describe("when the database returns", () => {
  it("requests are answered again without a restart", async () => {
    await bringDatabaseBack();
    const res = await handlers.signIn(
      request("/api/auth/sign-in", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({
          email: `back-${crypto.randomUUID().slice(0, 8)}@example.test`,
          password: "wrong",
        }),
      }),
      { params: Promise.resolve({}) },
    );
    expect(res.status).toBe(401);
    const health = await handlers.health(request("/api/health"), { params: Promise.resolve({}) });
    expect((await health.json()).db).toBe("ok");
  });
});
