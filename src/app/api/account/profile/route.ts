import { eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { profileSchema } from "@/lib/auth/schemas";
import { json, parseBody } from "@/lib/http";

/** PATCH /api/account/profile: the signed-in user's display name. */
export const PATCH = route({ signedIn: true }, async (req, caller) => {
  const { name } = await parseBody(req, profileSchema);
  await db.update(users).set({ name }).where(eq(users.id, caller.user.id));
  return json({ status: "ok", name });
});
