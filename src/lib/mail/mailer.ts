import nodemailer from "nodemailer";
import { AppError } from "@/lib/errors";

export interface MailConfig {
  host: string;
  port: number;
  secure: boolean;
  user?: string;
  password?: string;
  from: string;
}

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** A thin adapter around nodemailer: any SMTP relay, or the local fake in development and tests. */
export function createMailer(config: MailConfig) {
  const transport = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: config.secure,
    ignoreTLS: !config.secure && !config.user,
    auth: config.user ? { user: config.user, pass: config.password ?? "" } : undefined,
    // Bounded waits: a hung mail server delays the outbox worker, never a request.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  });
  return {
    async ping(): Promise<void> {
      try {
        await transport.verify();
      } catch (error) {
        throw new AppError("unavailable:mail", "The mail server is not reachable.", { cause: error });
      }
    },
    async send(mail: Mail): Promise<{ messageId: string }> {
      try {
        const info = await transport.sendMail({ from: config.from, ...mail });
        return { messageId: info.messageId };
      } catch (error) {
        throw new AppError("unavailable:mail", "The e-mail could not be sent. Try again shortly.", {
          cause: error,
        });
      }
    },
  };
}

export type Mailer = ReturnType<typeof createMailer>;
