import "server-only";
import { eq } from "drizzle-orm";
import type { z } from "zod";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { noticePreferencesSchema } from "./schemas";

export type NoticePreferences = z.output<typeof noticePreferencesSchema>;

/** The column of each optional e-mail's choice. */
export const noticeColumns = {
  failingEvidence: users.noticeFailingEvidence,
  decisionDrift: users.noticeDecisionDrift,
  verificationLapsed: users.noticeVerificationLapsed,
};

/** The person's choice of optional e-mails. */
export async function getNoticePreferences(userId: string): Promise<NoticePreferences> {
  const [row] = await db.select(noticeColumns).from(users).where(eq(users.id, userId));
  return row ?? { failingEvidence: true, decisionDrift: true, verificationLapsed: true };
}

/** Stores the person's choice; the notifiers read it each time they would e-mail them. */
export async function setNoticePreferences(
  userId: string,
  prefs: NoticePreferences,
): Promise<NoticePreferences> {
  const [row] = await db
    .update(users)
    .set({
      noticeFailingEvidence: prefs.failingEvidence,
      noticeDecisionDrift: prefs.decisionDrift,
      noticeVerificationLapsed: prefs.verificationLapsed,
    })
    .where(eq(users.id, userId))
    .returning(noticeColumns);
  return row;
}
