import { resetPassword } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { resetPasswordSchema } from "@/lib/auth/schemas";
import { ipKeys, reserveAttempt } from "@/lib/auth/throttle";
import { hashToken } from "@/lib/auth/tokens";
import { json, parseBody } from "@/lib/http";

/**
 * POST /api/auth/reset-password: uses a reset link once; every session and API token of the account ends. Tries
 * are throttled per link and per trusted client address, and a link is checked before any password is hashed.
 */
export const POST = publicRoute(async (req) => {
  const { token, password } = await parseBody(req, resetPasswordSchema);
  await reserveAttempt("reset-use", [`link:${hashToken(token)}`, ...ipKeys(req)]);
  await resetPassword(token, password);
  return json({ status: "ok" });
});
