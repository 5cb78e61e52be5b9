import { requestPasswordReset } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { forgotPasswordSchema } from "@/lib/auth/schemas";
import { attemptKeys, reserveAttempt } from "@/lib/auth/throttle";
import { json, parseBody } from "@/lib/http";

/**
 * POST /api/auth/forgot-password: e-mails a reset link when the account exists, and answers the same either way
 * (no account enumeration). Every request counts toward the limit of 5 per 15 minutes per e-mail and per IP.
 */
export const POST = publicRoute(async (req) => {
  const { email } = await parseBody(req, forgotPasswordSchema);
  const keys = attemptKeys(req, email);
  await reserveAttempt("reset", keys);
  await requestPasswordReset(email);
  return json({ status: "ok" });
});
