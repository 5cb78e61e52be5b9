import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { sessions } from "@/db/schema";
import { authCache, listenForAuthChanges } from "./auth-memory";
import { lucia, sessionMaxAgeMs } from "./lucia";
import { hashToken, randomToken } from "./tokens";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
}

export interface ValidSession {
  sessionId: string;
  user: SessionUser;
  workspaceId: string | null;
  /** A Set-Cookie value to send back: the session was renewed, or it is no longer valid. */
  setCookie: string | null;
}

export const sessionCookieName = lucia.sessionCookieName;

/**
 * Reads and validates the session cookie from a Cookie header. The cookie holds a random token; the database holds
 * only its SHA-256, as for API tokens. Renewal happens here (sliding expiry), but never past `sessionMaxAgeMs`.
 * A valid session is remembered for a few seconds (auth-cache.ts); a remembered one past its expiry or maximum age
 * is read again, and the database's answer stands.
 */
export async function validateSessionCookie(cookieHeader: string | null): Promise<ValidSession | null> {
  const token = lucia.readSessionCookie(cookieHeader ?? "");
  if (!token) return null;
  const id = hashToken(token);
  listenForAuthChanges();
  const remembered = authCache.session(id);
  const now = Date.now();
  if (remembered && remembered.expiresAt > now && now - remembered.createdAt <= sessionMaxAgeMs) {
    return { sessionId: id, user: remembered.user, workspaceId: remembered.workspaceId, setCookie: null };
  }
  // Requests that miss at once (the entry just expired, a page and its parts) share one read; each sends the
  // renewed cookie if the read renewed the session.
  return authCache.sharedRead(`session:${id}`, async () => {
    const generation = authCache.generation();
    const { session, user } = await lucia.validateSession(id);
    if (!session || !user) return null;
    const createdAt = session.createdAt ? new Date(session.createdAt).getTime() : 0;
    if (Date.now() - createdAt > sessionMaxAgeMs) {
      await lucia.invalidateSession(session.id);
      return null;
    }
    const valid = {
      user: { id: user.id, email: user.email, name: user.name },
      workspaceId: session.workspaceId,
    };
    authCache.rememberSession(
      id,
      { ...valid, userId: user.id, expiresAt: session.expiresAt.getTime(), createdAt },
      generation,
    );
    return {
      sessionId: session.id,
      ...valid,
      setCookie: session.fresh ? lucia.createSessionCookie(token).serialize() : null,
    };
  });
}

/** Starts a session in a workspace; returns the Set-Cookie value (the token; the database keeps its hash). */
export async function startSession(userId: string, workspaceId: string | null): Promise<string> {
  const token = randomToken();
  await lucia.createSession(userId, { workspaceId, createdAt: new Date() }, { sessionId: hashToken(token) });
  return lucia.createSessionCookie(token).serialize();
}

export async function endSession(sessionId: string): Promise<string> {
  await lucia.invalidateSession(sessionId);
  authCache.clear();
  return lucia.createBlankSessionCookie().serialize();
}

/** Signs a user out everywhere: every session of theirs ends. */
export async function endAllSessions(userId: string): Promise<void> {
  await lucia.invalidateUserSessions(userId);
  authCache.clear();
}

/** Ends every session of a user except one (after a password change). */
export async function endOtherSessions(userId: string, keepSessionId: string | null): Promise<void> {
  const all = await lucia.getUserSessions(userId);
  await Promise.all(all.filter((s) => s.id !== keepSessionId).map((s) => lucia.invalidateSession(s.id)));
  authCache.clear();
}

export async function setSessionWorkspace(sessionId: string, workspaceId: string): Promise<void> {
  await db.update(sessions).set({ workspaceId }).where(eq(sessions.id, sessionId));
  authCache.clear();
}

export function blankSessionCookie(): string {
  return lucia.createBlankSessionCookie().serialize();
}
