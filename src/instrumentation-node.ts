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

// The capture job workers (JOB_WORKERS per process; any number of processes or machines share the queue). On a stop
// signal the queue stops taking jobs and lets running ones finish (up to 10 s), and the app server its requests in
// flight, before the process exits; a job cut short is retried by another worker.
const [{ env }, { startCaptureWorkers }, { stopJobQueue }, { storage }, { logError }] = await Promise.all([
  import("@/lib/env"),
  import("@/lib/capture/job"),
  import("@/lib/jobs/boss"),
  import("@/lib/storage"),
  import("@/lib/log"),
]);
startCaptureWorkers(storage, env().JOB_WORKERS).catch((error) =>
  logError("capture workers did not start", error),
);
for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.once(signal, () => {
    void stopJobQueue(10_000)
      // The app server's requests in flight (src/server/app-main.ts), when it is the one serving.
      .then(() => (globalThis as { pulsefenceRequestsDone?: Promise<void> }).pulsefenceRequestsDone)
      .finally(() => process.exit(signal === "SIGTERM" ? 143 : 130));
  });
}
