import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { sessions } from "@/db/schema";
import { lucia } from "./lucia";

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

/** Reads and validates the session cookie from a Cookie header. Renewal happens here (sliding expiry). */
export async function validateSessionCookie(cookieHeader: string | null): Promise<ValidSession | null> {
  const sessionId = lucia.readSessionCookie(cookieHeader ?? "");
  if (!sessionId) return null;
  const { session, user } = await lucia.validateSession(sessionId);
  if (!session || !user) return null;
  return {
    sessionId: session.id,
    user: { id: user.id, email: user.email, name: user.name },
    workspaceId: session.workspaceId,
    setCookie: session.fresh ? lucia.createSessionCookie(session.id).serialize() : null,
  };
}

/** Starts a session in a workspace; returns the Set-Cookie value. */
export async function startSession(userId: string, workspaceId: string | null): Promise<string> {
  const session = await lucia.createSession(userId, { workspaceId });
  return lucia.createSessionCookie(session.id).serialize();
}

export async function endSession(sessionId: string): Promise<string> {
  await lucia.invalidateSession(sessionId);
  return lucia.createBlankSessionCookie().serialize();
}

/** Signs a user out everywhere: every session of theirs ends. */
export async function endAllSessions(userId: string): Promise<void> {
  await lucia.invalidateUserSessions(userId);
}

/** Ends every session of a user except one (after a password change). */
export async function endOtherSessions(userId: string, keepSessionId: string | null): Promise<void> {
  const all = await lucia.getUserSessions(userId);
  await Promise.all(all.filter((s) => s.id !== keepSessionId).map((s) => lucia.invalidateSession(s.id)));
}

export async function setSessionWorkspace(sessionId: string, workspaceId: string): Promise<void> {
  await db.update(sessions).set({ workspaceId }).where(eq(sessions.id, sessionId));
}

export function blankSessionCookie(): string {
  return lucia.createBlankSessionCookie().serialize();
}
