import { createServer, type Server } from "node:http";
import { getRequestListener } from "@hono/node-server";
import { AppError, errorResponse } from "@/lib/errors";
import { securityHeaders } from "@/lib/security-headers";
import { answersFile, findLeanRoute } from "./lean-routes";
import { type PageCacheOptions, withPageCache } from "./page-cache";

// The lean API server: the check contract for bench scripts (POST /api/v1/check with an API token), health and
// every read of the API (GET and HEAD, session or token), served by the very handlers the app's routes export,
// guard included, on Node's HTTP server without the framework's request path, which costs about 8 ms of CPU per
// request against a read's 1–5 ms (issue: fast under load). nginx sends it only those (scripts/services.sh,
// start_app); every change made with a session, and every page, goes to the app. Being the same handlers, it
// answers exactly as the app would: same access checks (session or token, member, role), same body limits, same
// errors and headers. The routes are listed in lean-routes.ts.
// Run: `node --conditions=react-server --import tsx src/server/api-main.ts` with PORT (HOST, default 127.0.0.1)
// beside the app's environment.

/** Answers one request with the app's handler for its method and path, or a 404 in the app's error shape. */
export async function answer(req: Request): Promise<Response> {
  const path = new URL(req.url).pathname;
  // As the app does: a path with a trailing slash is sent, permanently, to the one without.
  if (path.length > 1 && path.endsWith("/")) {
    const url = new URL(req.url);
    return new Response(null, {
      status: 308,
      headers: { location: `${path.replace(/\/+$/, "")}${url.search}` },
    });
  }
  const found = findLeanRoute(req.method, path);
  const response = found
    ? await found.handler(req, { params: Promise.resolve(found.params) })
    : errorResponse(new AppError("not_found:route", `${req.method} ${path} is not served here.`));
  for (const { key, value } of securityHeaders) response.headers.set(key, value);
  return response;
}
/**
 * An HTTP server answering with `answer`; kept-alive connections outlive nginx's (60 s), as the app's do. With
 * `memory`, reads are kept as the app keeps its pages (page-cache.ts, `answers: "reads"`).
 */
export function createApiServer(memory?: Omit<PageCacheOptions, "answers">): Server {
  const listener = getRequestListener(answer);
  const serve = memory
    ? withPageCache(listener, { ...memory, answers: "reads", passes: answersFile })
    : listener;
  const server = createServer((req, res) => {
    Promise.resolve(serve(req, res)).catch((error: unknown) => {
      console.error("A request failed outside the API's error handling:", error);
      if (res.headersSent) res.destroy();
      else res.writeHead(500).end();
    });
  });
  server.keepAliveTimeout = 75_000;
  return server;
}
