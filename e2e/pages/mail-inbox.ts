import { expect } from "@playwright/test";

interface InboxMail {
  subject: string;
  text: string;
  to: { address: string }[];
}

/** The mail fake's inbox, read through its REST API. */
export async function waitForMail(to: string, subject: RegExp): Promise<InboxMail> {
  const inbox = process.env.MAIL_INBOX_URL;
  if (!inbox) throw new Error("MAIL_INBOX_URL is not set: start the test services first");
  let found: InboxMail | undefined;
  await expect
    .poll(
      async () => {
        const res = await fetch(`${inbox}/api/email`);
        const mails = (await res.json()) as InboxMail[];
        found = mails.find((m) => m.to.some((r) => r.address === to) && subject.test(m.subject));
        return Boolean(found);
      },
      { message: `an e-mail to ${to} matching ${subject}`, timeout: 20_000, intervals: [250, 500, 1000] },
    )
    .toBe(true);
  return found!;
}

/** The first link in a plain-text mail that points at `path` on the app. */
export function linkIn(mail: InboxMail, path: string): string {
  const match = mail.text.match(new RegExp(`https?://\\S+${path}\\S+`));
  if (!match) throw new Error(`no ${path} link in the e-mail "${mail.subject}"`);
  return match[0];
}
