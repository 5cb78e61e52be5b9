import { resetPassword } from "@/lib/auth/accounts";
import { publicRoute } from "@/lib/auth/guard";
import { resetPasswordSchema } from "@/lib/auth/schemas";
import { json, parseBody } from "@/lib/http";

/** POST /api/auth/reset-password: uses a reset link once; every session of the account ends. */
export const POST = publicRoute(async (req) => {
  const { token, password } = await parseBody(req, resetPasswordSchema);
  await resetPassword(token, password);
  return json({ status: "ok" });
});
