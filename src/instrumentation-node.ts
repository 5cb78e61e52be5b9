import { EnvError, parseEnv } from "@/lib/env";

// A missing or malformed variable stops the app with a message naming it.
try {
  parseEnv(process.env);
} catch (error) {
  if (error instanceof EnvError) {
    console.error(`Pulsefence cannot start.\n${error.message}`);
    process.exit(1);
  }
  throw error;
}

// The mail outbox worker: delivers queued e-mails and retries them while the mail server is down.
const { startOutboxWorker } = await import("@/lib/mail/outbox");
startOutboxWorker();
