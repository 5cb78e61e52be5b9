import "server-only";
import { env } from "@/lib/env";
import { createMailer, type Mailer } from "./mailer";

export type { Mail, Mailer } from "./mailer";

let instance: Mailer | undefined;

/** The app's mailer, configured from the environment. */
export function mailer(): Mailer {
  const e = env();
  instance ??= createMailer({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE,
    user: e.SMTP_USER,
    password: e.SMTP_PASSWORD,
    from: e.MAIL_FROM,
  });
  return instance;
}
