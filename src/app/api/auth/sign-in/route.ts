import { checkCredentials, defaultWorkspace } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { signInSchema } from "@/lib/auth/schemas";
import { startSession } from "@/lib/auth/session";
import { assertNotThrottled, attemptKeys, clearAttempts, recordAttempt } from "@/lib/auth/throttle";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";

/** POST /api/auth/sign-in: after 5 failures in 15 minutes per e-mail or per IP, 429 with Retry-After. */
export const POST = publicRoute(async (req) => {
  const { email, password } = await parseBody(req, signInSchema);
  const keys = attemptKeys(req, email);
  await assertNotThrottled("sign-in", keys);
  const user = await checkCredentials(email, password);
  if (!user) {
    await recordAttempt("sign-in", keys);
    throw new AppError("unauthenticated:credentials", "E-mail or password is wrong.");
  }
  await clearAttempts("sign-in", keys[0]);
  const cookie = await startSession(user.id, await defaultWorkspace(user.id));
  return json({ status: "ok" }, { headers: { "set-cookie": cookie } });
});
