import { Section } from "@/components/page-header";
import { listOutbox } from "@/lib/mail/outbox";
import { OutboxTable } from "./outbox-table";

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
      <OutboxTable
        rows={rows.map(({ id, kind, to, status, attempts, lastError, createdAt }) => ({
          id,
          kind,
          to,
          status,
          attempts,
          lastError,
          createdAt,
        }))}
      />
    </Section>
  );
}
