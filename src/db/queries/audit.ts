import "server-only";
import { db } from "@/db";
import { auditEvents } from "@/db/schema";

type Executor = Pick<typeof db, "insert">;

export interface AuditEntry {
  workspaceId: string;
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId?: string | null;
  details?: Record<string, unknown>;
}

/** Records who did what; pass the transaction when the change itself runs in one. */
export async function recordAudit(entry: AuditEntry, executor: Executor = db): Promise<void> {
  await executor.insert(auditEvents).values({ ...entry, details: entry.details ?? {} });
}
