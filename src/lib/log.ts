/**
 * The one way the server logs an error. A failed query's parameters hold live secrets (session ids, password and
 * token hashes), and database messages can quote the offending value, so neither is ever written: a database error
 * is logged by its code and the query's name (operation and table), other errors by their name, code and stack.
 */
export function logError(context: string, error: unknown): void {
  console.error(`${context}: ${describeError(error)}`);
}

const maxDepth = 5;

/** A one-line-per-cause description of an error that is safe to write to a log. */
export function describeError(error: unknown): string {
  const parts: string[] = [];
  let current: unknown = error;
  for (let depth = 0; current !== undefined && current !== null && depth < maxDepth; depth++) {
    parts.push(describeOne(current));
    current = (current as { cause?: unknown }).cause;
  }
  return parts.join("\n  caused by ");
}

function describeOne(error: unknown): string {
  if (typeof error !== "object" || error === null) return typeof error;
  const e = error as { name?: unknown; code?: unknown; query?: unknown; severity?: unknown; stack?: unknown };
  const name = typeof e.name === "string" ? e.name : "Error";
  const code = typeof e.code === "string" || typeof e.code === "number" ? ` code=${e.code}` : "";
  if (typeof e.query === "string") return `${name}${code} query=${queryName(e.query)}`;
  // A PostgreSQL error (it carries a severity): its message may quote a value, so only its code is kept.
  if (typeof e.severity === "string") return `${name}${code} severity=${e.severity}`;
  if (isAppError(error)) return `${name}${code} ${error.message}`;
  return `${name}${code}${stackFrames(e.stack)}`;
}

function isAppError(error: object): error is { message: string } {
  return (error as { name?: unknown }).name === "AppError";
}

/** "insert users", "select sessions": what a query did and to which table, without its text or values. */
export function queryName(query: string): string {
  const text = query.trim().toLowerCase();
  const verb = /^(select|insert|update|delete|with|begin|commit|rollback|savepoint|release)/.exec(text)?.[1];
  const table = /(?:from|into|update|join)\s+"?([a-z_][a-z0-9_]*)"?/.exec(text)?.[1];
  return [verb ?? "query", table].filter(Boolean).join(" ");
}

/** The stack's frames only: its first line repeats the message, which may quote a value. */
function stackFrames(stack: unknown): string {
  if (typeof stack !== "string") return "";
  const frames = stack
    .split("\n")
    .filter((line) => /^\s+at /.test(line))
    .slice(0, 8);
  return frames.length ? `\n${frames.join("\n")}` : "";
}
