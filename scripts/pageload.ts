// Page-load figures for the started app, from Debian's Chromium: prints, never asserts. Run `npm start` first,
// then `npm run pageload`. For each route, signed in as the demo engineer, each visit in a fresh browser context
// (no cache, as a first visit): the largest contentful paint (median of PF_PAGELOAD_RUNS visits, default 3, after
// one warm-up visit that warms the server, not the browser), and the JavaScript the route loads before its `load`
// event, gzip-compressed here (level 6, as a server would send it) so the figure does not depend on the server's
// own compression. Only loopback addresses are visited.
//   PF_LOAD_URL  the app, default http://127.0.0.1:<3000 + PF_PORT_OFFSET>
import { gzipSync } from "node:zlib";
import { type Browser, chromium, type Page } from "playwright-core";
import { quantile } from "./load/figures";
import { engineerSession, loopbackOrigin } from "./load/target";

const origin = loopbackOrigin("page loads go");
const runs = Number(process.env.PF_PAGELOAD_RUNS ?? 3);

async function sessionCookie(): Promise<{ name: string; value: string }> {
  const pair = await engineerSession(origin);
  const at = pair.indexOf("=");
  return { name: pair.slice(0, at), value: pair.slice(at + 1) };
}

async function firstIds(cookie: string): Promise<{ project: string; part: string }> {
  const get = async (path: string) => {
    const res = await fetch(`${origin}${path}`, { headers: { cookie } });
    if (!res.ok) throw new Error(`GET ${path} answered ${res.status}`);
    return res.json();
  };
  const projects = (await get("/api/projects")) as { projects: { id: string }[] };
  const parts = (await get("/api/parts")) as { rows: { id: string }[] };
  if (!projects.projects[0] || !parts.rows[0]) throw new Error("no project or part: run the seed");
  return { project: projects.projects[0].id, part: parts.rows[0].id };
}

/** Records the largest contentful paint as the page reports it. */
const lcpObserver = () => {
  const w = window as unknown as { __lcp: number };
  w.__lcp = Number.NaN;
  new PerformanceObserver((list) => {
    for (const entry of list.getEntries()) w.__lcp = entry.startTime;
  }).observe({ type: "largest-contentful-paint", buffered: true });
};

interface Visit {
  lcp: number;
  /** The path the visit ended on, when a redirect moved it. */
  ended: string;
  jsGzip: number;
  jsFiles: number;
  status: number;
}

async function visit(
  browser: Browser,
  cookie: { name: string; value: string },
  path: string,
): Promise<Visit> {
  const context = await browser.newContext();
  await context.addCookies([{ ...cookie, url: origin }]);
  await context.addInitScript(lcpObserver);
  const page: Page = await context.newPage();
  const scripts: Promise<number>[] = [];
  let loaded = false;
  page.on("response", (response) => {
    if (loaded || response.request().resourceType() !== "script") return;
    scripts.push(
      response
        .body()
        .then((body) => gzipSync(body, { level: 6 }).length)
        .catch(() => 0),
    );
  });
  const response = await page.goto(`${origin}${path}`, { waitUntil: "load", timeout: 30_000 });
  loaded = true;
  // LCP is final once the page is idle; a short settle lets a late render report its paint.
  await page.waitForLoadState("networkidle", { timeout: 10_000 }).catch(() => {});
  // A page that sends the visitor on (a role without access) navigates again: read the page it ends on.
  const readLcp = () => page.evaluate(() => (window as unknown as { __lcp: number }).__lcp);
  const lcp = await readLcp().catch(async () => {
    await page.waitForLoadState("load").catch(() => {});
    return readLcp().catch(() => Number.NaN);
  });
  const ended = new URL(page.url()).pathname;
  const sizes = await Promise.all(scripts);
  await context.close();
  return {
    lcp,
    ended,
    jsGzip: sizes.reduce((a, b) => a + b, 0),
    jsFiles: sizes.length,
    status: response?.status() ?? 0,
  };
}

const cookie = await sessionCookie();
const ids = await firstIds(`${cookie.name}=${cookie.value}`);
const routes = [
  "/sign-in",
  "/app",
  "/projects",
  `/projects/${ids.project}`,
  `/projects/${ids.project}/compare`,
  `/projects/${ids.project}/decisions`,
  "/projects/new",
  `/projects/${ids.project}/settings`,
  "/library",
  `/library/${ids.part}`,
  `/library/${ids.part}/edit`,
  "/library/new",
  "/team",
  "/account",
];
const browser = await chromium.launch({ executablePath: process.env.PF_CHROMIUM ?? "/usr/bin/chromium" });
console.log(
  `page loads against ${origin}, median of ${runs} cold visits (figures print, nothing is asserted)`,
);
try {
  for (const path of routes) {
    await visit(browser, cookie, path);
    const visits: Visit[] = [];
    for (let k = 0; k < runs; k++) visits.push(await visit(browser, cookie, path));
    const lcp = quantile(
      visits.map((v) => v.lcp).sort((a, b) => a - b),
      0.5,
    );
    const last = visits.at(-1)!;
    const label = path.replace(ids.project, ":id").replace(ids.part, ":id");
    console.log(
      `${label.padEnd(26)} LCP ${Number.isNaN(lcp) ? "–" : `${lcp.toFixed(0)} ms`}`.padEnd(42) +
        `first-load JS ${(last.jsGzip / 1024).toFixed(1)} kB gzip in ${last.jsFiles} files  (HTTP ${last.status}` +
        `${last.ended === path ? "" : `, ended on ${last.ended.replace(ids.project, ":id").replace(ids.part, ":id")}`})`,
    );
  }
} finally {
  await browser.close();
}
