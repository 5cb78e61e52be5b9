import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { json, readJson } from "@/lib/http";
import { handleCheckRequest } from "@/lib/soa/contract";

/**
 * POST /api/v1/check: the engine's check contract (METHODS.md §9) for bench scripts, authenticated by an API
 * token (Authorization: Bearer …) or a session. Invalid input answers 400 with the field path and the reason.
 */
export const POST = route({ action: "check.run", bearer: true }, async (req) => {
  let body: unknown;
  try {
    // Bounded at the edge like every body (size, depth, NUL); the contract itself is the engine's to validate.
    body = await readJson(req, { maxBytes: 4 * 1024 * 1024 });
  } catch (error) {
    if (error instanceof AppError && error.code === "invalid:json") {
      return json({ error: { path: "", message: error.message } }, { status: 400 });
    }
    throw error;
  }
  const outcome = handleCheckRequest(body);
  return json(outcome.body, { status: outcome.status });
});
