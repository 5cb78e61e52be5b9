/**
 * The browser side of our JSON route handlers: one call, one typed failure. Errors arrive as
 * `{ error: { code, message, details?: { fieldErrors?, retryAfter? } } }` with a proper status.
 */
export type FieldErrors = Record<string, string[]>;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fieldErrors: FieldErrors;

  constructor(status: number, code: string, message: string, fieldErrors: FieldErrors = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fieldErrors = fieldErrors;
  }
}

/** One row-level problem of an uploaded CSV, as the server lists them (src/lib/csv/issues.ts). */
export interface FileIssue {
  row: number | null;
  column: string | null;
  reason: string;
  message: string;
}

/** A failure that carries the CSV rows the server rejected. */
export class RejectedFile extends ApiError {
  constructor(
    status: number,
    code: string,
    message: string,
    readonly issues: FileIssue[],
  ) {
    super(status, code, message);
  }
}

interface ErrorBody {
  error?: { code?: string; message?: string; details?: { fieldErrors?: FieldErrors; issues?: FileIssue[] } };
}

/** Calls a JSON route handler; a failure is an ApiError (a RejectedFile when the server lists CSV rows). */
export async function requestJson<T = unknown>(
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE",
  url: string,
  body?: unknown,
): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      credentials: "same-origin",
      headers: body === undefined ? undefined : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch (cause) {
    console.error(cause);
    throw new ApiError(0, "network", "The server could not be reached. Check the connection and try again.");
  }
  const payload: unknown = await res.json().catch(() => null);
  if (res.ok) return payload as T;
  const error = (payload as ErrorBody | null)?.error;
  const message =
    error?.message ?? (res.status === 413 ? "The file is too large." : `The server answered ${res.status}.`);
  const code = error?.code ?? `http:${res.status}`;
  if (error?.details?.issues?.length) throw new RejectedFile(res.status, code, message, error.details.issues);
  throw new ApiError(res.status, code, message, error?.details?.fieldErrors ?? {});
}

/** A message for any thrown value, for inline display. */
export function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return "Something went wrong. Try again.";
}
