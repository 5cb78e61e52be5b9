// Load figures for the started app: prints, never asserts. Run `npm start` (or the test profile's app) first, then
// `npm run load`. It signs in as the demo engineer, makes an API token, and drives, with autocannon:
// - `POST /api/v1/check` (1 part × 20 pulses, bearer token) at 1, 16 and 64 connections;
// - a mixed workload of pages and APIs at a fixed total rate (200 req/s for 60 s unless told), twice: as one
//   autocannon, which sends each second's requests in one burst at its start, and spread over the second (one
//   instance per place in the cycle, started 1/17 s apart); /api/health is probed once a second meanwhile.
// Every run is bounded in time and sent only to a loopback address. Settings (environment):
//   PF_LOAD_URL      the app, default http://127.0.0.1:<3000 + PF_PORT_OFFSET>
//   PF_LOAD_SECONDS  seconds per check run (default 10); PF_MIXED_SECONDS, PF_MIXED_RATE (60, 200)
//   PF_LOAD_ONLY     "check" or "mixed" to run one part, "spread" for only the spread mixed run
//   PF_WARMUP_SECONDS  the mixed runs' warm-up at half rate (default 30; 0 measures a cold app)
import autocannon from "autocannon";
import { checkBody } from "./load/check-body";
import { type Figures, figuresLine, Recorder } from "./load/figures";
import { engineerSession, loopbackOrigin } from "./load/target";

const origin = loopbackOrigin("load traffic goes");
const checkSeconds = Number(process.env.PF_LOAD_SECONDS ?? 10);
const mixedSeconds = Number(process.env.PF_MIXED_SECONDS ?? 60);
const mixedRate = Number(process.env.PF_MIXED_RATE ?? 200);
const only = process.env.PF_LOAD_ONLY;
const warmupSeconds = Number(process.env.PF_WARMUP_SECONDS ?? 30);
/** A request still unanswered after this long counts as a timeout. */
const TIMEOUT_S = 10;

async function getJson<T>(path: string, cookie: string, init: RequestInit = {}): Promise<T> {
  const res = await fetch(`${origin}${path}`, {
    ...init,
    headers: { cookie, origin, "content-type": "application/json", ...(init.headers ?? {}) },
  });
  if (!res.ok) throw new Error(`${init.method ?? "GET"} ${path} answered ${res.status}`);
  return (await res.json()) as T;
}

/** Runs autocannon and records every response time itself (autocannon's summary has no p95). */
async function run(title: string, options: Omit<autocannon.Options, "url">): Promise<Figures> {
  return runTogether(title, [{ options, delayMs: 0 }]);
}

/**
 * Runs several autocannon instances at once, each started `delayMs` after the first, into one set of figures.
 * autocannon paces a rate by letting each connection send its share at the start of every second, so one instance
 * at 200 req/s sends its 200 requests as one burst each second; instances started at spread offsets send the same
 * rate spread over the second.
 */
async function runTogether(
  title: string,
  parts: { options: Omit<autocannon.Options, "url">; delayMs: number }[],
): Promise<Figures> {
  const recorder = new Recorder();
  const results = await Promise.all(
    parts.map(async ({ options, delayMs }) => {
      await new Promise((r) => setTimeout(r, delayMs));
      return new Promise<autocannon.Result>((resolve, reject) => {
        const instance = autocannon({ ...options, url: origin, timeout: TIMEOUT_S }, (error, done) =>
          error ? reject(error) : resolve(done),
        );
        instance.on("response", (_client, status, _bytes, ms) => recorder.response(status, ms));
      });
    }),
  );
  const sum = (f: (r: autocannon.Result) => number) => results.reduce((total, r) => total + f(r), 0);
  const seconds =
    Math.max(...results.map((r) => r.duration)) + Math.max(...parts.map((p) => p.delayMs)) / 1000;
  const figures = recorder.figures(
    title,
    seconds,
    sum((r) => r.timeouts),
    sum((r) => r.errors - r.timeouts),
  );
  console.log(figuresLine(figures));
  return figures;
}

async function checkRuns(token: string): Promise<void> {
  const body = JSON.stringify(checkBody());
  const request = {
    method: "POST" as const,
    path: "/api/v1/check",
    headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
    body,
  };
  console.log(
    `check API: POST /api/v1/check, 1 part × 20 pulses (${body.length} bytes), ${checkSeconds} s per run`,
  );
  await run("warm-up (not counted)", { requests: [request], connections: 4, duration: 2 });
  for (const connections of [1, 16, 64]) {
    await run(`check, ${connections} connection${connections > 1 ? "s" : ""}`, {
      requests: [request],
      connections,
      duration: checkSeconds,
    });
  }
}

