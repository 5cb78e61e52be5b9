import { createServer, type Server } from "node:http";
import { getRequestListener } from "@hono/node-server";
import { GET as health } from "@/app/api/health/route";
import { POST as checkContract } from "@/app/api/v1/check/route";
import type { GuardedHandler } from "@/lib/auth/guard";
import { AppError, errorResponse } from "@/lib/errors";
import { securityHeaders } from "@/lib/security-headers";

// The lean API server: the check contract for bench scripts (POST /api/v1/check with an API token) and health,
// served by the very handlers the app's routes export, guard included, on Node's HTTP server without the
// framework's request path, which costs about 8 ms of CPU per request against the check handler's 1 ms (issue:
// fast under load). nginx sends it only bearer-token POSTs to that path and health (scripts/services.sh,
// start_app); everything else, sessions included, goes to the app. Being the same handlers, it answers exactly as
// the app would: same access checks (token, member, role), same body limits, same errors, same headers.
// Run: `node --conditions=react-server --import tsx src/server/api-main.ts` with PORT (HOST, default 127.0.0.1)
// beside the app's environment.

type Handler = GuardedHandler<Record<string, never>>;

/**
 * Method and path → the app's own handler. Only routes without path parameters belong here. Health is served here
 * too, so that it answers at once while the app's processes are busy with pages (its probes are the same).
 */
export const leanRoutes: ReadonlyMap<string, Handler> = new Map([
  ["POST /api/v1/check", checkContract as Handler],
  ["GET /api/health", health as Handler],
  ["HEAD /api/health", health as Handler],
]);

const noParams = { params: Promise.resolve({}) };

/** Answers one request with the app's handler for its method and path, or a 404 in the app's error shape. */
export async function answer(req: Request): Promise<Response> {
  const path = new URL(req.url).pathname;
  const handler = leanRoutes.get(`${req.method} ${path}`);
  const response = handler
    ? await handler(req, noParams)
    : errorResponse(new AppError("not_found:route", `${req.method} ${path} is not served here.`));
  for (const { key, value } of securityHeaders) response.headers.set(key, value);
  return response;
}

/** An HTTP server answering with `answer`; kept-alive connections outlive nginx's (60 s), as the app's do. */
export function createApiServer(): Server {
  const server = createServer(getRequestListener(answer));
  server.keepAliveTimeout = 75_000;
  return server;
}
