import "server-only";
import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { Lucia, TimeSpan } from "lucia";
import { db } from "@/db";
import { sessions, users } from "@/db/schema";
import { env } from "@/lib/env";
import { SESSION_COOKIE } from "./cookie-name";

// Lucia v3 is no longer maintained upstream: it is used only here and in session.ts, so it can be replaced.
const adapter = new DrizzlePostgreSQLAdapter(db, sessions, users);

/** A session unused this long ends; used, it is renewed up to `sessionMaxAgeMs` after sign-in (session.ts). */
export const sessionIdleDays = 7;
export const sessionMaxAgeMs = 30 * 24 * 60 * 60 * 1000;

export const lucia = new Lucia(adapter, {
  sessionExpiresIn: new TimeSpan(sessionIdleDays, "d"),
  sessionCookie: {
    name: SESSION_COOKIE,
    // The cookie ends with the session (not a 400-day browser maximum).
    expires: true,
    attributes: { secure: env().APP_URL.startsWith("https://"), sameSite: "lax" },
  },
  getSessionAttributes: (attributes) => ({
    workspaceId: attributes.workspaceId,
    createdAt: attributes.createdAt,
  }),
  // Only what the app may show: never the password hash.
  getUserAttributes: (attributes) => ({ email: attributes.email, name: attributes.name }),
});

declare module "lucia" {
  interface Register {
    Lucia: typeof lucia;
    UserId: string;
    DatabaseSessionAttributes: { workspaceId: string | null; createdAt?: Date };
    DatabaseUserAttributes: { email: string; name: string };
  }
}
