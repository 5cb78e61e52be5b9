import type { z } from "zod";
import { AppError } from "./errors";

export type FieldErrors = Record<string, string[]>;

/** Flattens zod issues to `{ "field.path": [messages] }` for forms and API clients. */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "_";
    out[key] = [...(out[key] ?? []), issue.message];
  }
  return out;
}

/** The largest JSON body a route reads unless it says otherwise; larger ones answer 413 unread. */
export const maxJsonBytes = 1024 * 1024;
/** The deepest nesting of arrays and objects a JSON body may have (the deepest contract needs about 6). */
export const maxJsonDepth = 32;

export interface BodyLimits {
  maxBytes?: number;
}

/**
 * Reads a JSON body within bounds, before anything else looks at it: at most `maxBytes` (checked on the declared
 * length, then while streaming, so a 100 MB body is never read in full), nested at most `maxJsonDepth` deep, and
 * with no NUL character in any string or key (PostgreSQL text cannot hold one): each is a 4xx, never a 500.
 */
export async function readJson(req: Request, limits: BodyLimits = {}): Promise<unknown> {
  const maxBytes = limits.maxBytes ?? maxJsonBytes;
  const text = await readText(req, maxBytes);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new AppError("invalid:json", "The request body is not valid JSON.");
  }
  assertSafeShape(raw);
  return raw;
}

function tooLarge(maxBytes: number): AppError {
  return new AppError(
    "too_large:body",
    `The request body is larger than ${Math.round(maxBytes / 1024)} KiB.`,
  );
}

async function readText(req: Request, maxBytes: number): Promise<string> {
  const length = req.headers.get("content-length");
  const declared = Number(length);
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(maxBytes);
  // A body of declared length within the bound is read whole: Node's HTTP parser reads exactly that many bytes, so
  // the bound holds, and the lean API server (src/server/api-server.ts) then reads it straight from the socket
  // instead of through a web stream (so `req.body` is not touched first). The size is checked again after reading.
  if (length !== null && Number.isInteger(declared) && declared >= 0) {
    const bytes = await req.arrayBuffer();
    if (bytes.byteLength > maxBytes) throw tooLarge(maxBytes);
    return new TextDecoder("utf-8").decode(bytes);
  }
  if (!req.body) return "";
  const reader = req.body.getReader();
  // Each chunk is decoded as it arrives (a character split between chunks is carried over), so the body is never
  // copied into one buffer first.
  const decoder = new TextDecoder("utf-8");
  let text = "";
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel().catch(() => {});
      throw tooLarge(maxBytes);
    }
    text += decoder.decode(value, { stream: true });
  }
  return text + decoder.decode();
}

/** Walks the parsed value without recursion: bounded depth, no NUL in strings or keys. */
function assertSafeShape(root: unknown): void {
  const stack: { value: unknown; depth: number }[] = [{ value: root, depth: 0 }];
  while (stack.length) {
    const { value, depth } = stack.pop()!;
    if (typeof value === "string") {
      if (value.includes("\u0000")) throw nulError();
      continue;
    }
    if (value === null || typeof value !== "object") continue;
    if (depth >= maxJsonDepth) {
      throw new AppError(
        "invalid:depth",
        `The request body is nested more than ${maxJsonDepth} levels deep.`,
      );
    }
    if (Array.isArray(value)) {
      for (const item of value) stack.push({ value: item, depth: depth + 1 });
      continue;
    }
    for (const [key, item] of Object.entries(value)) {
      if (key.includes("\u0000")) throw nulError();
      stack.push({ value: item, depth: depth + 1 });
    }
  }
}

function nulError(): AppError {
  return new AppError("invalid:nul", "Text may not contain the NUL character (U+0000).");
}

/** Parses a JSON body with a zod schema; a bad body is a 400 naming each field and its problem. */
export async function parseBody<S extends z.ZodType>(
  req: Request,
  schema: S,
  limits: BodyLimits = {},
): Promise<z.infer<S>> {
  const raw = await readJson(req, limits);
  const result = schema.safeParse(raw);
  if (!result.success) {
    const fieldErrors = fieldErrorsOf(result.error);
    const first = Object.entries(fieldErrors)[0];
    throw new AppError("invalid", first ? `${first[0]}: ${first[1][0]}` : "Invalid request.", {
      details: { fieldErrors },
    });
  }
  return result.data;
}

export function json(body: unknown, init: ResponseInit = {}): Response {
  const headers = new Headers(init.headers);
  headers.set("cache-control", "no-store");
  return Response.json(body, { ...init, headers });
}
