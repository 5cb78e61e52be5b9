import { createServer } from "node:http";
import next from "next";
import { memoryFromEnvironment } from "./data-version";
import { withPageCache } from "./page-cache";

// Serves the built app (as `next start` would) on HOST:PORT, with the page memory in front of the framework's
// handler (page-cache.ts): a signed-in page asked again while the database is unchanged is sent again, with a fresh
// nonce, instead of rendered again. PF_PAGE_MEMORY_MB bounds its memory (default 64; 0 turns it off),
// PF_PAGE_MEMORY_SECONDS how long a page is kept (default 5, as long as a session is remembered: auth-cache.ts).
// Run: `node --import tsx src/server/app-main.ts` with PORT (HOST, default 127.0.0.1) beside the app's environment.

const port = Number(process.env.PORT);
if (!Number.isInteger(port) || port <= 0) {
  console.error("Pulsefence cannot start: PORT must name the port to listen on.");
  process.exit(1);
}
const host = process.env.HOST ?? "127.0.0.1";

process.title = "pulsefence-app";
const app = next({ dev: false, dir: process.cwd(), hostname: host, port });
const handle = app.getRequestHandler();
await app.prepare();

const render = (req: Parameters<typeof handle>[0], res: Parameters<typeof handle>[1]) => handle(req, res);
const memory = memoryFromEnvironment(process.env);
const serve = memory ? withPageCache(render, memory) : render;
const server = createServer((req, res) => {
  // The framework answers its own errors; this catches only what fails around it, so no request is left hanging.
  Promise.resolve(serve(req, res)).catch((error: unknown) => {
    console.error("A request failed outside the app's error handling:", error);
    if (res.headersSent) res.destroy();
    else res.writeHead(500).end();
  });
});
// Kept-alive connections outlive nginx's (60 s), so nginx never reuses one the app has just closed.
server.keepAliveTimeout = 75_000;
server.listen(port, host, () => console.log(`Pulsefence listening on http://${host}:${port}`));

// On a stop signal: take no new connections and close idle ones; requests in flight finish. The capture workers'
// handler (src/instrumentation-node.ts) waits for that (`pulsefenceRequestsDone`) and for running jobs (up to 10 s)
// before it exits the process; should it not, this process exits after 12 s.
for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.once(signal, () => {
    (globalThis as { pulsefenceRequestsDone?: Promise<void> }).pulsefenceRequestsDone = new Promise(
      (resolve) => server.close(() => resolve()),
    );
    server.closeIdleConnections();
    setTimeout(() => process.exit(signal === "SIGTERM" ? 143 : 130), 12_000).unref();
  });
}
