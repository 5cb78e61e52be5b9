import "server-only";
import { DrizzlePostgreSQLAdapter } from "@lucia-auth/adapter-drizzle";
import { Lucia, TimeSpan } from "lucia";
import { db } from "@/db";
import { sessions, users } from "@/db/schema";
import { env } from "@/lib/env";

// Lucia v3 is no longer maintained upstream: it is used only here and in session.ts, so it can be replaced.
const adapter = new DrizzlePostgreSQLAdapter(db, sessions, users);

export const lucia = new Lucia(adapter, {
  sessionExpiresIn: new TimeSpan(30, "d"),
  sessionCookie: {
    name: "pulsefence_session",
    expires: false,
    attributes: { secure: env().APP_URL.startsWith("https://"), sameSite: "lax" },
  },
  getSessionAttributes: (attributes) => ({ workspaceId: attributes.workspaceId }),
  // Only what the app may show: never the password hash.
  getUserAttributes: (attributes) => ({ email: attributes.email, name: attributes.name }),
});

declare module "lucia" {
  interface Register {
    Lucia: typeof lucia;
    UserId: string;
    DatabaseSessionAttributes: { workspaceId: string | null };
    DatabaseUserAttributes: { email: string; name: string };
  }
}
