import { z } from "zod";

/**
 * The app's configuration, read from the environment once and validated.
 * A missing or malformed variable stops the app with a message naming it.
 */
const schema = z.object({
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/ }),
  APP_URL: z.url().default("http://127.0.0.1:3000"),
  S3_ENDPOINT: z.url(),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z.string().min(3),
  S3_ACCESS_KEY_ID: z.string().min(1),
  S3_SECRET_ACCESS_KEY: z.string().min(1),
  SMTP_HOST: z.string().min(1),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535),
  SMTP_SECURE: z
    .enum(["true", "false"])
    .default("false")
    .transform((v) => v === "true"),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Pulsefence <no-reply@pulsefence.invalid>"),
  MAIL_INBOX_URL: z.url().optional(),
  /** How many reverse proxies in front of the app append to X-Forwarded-For; 0 (default) trusts none. */
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(5).default(0),
  /** Capture jobs this process works on at once (src/lib/capture/job.ts); 0: it only queues them. */
  JOB_WORKERS: z.coerce.number().int().min(0).max(16).default(1),
});

export type Env = z.infer<typeof schema>;

export class EnvError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid environment:\n${problems.map((p) => `  - ${p}`).join("\n")}`);
    this.name = "EnvError";
  }
}

/** Validates a raw environment; throws EnvError naming every bad variable. */
export function parseEnv(raw: Record<string, string | undefined>): Env {
  const result = schema.safeParse(raw);
  if (result.success) return result.data;
  throw new EnvError(
    result.error.issues.map((issue) => {
      const name = issue.path.join(".");
      return raw[name] === undefined ? `${name} is missing` : `${name} is malformed: ${issue.message}`;
    }),
  );
}

let cached: Env | undefined;

/** The validated environment of this process (validated on first use, then cached). */
export function env(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}
