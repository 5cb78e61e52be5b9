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

/** Turns anything thrown into an AppError; unknown errors become `internal` and are logged with their cause. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) {
    if (error.status >= 500) console.error(error.code, error.message, error.cause ?? "");
    return error;
  }
  console.error("internal error", error);
  return new AppError("internal", "Something went wrong on the server. It has been logged.", {
    cause: error,
  });
}

/** A JSON response for an error; never carries a stack trace. */
export function errorResponse(error: unknown): Response {
  const appError = toAppError(error);
  const headers = new Headers({ "cache-control": "no-store" });
  const retryAfter = (appError.details as { retryAfter?: number } | undefined)?.retryAfter;
  if (appError.kind === "rate_limited" && retryAfter) headers.set("retry-after", String(retryAfter));
  return Response.json(appError.toJSON(), { status: appError.status, headers });
}
