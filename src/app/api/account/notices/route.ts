import { route } from "@/lib/auth/guard";
import { getNoticePreferences, setNoticePreferences } from "@/lib/auth/notice-preferences";
import { noticePreferencesSchema } from "@/lib/auth/schemas";
import { json, parseBody } from "@/lib/http";

/** GET /api/account/notices: which optional e-mails the signed-in user gets. */
export const GET = route({ signedIn: true }, async (_req, caller) => {
  return json({ preferences: await getNoticePreferences(caller.user.id) });
});

/**
 * PATCH /api/account/notices { failingEvidence, decisionDrift, verificationLapsed }: the signed-in user's choice of
 * optional e-mails. Invitations, reset and sign-up links are account mail and always sent.
 */
export const PATCH = route({ signedIn: true }, async (req, caller) => {
  const prefs = await parseBody(req, noticePreferencesSchema);
  return json({ status: "ok", preferences: await setNoticePreferences(caller.user.id, prefs) });
});
