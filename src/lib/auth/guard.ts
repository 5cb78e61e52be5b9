import "server-only";
import type { Role } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError, errorResponse } from "@/lib/errors";
import { rememberedMembership } from "./auth-memory";
import { type Action, can } from "./permissions";
import { type SessionUser, validateSessionCookie } from "./session";
import { authenticateToken } from "./token-auth";

/**
 * Who may call a route handler. Every exported handler is wrapped by `route` or `publicRoute`, and a test
 * enumerates them all (src/app/api/routes.test.ts): a handler without a guard fails it.
 * - { public: true }: anyone (sign-in, health).
 * - { signedIn: true }: any signed-in person, acting on their own account.
 * - { action }: a member of the active workspace whose role may do `action` (permission table).
 */
export type Access = { public: true } | { signedIn: true } | { action: Action; bearer?: boolean };

export interface Caller {
  user: SessionUser;
  sessionId: string | null;
  via: "session" | "token";
}

export interface MemberCaller extends Caller {
  workspaceId: string;
  role: Role;
  leadRights: boolean;
}

type Params = Record<string, string | string[]>;
interface RouteContext<P> {
  params: Promise<P>;
}

export type GuardedHandler<P = Params> = ((req: Request, context: RouteContext<P>) => Promise<Response>) & {
  access: Access;
};

const unsafeMethods = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * A public handler: errors still come back as AppError JSON. A change (sign-in, sign-up, reset…) sent by a browser
 * from another site is refused, so no page elsewhere can sign a visitor into an account of its choosing.
 */
export function publicRoute<P = Params>(
  handler: (req: Request, params: P) => Promise<Response>,
): GuardedHandler<P> {
  const wrapped = async (req: Request, context: RouteContext<P>) => {
    try {
      if (unsafeMethods.has(req.method) && fromAnotherSite(req)) {
        throw new AppError("forbidden:origin", "The request did not come from this site.");
      }
      return await handler(req, await context.params);
    } catch (error) {
      return errorResponse(error);
    }
  };
  return Object.assign(wrapped, { access: { public: true } as const });
}

export function route<P = Params>(
  access: { signedIn: true },
  handler: (req: Request, caller: Caller, params: P) => Promise<Response>,
): GuardedHandler<P>;
export function route<P = Params>(
  access: { action: Action; bearer?: boolean },
  handler: (req: Request, caller: MemberCaller, params: P) => Promise<Response>,
): GuardedHandler<P>;
export function route<P = Params>(
  access: { signedIn: true } | { action: Action; bearer?: boolean },
  handler: (req: Request, caller: MemberCaller & Caller, params: P) => Promise<Response>,
): GuardedHandler<P> {
  const wrapped = async (req: Request, context: RouteContext<P>) => {
    let setCookie: string | null = null;
    try {
      // Authenticate, then authorise by role, before anything of the request is read or loaded.
      const auth = await authenticate(req, "bearer" in access && access.bearer === true);
      setCookie = auth.setCookie;
      const caller = auth.caller;
      let member: MemberCaller | null = null;
      if ("action" in access) {
        if (!auth.workspaceId) throw new AppError("forbidden:no-workspace", "Choose a workspace first.");
        // Remembered as briefly as the token or session itself (auth-cache.ts).
        const membership = await rememberedMembership(auth.workspaceId, caller.user.id);
        if (!membership)
          throw new AppError("forbidden:not-a-member", "You are not a member of this workspace.");
        if (!can(membership.role, access.action, membership.leadRights)) {
          throw new AppError(
            `forbidden:${access.action}`,
            "Your role in this workspace does not allow this.",
          );
        }
        member = {
          ...caller,
          workspaceId: auth.workspaceId,
          role: membership.role,
          leadRights: membership.leadRights,
        };
      }
      const response = await handler(req, (member ?? caller) as MemberCaller & Caller, await context.params);
      return withCookie(response, setCookie);
    } catch (error) {
      return withCookie(errorResponse(error), setCookie);
    }
  };
  return Object.assign(wrapped, { access });
}

async function authenticate(req: Request, allowBearer: boolean) {
  const authorization = req.headers.get("authorization");
  if (authorization?.startsWith("Bearer ")) {
    if (!allowBearer)
      throw new AppError("unauthenticated:token-not-accepted", "API tokens are accepted only under /api/v1.");
    const token = await authenticateToken(authorization.slice(7).trim());
    if (!token) throw new AppError("unauthenticated:token", "The API token is not valid or was revoked.");
    return {
      caller: { user: token.user, sessionId: null, via: "token" } satisfies Caller,
      workspaceId: token.workspaceId as string | null,
      setCookie: null,
    };
  }
  const session = await validateSessionCookie(req.headers.get("cookie"));
  if (!session) throw new AppError("unauthenticated", "Sign in to continue.");
  if (unsafeMethods.has(req.method) && !sameOrigin(req)) {
    throw new AppError("forbidden:origin", "The request did not come from this site.");
  }
  return {
    caller: { user: session.user, sessionId: session.sessionId, via: "session" } satisfies Caller,
    workspaceId: session.workspaceId,
    setCookie: session.setCookie,
  };
}

/** A cookie-authenticated change must come from our own pages (CSRF defence beside SameSite=Lax). */
function sameOrigin(req: Request): boolean {
  const origin = req.headers.get("origin");
  if (!origin) return false;
  const allowed = new Set([new URL(env().APP_URL).origin]);
  const host = req.headers.get("host");
  if (host) {
    allowed.add(`http://${host}`);
    allowed.add(`https://${host}`);
  }
  return allowed.has(origin);
}

/** A browser request from another site: its Origin is not ours, or the browser says so. Scripts send neither. */
function fromAnotherSite(req: Request): boolean {
  if (req.headers.get("sec-fetch-site") === "cross-site") return true;
  return req.headers.has("origin") && !sameOrigin(req);
}

function withCookie(response: Response, setCookie: string | null): Response {
  if (setCookie) response.headers.append("set-cookie", setCookie);
  return response;
}
