import "server-only";
import { db } from "@/db";
import { noticeRecipients } from "@/db/queries/members";
import { notices, type Project } from "@/db/schema";
import { env } from "@/lib/env";
import { percent, q } from "@/lib/format";
import { enqueueMail, flushOutbox } from "@/lib/mail/outbox";
import { type FailingPulse, failingEvidenceMail } from "@/lib/mail/templates";
import { sourceWords } from "@/lib/vocabulary";
import type { checkProject } from "./check";

type FullCheck = Awaited<ReturnType<typeof checkProject>>;
/** What the notice needs of a check: the pulses concerned, their results and the candidates' names. */
type Checked = Pick<FullCheck, "results" | "worstByPulse"> & {
  candidates: Pick<FullCheck["candidates"][number], "partId" | "maker" | "partNumber">[];
  pulses: Pick<FullCheck["pulses"][number], "id" | "source" | "name" | "v" | "i" | "duration">[];
};

/**
 * E-mails the project's owner about the new measured pulses or captures of one action (a paste, an upload, a bench
 * post) that fail, or have no data, on any candidate: one e-mail listing them all. Each pulse is noticed once, ever:
 * its notice row and the e-mail in the outbox are written in one transaction, so a re-check never queues again and
 * a mail outage only delays the e-mail; it never undoes the measurement. Only a current member of the workspace who
 * has not turned these notices off is told. Returns how many pulses the e-mail lists.
 */
export async function notifyFailingEvidence(
  project: Project,
  checked: Checked,
  pulseIds: string[],
): Promise<number> {
  if (!project.ownerId) return 0;
  const [owner] = await noticeRecipients({
    workspaceId: project.workspaceId,
    userIds: [project.ownerId],
    notice: "failingEvidence",
  });
  if (!owner) return 0;
  const failing = checked.pulses.filter(
    (p) =>
      pulseIds.includes(p.id) &&
      p.source !== "fault-case" &&
      ["fail", "no-data"].includes(checked.worstByPulse[p.id] ?? "pass"),
  );
  if (failing.length === 0) return 0;
  const ownerId = project.ownerId;
  const projectLink = `${env().APP_URL}/projects/${project.id}`;
  const listed = await db.transaction(async (tx) => {
    const claimed = await tx
      .insert(notices)
      .values(
        failing.map((pulse) => ({
          workspaceId: project.workspaceId,
          subjectType: pulse.source,
          subjectId: pulse.id,
          recipientId: ownerId,
        })),
      )
      .onConflictDoNothing()
      .returning({ subjectId: notices.subjectId });
    const fresh = failing.filter((p) => claimed.some((c) => c.subjectId === p.id));
    if (fresh.length === 0) return 0;
    const mail = failingEvidenceMail({
      to: owner.email,
      projectName: project.name,
      pulses: fresh.map((pulse) => describePulse(checked, pulse, `${projectLink}?pulse=${pulse.id}`)),
      projectLink,
    });
    await enqueueMail(mail, { kind: "failing-pulse", workspaceId: project.workspaceId }, tx);
    return fresh.length;
  });
  if (listed) await flushOutbox();
  return listed;
}

function describePulse(checked: Checked, pulse: Checked["pulses"][number], link: string): FailingPulse {
  const verdicts = checked.candidates.map((c) => {
    const r = checked.results[c.partId]?.[pulse.id];
    const detail = r
      ? [
          r.utilisation !== null ? `utilisation ${percent(r.utilisation)}` : null,
          r.tjPeak !== null ? `Tj peak ${q(r.tjPeak, "°C")}` : null,
        ]
          .filter(Boolean)
          .join(", ")
      : "no SOA curves";
    return { candidate: `${c.maker} ${c.partNumber}`, verdict: r?.verdict ?? "no-data", detail };
  });
  const pulseFigures = [
    pulse.v !== null ? q(pulse.v, "V") : null,
    pulse.i !== null ? q(pulse.i, "A") : null,
    pulse.duration !== null ? q(pulse.duration, "s") : null,
  ]
    .filter(Boolean)
    .join(", ");
  return { pulseName: pulse.name, source: sourceWords[pulse.source], pulseFigures, verdicts, link };
}
