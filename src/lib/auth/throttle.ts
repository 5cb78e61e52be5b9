import "server-only";
import { and, count, eq, gt, inArray, lt, min, sql } from "drizzle-orm";
import { db } from "@/db";
import { authAttempts } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";

export const throttleWindowMs = 15 * 60 * 1000;
export const throttleLimit = 5;

type Kind = "sign-in" | "reset" | "reset-use" | "sign-up";

/**
 * The keys an attempt counts against: the e-mail address (or link), and the client's IP when a configured proxy in
 * front of the app tells it. Without one, no forwarded address is believed: a client could rotate it to escape the
 * limit, or spoof someone else's to lock them out.
 */
export function attemptKeys(req: Request, email: string): string[] {
  return [`email:${email.trim().toLowerCase()}`, ...ipKeys(req)];
}

/** The trusted client address as a throttle key, when there is one. */
export function ipKeys(req: Request): string[] {
  const ip = clientIp(req);
  return ip ? [`ip:${ip}`] : [];
}

/**
 * The client's address as the nearest trusted proxy saw it. Each of the `TRUSTED_PROXY_HOPS` proxies appends the
 * address it received from to X-Forwarded-For, so the client is that many entries from the right; anything further
 * left was written by the client itself. With no proxy configured (the default), there is no trusted address.
 */
export function clientIp(req: Request, hops = env().TRUSTED_PROXY_HOPS): string | null {
  if (hops < 1) return null;
  const chain = (req.headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  return chain.length >= hops ? chain[chain.length - hops] : null;
}

export interface Reservation {
  ids: string[];
}

/**
 * Reserves one attempt against every key, atomically: under a per-key advisory lock the keys' attempts in the window
 * are counted and, when all are under `throttleLimit`, the attempt is recorded before any password is checked. So
 * 40 parallel guesses get at most `throttleLimit` checks; the rest are answered 429 with Retry-After. Stored in
 * PostgreSQL, so the limit holds across restarts and several app instances. A successful attempt is given back
 * with `releaseAttempt`.
 */
export async function reserveAttempt(kind: Kind, keys: string[], now = new Date()): Promise<Reservation> {
  const since = new Date(now.getTime() - throttleWindowMs);
  const sorted = [...new Set(keys)].sort();
  return db.transaction(async (tx) => {
    for (const key of sorted) {
      await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`throttle:${kind}:${key}`}))`);
    }
    const rows = await tx
      .select({ key: authAttempts.key, n: count(), oldest: min(authAttempts.createdAt) })
      .from(authAttempts)
      .where(
        and(
          eq(authAttempts.kind, kind),
          inArray(authAttempts.key, sorted),
          gt(authAttempts.createdAt, since),
        ),
      )
      .groupBy(authAttempts.key);
    for (const row of rows) {
      if (row.n < throttleLimit) continue;
      const oldest = row.oldest ? new Date(row.oldest).getTime() : now.getTime();
      const retryAfter = Math.max(1, Math.ceil((oldest + throttleWindowMs - now.getTime()) / 1000));
      throw throttled(kind, row.key, retryAfter);
    }
    const inserted = await tx
      .insert(authAttempts)
      .values(sorted.map((key) => ({ kind, key, createdAt: now })))
      .returning({ id: authAttempts.id });
    // Old rows are of no further use; trimming here keeps the table small without a scheduler.
    await tx
      .delete(authAttempts)
      .where(lt(authAttempts.createdAt, new Date(now.getTime() - 2 * throttleWindowMs)));
    return { ids: inserted.map((r) => r.id) };
  });
}

function throttled(kind: Kind, key: string, retryAfter: number): AppError {
  const minutes = Math.ceil(retryAfter / 60);
  // An account's own limit is reached by anyone's failures: its owner is pointed to the reset link, which
  // proves the mailbox and clears the count, so a stranger's guesses never lock them out for good.
  if (kind === "sign-in" && key.startsWith("email:")) {
    return new AppError(
      "rate_limited:account",
      `Too many failed sign-ins for this account. Reset your password by e-mail, or try again in ${minutes} min.`,
      { details: { retryAfter } },
    );
  }
  return new AppError("rate_limited", `Too many attempts. Try again in ${minutes} min.`, {
    details: { retryAfter },
  });
}

/** Gives a reserved attempt back (it succeeded), so it does not count toward the limit. */
export async function releaseAttempt(reservation: Reservation): Promise<void> {
  if (reservation.ids.length) await db.delete(authAttempts).where(inArray(authAttempts.id, reservation.ids));
}

export async function clearAttempts(kind: Kind, key: string): Promise<void> {
  await db.delete(authAttempts).where(and(eq(authAttempts.kind, kind), eq(authAttempts.key, key)));
}
