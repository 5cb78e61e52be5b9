import { DateText } from "@/components/date-text";
import { Section } from "@/components/page-header";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { listOutbox } from "@/lib/mail/outbox";

const kindWords: Record<string, string> = {
  invitation: "Invitation",
  "failing-pulse": "Failing pulse",
  "password-reset": "Password reset",
  "verification-lapsed": "Verification lapsed",
};

/** The workspace's recent e-mails and whether each has gone out, for admins: a mail outage is visible here. */
export async function OutboxSection({ workspaceId }: { workspaceId: string }) {
  const rows = await listOutbox({ workspaceId, limit: 30 });
  const waiting = rows.filter((r) => r.status === "pending").length;
  return (
    <Section
      id="outbox"
      title="E-mail outbox"
      description={
        waiting
          ? `${waiting} e-mail${waiting === 1 ? "" : "s"} waiting: they are retried until the mail server accepts them.`
          : "Every e-mail the workspace sent recently. Unsent ones are retried until the mail server accepts them."
      }
    >
      <Table label="E-mail outbox">
        <thead>
          <tr>
            <Th className="w-36">What</Th>
            <Th>To</Th>
            <Th className="w-28">State</Th>
            <Th numeric className="w-20">
              Tries
            </Th>
            <Th className="w-40">Last problem</Th>
            <Th numeric className="w-36">
              Queued (UTC)
            </Th>
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <EmptyRow colSpan={6}>No e-mail yet.</EmptyRow>
          ) : (
            rows.map((row) => (
              <Tr key={row.id}>
                <Td>{kindWords[row.kind] ?? row.kind}</Td>
                <Td>{row.to}</Td>
                <Td>{row.status === "sent" ? "Sent" : "Waiting"}</Td>
                <Td numeric>{row.attempts}</Td>
                <Td>{row.status === "sent" ? "" : (row.lastError ?? "")}</Td>
                <Td numeric>
                  <DateText value={row.createdAt} withTime />
                </Td>
              </Tr>
            ))
          )}
        </tbody>
      </Table>
    </Section>
  );
}
