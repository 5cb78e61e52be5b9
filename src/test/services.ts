// Test helpers for integration tests that run against the real local services started by the test command.
import { expect } from "vitest";

/** The named environment variable; fails the test clearly when the test command did not provide it. */
export function requireEnv(name: string): string {
  const value = process.env[name];
  if (!value)
    throw new Error(`${name} is not set: run integration tests through the test command (npm test)`);
  return value;
}

/** The storage fake's settings from the environment the test command sets, for `createStorage`. */
export function storageConfig() {
  return {
    endpoint: requireEnv("S3_ENDPOINT"),
    region: process.env.S3_REGION ?? "us-east-1",
    bucket: requireEnv("S3_BUCKET"),
    accessKeyId: requireEnv("S3_ACCESS_KEY_ID"),
    secretAccessKey: requireEnv("S3_SECRET_ACCESS_KEY"),
  };
}

export interface InboxMail {
  id: string;
  subject: string;
  text: string;
  html?: string;
  to: { address: string }[];
}

/** Every e-mail the mail fake holds, newest last. */
export async function readInbox(): Promise<InboxMail[]> {
  const res = await fetch(`${requireEnv("MAIL_INBOX_URL")}/api/email`);
  if (!res.ok) throw new Error(`mail fake answered ${res.status}`);
  return (await res.json()) as InboxMail[];
}

/** The e-mails to `address` the mail fake holds, oldest first; with `subject`, only those whose subject matches. */
export async function mailsTo(address: string, subject?: RegExp): Promise<InboxMail[]> {
  return (await readInbox()).filter(
    (m) => m.to.some((t) => t.address === address) && (!subject || subject.test(m.subject)),
  );
}

/**
 * Waits until at least `count` e-mails to `address` (matching `subject`, if given) have arrived, polling the fake
 * through `expect.poll` (it stores mail asynchronously), and answers all of them, oldest first.
 */
export async function waitForMails(
  address: string,
  count: number,
  { subject, timeoutMs = 10_000 }: { subject?: RegExp; timeoutMs?: number } = {},
): Promise<InboxMail[]> {
  await expect
    .poll(async () => (await mailsTo(address, subject)).length, {
      timeout: timeoutMs,
      interval: 100,
      message: `e-mails to ${address}${subject ? ` matching ${subject}` : ""}`,
    })
    .toBeGreaterThanOrEqual(count);
  return mailsTo(address, subject);
}

/** Waits until an e-mail to `address` arrives and answers the latest one. */
export async function waitForMail(address: string, timeoutMs = 5000): Promise<InboxMail> {
  return (await waitForMails(address, 1, { timeoutMs })).at(-1)!;
}
