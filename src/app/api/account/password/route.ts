import { eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import { forgetCachedAuth } from "@/lib/auth/auth-memory";
import { route } from "@/lib/auth/guard";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { changePasswordSchema } from "@/lib/auth/schemas";
import { endOtherSessions } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { json, parseBody } from "@/lib/http";

/** POST /api/account/password: changes the password; every other session of the user ends. */
export const POST = route({ signedIn: true }, async (req, caller) => {
  const { currentPassword, newPassword } = await parseBody(req, changePasswordSchema);
  const user = await db.query.users.findFirst({
    where: eq(users.id, caller.user.id),
    columns: { passwordHash: true },
  });
  if (!user || !(await verifyPassword(user.passwordHash, currentPassword))) {
    throw new AppError("invalid:password", "The current password is wrong.", {
      details: { fieldErrors: { currentPassword: ["The current password is wrong"] } },
    });
  }
  await db
    .update(users)
    .set({ passwordHash: await hashPassword(newPassword) })
    .where(eq(users.id, caller.user.id));
  forgetCachedAuth();
  await endOtherSessions(caller.user.id, caller.sessionId);
  return json({ status: "ok" });
});
