import { checkCredentials, defaultWorkspace } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { signInSchema } from "@/lib/auth/schemas";
import { startSession } from "@/lib/auth/session";
import { attemptKeys, clearAttempts, releaseAttempt, reserveAttempt } from "@/lib/auth/throttle";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";

/**
 * POST /api/auth/sign-in: each try is reserved against the account (and the trusted client address) before the
 * password is checked; after 5 failures in 15 minutes, 429 with Retry-After, pointing the owner to a reset link.
 */
export const POST = publicRoute(async (req) => {
  const { email, password } = await parseBody(req, signInSchema);
  const keys = attemptKeys(req, email);
  const reservation = await reserveAttempt("sign-in", keys);
  const user = await checkCredentials(email, password);
  if (!user) throw new AppError("unauthenticated:credentials", "E-mail or password is wrong.");
  await releaseAttempt(reservation);
  await clearAttempts("sign-in", keys[0]);
  const cookie = await startSession(user.id, await defaultWorkspace(user.id));
  return json({ status: "ok" }, { headers: { "set-cookie": cookie } });
});
