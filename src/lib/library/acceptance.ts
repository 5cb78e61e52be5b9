// Accepting a part's findings when verifying it: every open finding needs a reason (issue 12: a part marked
// verified in one click over ten open findings hid them). Shared by the verify form and its route.
import { z } from "zod";
import { type FindingLike, findingKey } from "./finding-key";

export { type FindingLike, findingKey };

export const verifySchema = z.object({
  acceptances: z
    .array(
      z.object({
        key: z.string().min(1).max(400),
        reason: z.string().trim().max(1000, { message: "At most 1000 characters" }),
      }),
    )
    .max(500)
    .default([]),
});

export type AcceptanceInput = z.infer<typeof verifySchema>["acceptances"][number];

/**
 * The open findings of the active set that the acceptances do not cover with a reason; empty when the part may be
 * verified. Findings stored before keys existed are keyed by their message.
 */
export function unaccepted<F extends FindingLike>(
  findings: readonly F[],
  acceptances: readonly AcceptanceInput[],
): F[] {
  const accepted = new Set(acceptances.filter((a) => a.reason.trim().length > 0).map((a) => a.key));
  return findings.filter((f) => !accepted.has(findingKey(f)));
}