async function mixedRun(cookie: string, token: string, inStep: boolean): Promise<void> {
  const projects = await getJson<{ projects: { id: string }[] }>("/api/projects", cookie);
  const parts = await getJson<{ rows: { id: string }[] }>("/api/parts", cookie);
  const project = projects.projects[0]?.id;
  const part = parts.rows[0]?.id;
  if (!project || !part) throw new Error("the demo workspace has no project or part: run the seed");
  const page = (path: string) => ({ method: "GET" as const, path, headers: { cookie } });
  const api = (path: string) => ({ method: "GET" as const, path, headers: { cookie } });
  const check = {
    method: "POST" as const,
    path: "/api/v1/check",
    headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
    body: JSON.stringify(checkBody()),
  };
  // One cycle: 6 pages, 5 reads, 5 checks, health; each connection walks it in order.
  const requests = [
    page("/app"),
    check,
    api("/api/projects"),
    page("/projects"),
    check,
    page(`/projects/${project}`),
    api(`/api/projects/${project}`),
    check,
    page(`/projects/${project}/compare`),
    api(`/api/projects/${project}/check`),
    check,
    page("/library"),
    api("/api/parts"),
    page(`/library/${part}`),
    check,
    api(`/api/parts/${part}`),
    { method: "GET" as const, path: "/api/health" },
  ];
  console.log(
    `mixed: ${requests.length} requests a cycle (6 pages, 5 API reads, 5 checks, health), ` +
      `${mixedRate} req/s for ${mixedSeconds} s`,
  );
  const health: number[] = [];
  let healthFailures = 0;
  let running = true;
  const probe = (async () => {
    while (running) {
      const start = performance.now();
      try {
        const res = await fetch(`${origin}/api/health`, { signal: AbortSignal.timeout(TIMEOUT_S * 1000) });
        await res.arrayBuffer();
        if (!res.ok) healthFailures++;
      } catch {
        healthFailures++;
      }
      health.push(performance.now() - start);
      await new Promise((r) => setTimeout(r, 1000));
    }
  })();
  const connections = Math.max(16, Math.round(mixedRate / 2));
  // The same mix spread over each second: one instance per place in the cycle, each starting there and a 1/17 s
  // after the one before.
  const k = requests.length;
  const spread = (rate: number, duration: number) =>
    requests.map((_, start) => ({
      delayMs: (start * 1000) / k,
      options: {
        requests: [...requests.slice(start), ...requests.slice(0, start)],
        connections: Math.max(1, Math.round(connections / k)),
        overallRate: Math.floor(rate / k) + (start < rate % k ? 1 : 0),
        duration,
      },
    }));
  // A fresh process compiles and optimises its code over its first thousands of requests, as the check runs'
  // warm-up allows for; a server's figures are those of its working life.
  if (warmupSeconds > 0)
    await runTogether("warm-up (not counted)", spread(Math.round(mixedRate / 2), warmupSeconds));
  // As the issue measured it: one autocannon at the whole rate, whose connections walk the cycle in step.
  if (inStep)
    await run(`mixed, ${mixedRate} req/s`, {
      requests,
      connections,
      overallRate: mixedRate,
      duration: mixedSeconds,
    });
  await runTogether("mixed, spread", spread(mixedRate, mixedSeconds));
  running = false;
  await probe;
  health.sort((a, b) => a - b);
  console.log(
    `  /api/health during the run: ${health.length} probes, median ${health[health.length >> 1]?.toFixed(0)} ms, ` +
      `slowest ${health.at(-1)?.toFixed(0)} ms, ${healthFailures} not ok`,
  );
}

const cookie = await engineerSession(origin);
const { token } = await getJson<{ token: { secret: string } }>("/api/account/tokens", cookie, {
  method: "POST",
  body: JSON.stringify({ name: `load ${new Date().toISOString()}` }),
});
console.log(`load against ${origin} (figures print, nothing is asserted)`);
if (only !== "mixed" && only !== "spread") await checkRuns(token.secret);
if (only !== "check") await mixedRun(cookie, token.secret, only !== "spread");
