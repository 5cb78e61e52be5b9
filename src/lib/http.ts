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

/** Parses a JSON body with a zod schema; a bad body is a 400 naming each field and its problem. */
export async function parseBody<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  let raw: unknown;
  try {
    raw = await req.json();
  } catch {
    throw new AppError("invalid:json", "The request body is not valid JSON.");
  }
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
