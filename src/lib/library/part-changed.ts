import "server-only";
import type { Part } from "@/db/schema";
import { notifyDecisionDrift } from "@/lib/projects/drift-notify";
import { noticeLapsedVerification } from "./part-findings";

/**
 * What follows a committed change to the part data checks depend on: its verifier hears that the verification
 * lapsed, and the owners and signers of standing decisions whose verdicts it changed hear of the drift.
 */
export async function noticePartChange(
  part: Pick<Part, "id" | "workspaceId" | "partNumber" | "maker" | "status" | "verifiedBy">,
  change: string,
  actorName: string,
): Promise<void> {
  await noticeLapsedVerification(part, change, actorName);
  await notifyDecisionDrift(part, change, actorName);
}
