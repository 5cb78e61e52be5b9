import "server-only";
import { and, asc, eq, gt, inArray, lt } from "drizzle-orm";
import { db } from "@/db";
import { authAttempts } from "@/db/schema";
import { AppError } from "@/lib/errors";

export const throttleWindowMs = 15 * 60 * 1000;
export const throttleLimit = 5;

type Kind = "sign-in" | "reset";

/**
 * The keys an attempt counts against: the e-mail address, and the client's IP when a proxy in front of the app
 * tells it. Without one, every client would share one "unknown" IP and five failures would lock everyone out.
 */
export function attemptKeys(req: Request, email: string): string[] {
  const ip = clientIp(req);
  return [`email:${email.trim().toLowerCase()}`, ...(ip ? [`ip:${ip}`] : [])];
}

export function clientIp(req: Request): string | null {
  const forwarded = req.headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || req.headers.get("x-real-ip") || null;
}

/**
 * Refuses with 429 and Retry-After when any key already has `throttleLimit` attempts in the window.
 * Stored in PostgreSQL, so the limit holds across restarts and several app instances.
 */
export async function assertNotThrottled(kind: Kind, keys: string[], now = new Date()): Promise<void> {
  const since = new Date(now.getTime() - throttleWindowMs);
  const rows = await db
    .select({ key: authAttempts.key, createdAt: authAttempts.createdAt })
    .from(authAttempts)
    .where(
      and(eq(authAttempts.kind, kind), inArray(authAttempts.key, keys), gt(authAttempts.createdAt, since)),
    )
    .orderBy(asc(authAttempts.createdAt));
  for (const key of keys) {
    const times = rows.filter((r) => r.key === key).map((r) => r.createdAt.getTime());
    if (times.length >= throttleLimit) {
      // The window frees a place when the oldest counted attempt leaves it.
      const oldestCounted = times[times.length - throttleLimit];
      const retryAfter = Math.max(1, Math.ceil((oldestCounted + throttleWindowMs - now.getTime()) / 1000));
      throw new AppError(
        "rate_limited",
        `Too many attempts. Try again in ${Math.ceil(retryAfter / 60)} min.`,
        {
          details: { retryAfter },
        },
      );
    }
  }
}

export async function recordAttempt(kind: Kind, keys: string[]): Promise<void> {
  await db.insert(authAttempts).values(keys.map((key) => ({ kind, key })));
  // Old rows are of no further use; trimming here keeps the table small without a scheduler.
  await db
    .delete(authAttempts)
    .where(lt(authAttempts.createdAt, new Date(Date.now() - 2 * throttleWindowMs)));
}

export async function clearAttempts(kind: Kind, key: string): Promise<void> {
  await db.delete(authAttempts).where(and(eq(authAttempts.kind, kind), eq(authAttempts.key, key)));
}
