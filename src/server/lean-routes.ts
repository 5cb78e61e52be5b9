import { GET as accountNotices } from "@/app/api/account/notices/route";
import { GET as accountTokens } from "@/app/api/account/tokens/route";
import { GET as health } from "@/app/api/health/route";
import { GET as curveSetFile } from "@/app/api/parts/[id]/curve-sets/[setId]/file/route";
import { GET as partLimits } from "@/app/api/parts/[id]/limits/route";
import { GET as part } from "@/app/api/parts/[id]/route";
import { GET as partsList } from "@/app/api/parts/route";
import { GET as projectAudit } from "@/app/api/projects/[id]/audit/route";
import { GET as capture } from "@/app/api/projects/[id]/captures/[captureId]/route";
import { GET as capturesList } from "@/app/api/projects/[id]/captures/route";
import { GET as projectCheck } from "@/app/api/projects/[id]/check/route";
import { GET as decisionCsv } from "@/app/api/projects/[id]/decisions/[decisionId]/csv/route";
import { GET as decisionReport } from "@/app/api/projects/[id]/decisions/[decisionId]/report/route";
import { GET as decision } from "@/app/api/projects/[id]/decisions/[decisionId]/route";
import { GET as decisionsList } from "@/app/api/projects/[id]/decisions/route";
import { GET as projectMatrix } from "@/app/api/projects/[id]/matrix/route";
import { GET as project } from "@/app/api/projects/[id]/route";
import { GET as projectsList } from "@/app/api/projects/route";
import { GET as invitationsList } from "@/app/api/team/invitations/route";
import { POST as checkContract } from "@/app/api/v1/check/route";
import type { GuardedHandler } from "@/lib/auth/guard";

// What the lean API server (api-server.ts) answers: the check contract for an API token, and every read (GET, and
// HEAD as its bodiless twin) of the app's API, by the very handlers the app's route files export. nginx sends it
// exactly these (scripts/services.sh, start_app); `src/server/api-server.test.ts` fails when a route file's GET is
// missing here, so a new read cannot be left to the slower path by mistake.

// biome-ignore lint/suspicious/noExplicitAny: each handler types its own parameters; the router hands them in.
type Handler = GuardedHandler<any>;

export interface LeanRoute {
  method: "GET" | "POST";
  /** The route as its folder names it, e.g. `/api/projects/[id]/check`. */
  route: string;
  handler: Handler;
  /** Matches a path; its named groups are the route's parameters. */
  pattern: RegExp;
}

/** `/api/projects/[id]` → /^\/api\/projects\/(?<id>[^/]+)$/: a parameter is one path segment, never empty. */
function patternOf(route: string): RegExp {
  const source = route
    .split("/")
    .map((segment) => {
      const param = /^\[(\w+)\]$/.exec(segment);
      return param ? `(?<${param[1]}>[^/]+)` : segment.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
    })
    .join("/");
  return new RegExp(`^${source}$`);
}

const lean = (method: LeanRoute["method"], route: string, handler: Handler): LeanRoute => ({
  method,
  route,
  handler,
  pattern: patternOf(route),
});

export const leanRoutes: readonly LeanRoute[] = [
  lean("POST", "/api/v1/check", checkContract),
  lean("GET", "/api/health", health),
  lean("GET", "/api/account/notices", accountNotices),
  lean("GET", "/api/account/tokens", accountTokens),
  lean("GET", "/api/parts", partsList),
  lean("GET", "/api/parts/[id]", part),
  lean("GET", "/api/parts/[id]/limits", partLimits),
  lean("GET", "/api/parts/[id]/curve-sets/[setId]/file", curveSetFile),
  lean("GET", "/api/projects", projectsList),
  lean("GET", "/api/projects/[id]", project),
  lean("GET", "/api/projects/[id]/audit", projectAudit),
  lean("GET", "/api/projects/[id]/captures", capturesList),
  lean("GET", "/api/projects/[id]/captures/[captureId]", capture),
  lean("GET", "/api/projects/[id]/check", projectCheck),
  lean("GET", "/api/projects/[id]/decisions", decisionsList),
  lean("GET", "/api/projects/[id]/decisions/[decisionId]", decision),
  lean("GET", "/api/projects/[id]/decisions/[decisionId]/csv", decisionCsv),
  lean("GET", "/api/projects/[id]/decisions/[decisionId]/report", decisionReport),
  lean("GET", "/api/projects/[id]/matrix", projectMatrix),
  lean("GET", "/api/team/invitations", invitationsList),
];

/** Reads that answer a file (PDF, CSV, a redirect to storage), never JSON: the memory of reads does not wait on them. */
const fileRoutes = new Set([
  "/api/parts/[id]/curve-sets/[setId]/file",
  "/api/projects/[id]/decisions/[decisionId]/csv",
  "/api/projects/[id]/decisions/[decisionId]/report",
  "/api/projects/[id]/matrix",
]);

/** True when a GET of `path` (query included or not) answers a file. */
export function answersFile(path: string): boolean {
  const bare = path.split("?")[0];
  return leanRoutes.some((r) => r.method === "GET" && fileRoutes.has(r.route) && r.pattern.test(bare));
}

/**
 * The handler for a method and path with its parameters (decoded as the app decodes them), or null. HEAD finds
 * the GET handler; Node's HTTP server then sends the answer's status and headers without its body.
 */
export function findLeanRoute(
  method: string,
  path: string,
): { handler: Handler; params: Record<string, string> } | null {
  const wanted = method === "HEAD" ? "GET" : method;
  for (const candidate of leanRoutes) {
    if (candidate.method !== wanted) continue;
    const match = candidate.pattern.exec(path);
    if (!match) continue;
    const params: Record<string, string> = {};
    for (const [name, value] of Object.entries(match.groups ?? {})) {
      try {
        params[name] = decodeURIComponent(value);
      } catch {
        return null; // a malformed escape names no resource
      }
    }
    return { handler: candidate.handler, params };
  }
  return null;
}
