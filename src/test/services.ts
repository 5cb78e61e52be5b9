// Test helpers for integration tests that run against the real local services started by the test command.

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

/** Waits until an e-mail to `address` arrives (the fake stores mail asynchronously). */
export async function waitForMail(address: string, timeoutMs = 5000): Promise<InboxMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const mail = (await readInbox()).filter((m) => m.to.some((t) => t.address === address)).at(-1);
    if (mail) return mail;
    if (Date.now() > until) throw new Error(`no e-mail to ${address} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
