// The check contract (METHODS.md §9) as one function for both doors: `POST /api/v1/check` and
// `npm run --silent soa -- check`. Valid requests answer 200 with one result per pulse; invalid ones 400 with
// the field path and the reason. Neither ever carries a stack trace.
import { runCheck } from "./check";
import { type ContractError, validateCheckRequest } from "./schema";
import type { CheckResponse } from "./types";

export type CheckOutcome =
  | { status: 200; body: CheckResponse }
  | { status: 400; body: { error: ContractError } };

/** Validates a parsed JSON body and runs the check. */
export function handleCheckRequest(body: unknown): CheckOutcome {
  const validation = validateCheckRequest(body);
  if (!validation.ok) return { status: 400, body: { error: validation.error } };
  return { status: 200, body: runCheck(validation.request) };
}

/** Same, from the raw request text: text that is not JSON (a bare NaN, say) is an error at path "". */
export function handleCheckText(text: string): CheckOutcome {
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch (error) {
    // JSON.parse throws only SyntaxError; its message says where the text went wrong.
    const reason = (error as SyntaxError).message;
    return {
      status: 400,
      body: { error: { path: "", message: `the request is not valid JSON: ${reason}` } },
    };
  }
  return handleCheckRequest(body);
}
