import { requestSignUp } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { signUpSchema } from "@/lib/auth/schemas";
import { attemptKeys, reserveAttempt } from "@/lib/auth/throttle";
import { json, parseBody } from "@/lib/http";

/** What every valid sign-up is answered, whether or not the address already has an account. */
const signUpAccepted = {
  status: "check-email",
  message: "Check your e-mail: the link to finish creating your workspace is on its way.",
} as const;

/**
 * POST /api/auth/sign-up: asks for a new account and its workspace. Always 202 with the same body (no account
 * enumeration): a new address is e-mailed a link that creates the account and signs in; an address with an account
 * is e-mailed that someone tried, with a reset link. At most 5 tries per 15 minutes per e-mail (and trusted IP).
 */
export const POST = publicRoute(async (req) => {
  const input = await parseBody(req, signUpSchema);
  await reserveAttempt("sign-up", attemptKeys(req, input.email));
  await requestSignUp(input);
  return json(signUpAccepted, { status: 202 });
});
