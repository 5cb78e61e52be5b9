import { logError } from "./log";

/**
 * The one application error. Its code says what went wrong ("not_found:part"), the HTTP status is derived
 * from the code's kind, the message is safe to show to a user, and the original error is kept as `cause`.
 */
const statusByKind = {
  invalid: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
} as const;

export type ErrorKind = keyof typeof statusByKind;
export type ErrorCode = ErrorKind | `${ErrorKind}:${string}`;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly status: number;
  readonly details?: unknown;

  constructor(code: ErrorCode, message: string, options: { cause?: unknown; details?: unknown } = {}) {
    super(message, { cause: options.cause });
    this.name = "AppError";
    this.code = code;
    this.status = statusByKind[kindOf(code)];
    this.details = options.details;
  }

  get kind(): ErrorKind {
    return kindOf(this.code);
  }

  toJSON(): { error: { code: ErrorCode; message: string; details?: unknown } } {
    return { error: { code: this.code, message: this.message, details: this.details } };
  }
}

function kindOf(code: ErrorCode): ErrorKind {
  return code.split(":")[0] as ErrorKind;
}

/** Turns anything thrown into an AppError; unknown errors become `internal` and are logged without secrets. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) {
    if (error.status >= 500) logError(error.code, error);
    return error;
  }
  if (isDatabaseOutage(error)) {
    logError("unavailable:database", error);
    return new AppError("unavailable:database", "The database is not reachable. Try again shortly.", {
      cause: error,
      details: { retryAfter: outageRetryAfterSeconds },
    });
  }
  logError("internal", error);
  return new AppError("internal", "Something went wrong on the server. It has been logged.", {
    cause: error,
  });
}

/** How long a client is told to wait before retrying after an outage. */
export const outageRetryAfterSeconds = 5;

// Connection failures of the driver (postgres.js codes and Node socket errors) and PostgreSQL's own
// connection-exception (08…) and operator-intervention (57P…) classes, from the PostgreSQL manual, appendix A.
const outageCodes = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENOTFOUND",
  "EPIPE",
  "CONNECT_TIMEOUT",
  "CONNECTION_CLOSED",
  "CONNECTION_ENDED",
  "CONNECTION_DESTROYED",
  "53300",
]);

/** True when an error (or one of its causes) says the database cannot be reached. */
export function isDatabaseOutage(error: unknown): boolean {
  let current: unknown = error;
  for (let depth = 0; current && depth < 5; depth++) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === "string" && (outageCodes.has(code) || /^(08|57P)/.test(code))) return true;
    current = (current as { cause?: unknown }).cause;
  }
  return false;
}

/** A JSON response for an error; never carries a stack trace. */
export function errorResponse(error: unknown): Response {
  const appError = toAppError(error);
  const headers = new Headers({ "cache-control": "no-store" });
  const retryAfter = (appError.details as { retryAfter?: number } | undefined)?.retryAfter;
  const retryable = appError.kind === "rate_limited" || appError.kind === "unavailable";
  if (retryable) headers.set("retry-after", String(retryAfter ?? outageRetryAfterSeconds));
  return Response.json(appError.toJSON(), { status: appError.status, headers });
}
