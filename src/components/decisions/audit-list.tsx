"use client";

import Link from "next/link";
import { messageOf } from "@/components/api-client";
import { DateText } from "@/components/date-text";
import { LoadingBox } from "@/components/loading-box";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { auditWords } from "./audit-words";
import { useAudit } from "./queries";

/** The project's history for leads and admins: who did what, and when, newest first. */
export function AuditList({ projectId }: { projectId: string }) {
  const audit = useAudit(projectId);
  if (audit.isPending) return <LoadingBox className="h-40">Loading the record of changes…</LoadingBox>;
  if (audit.isError) {
    return (
      <p role="alert" className="text-sm text-fail">
        {messageOf(audit.error)}
      </p>
    );
  }
  const events = audit.data.events;
  return (
    <Table label="Project history">
      <thead>
        <tr>
          <Th className="w-40">When (UTC)</Th>
          <Th className="w-48">Who</Th>
          <Th>What</Th>
        </tr>
      </thead>
      <tbody>
        {events.length === 0 ? (
          <EmptyRow colSpan={3}>Nothing recorded for this project yet.</EmptyRow>
        ) : (
          events.map((event) => {
            const decisionId =
              typeof event.details?.decisionId === "string" ? event.details.decisionId : null;
            return (
              <Tr key={event.id}>
                <Td>
                  <DateText value={event.createdAt} withTime />
                </Td>
                <Td>{event.actor ?? <span className="text-ink-faint">removed account</span>}</Td>
                <Td className="whitespace-normal">
                  {auditWords(event)}
                  {decisionId ? (
                    <>
                      {" · "}
                      <Link
                        href={`/projects/${projectId}/decisions/${decisionId}`}
                        className="text-accent underline underline-offset-2"
                      >
                        open the record
                      </Link>
                    </>
                  ) : null}
                </Td>
              </Tr>
            );
          })
        )}
      </tbody>
    </Table>
  );
}
