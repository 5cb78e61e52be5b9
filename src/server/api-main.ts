import { EnvError, parseEnv } from "@/lib/env";

// Starts the lean API server (api-server.ts) on HOST:PORT. The environment is checked first, as the app's
// instrumentation does, so a missing variable stops it with a message naming the variable.
try {
  parseEnv(process.env);
} catch (error) {
  if (error instanceof EnvError) {
    console.error(`Pulsefence's API server cannot start.\n${error.message}`);
    process.exit(1);
  }
  throw error;
}

const port = Number(process.env.PORT);
if (!Number.isInteger(port) || port <= 0) {
  console.error("Pulsefence's API server cannot start: PORT must name the port to listen on.");
  process.exit(1);
}
const host = process.env.HOST ?? "127.0.0.1";

// Reads are kept in memory as the app keeps its pages (data-version.ts: PF_PAGE_MEMORY_MB, PF_PAGE_MEMORY_SECONDS).
const { createApiServer } = await import("./api-server");
const { memoryFromEnvironment } = await import("./data-version");
const server = createApiServer(memoryFromEnvironment(process.env));
server.listen(port, host, () => console.log(`API server listening on http://${host}:${port}`));

// On a stop signal: take no new connections, let requests in flight finish (up to 5 s), then exit.
for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.once(signal, () => {
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    setTimeout(() => process.exit(signal === "SIGTERM" ? 143 : 130), 5_000).unref();
  });
}
