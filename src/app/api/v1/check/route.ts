import { route } from "@/lib/auth/guard";
import { json } from "@/lib/http";
import { handleCheckRequest } from "@/lib/soa/contract";

/**
 * POST /api/v1/check: the engine's check contract (METHODS.md §9) for bench scripts, authenticated by an API
 * token (Authorization: Bearer …) or a session. Invalid input answers 400 with the field path and the reason.
 */
export const POST = route({ action: "check.run", bearer: true }, async (req) => {
  let body: unknown;
  try {
    body = await req.json();
  } catch {
    return json({ error: { path: "", message: "The request body is not valid JSON." } }, { status: 400 });
  }
  const outcome = handleCheckRequest(body);
  return json(outcome.body, { status: outcome.status });
});
