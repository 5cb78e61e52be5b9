import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { memberships, notices, type Project, users } from "@/db/schema";
import { env } from "@/lib/env";
import { enqueueMail, flushOutbox } from "@/lib/mail/outbox";
import { failingPulseMail } from "@/lib/mail/templates";
import { formatTemperature } from "@/lib/soa/sanity";
import { formatQuantity } from "@/lib/soa/units";
import type { checkProject } from "./check";

type FullCheck = Awaited<ReturnType<typeof checkProject>>;
/** What the notice needs of a check: the pulses concerned, their results and the candidates' names. */
type Checked = Pick<FullCheck, "results" | "worstByPulse"> & {
  candidates: Pick<FullCheck["candidates"][number], "partId" | "maker" | "partNumber">[];
  pulses: Pick<FullCheck["pulses"][number], "id" | "source" | "name" | "v" | "i" | "duration">[];
};

const sourceWords = { measured: "measured pulse", capture: "capture", "fault-case": "fault case" } as const;

/**
 * E-mails the project's owner engineer about each new measured pulse or capture that fails, or has no data, on
 * any candidate: exactly one e-mail per pulse. The notice row and the e-mail in the outbox are written together,
 * so a re-check never queues again and a mail outage only delays the e-mail; it never undoes the measurement.
 */
export async function notifyFailingEvidence(
  project: Project,
  checked: Checked,
  pulseIds: string[],
): Promise<number> {
  if (!project.ownerId) return 0;
  // Only a current member of the project's workspace is told: a removed owner hears nothing more.
  const [owner] = await db
    .select({ email: users.email })
    .from(users)
    .innerJoin(
      memberships,
      and(eq(memberships.userId, users.id), eq(memberships.workspaceId, project.workspaceId)),
    )
    .where(eq(users.id, project.ownerId));
  if (!owner) return 0;
  let queued = 0;
  for (const pulse of checked.pulses.filter((p) => pulseIds.includes(p.id))) {
    const worst = checked.worstByPulse[pulse.id];
    if (worst !== "fail" && worst !== "no-data") continue;
    if (pulse.source === "fault-case") continue;
    const verdicts = checked.candidates.map((c) => {
      const r = checked.results[c.partId]?.[pulse.id];
      const detail = r
        ? [
            r.utilisation !== null ? `utilisation ${(r.utilisation * 100).toFixed(0)} %` : null,
            r.tjPeak !== null ? `Tj peak ${formatTemperature(r.tjPeak)}` : null,
          ]
            .filter(Boolean)
            .join(", ")
        : "no SOA curves";
      return { candidate: `${c.maker} ${c.partNumber}`, verdict: r?.verdict ?? "no-data", detail };
    });
    const figures = [
      pulse.v !== null ? formatQuantity(pulse.v, "V") : null,
      pulse.i !== null ? formatQuantity(pulse.i, "A") : null,
      pulse.duration !== null ? formatQuantity(pulse.duration, "s") : null,
    ]
      .filter(Boolean)
      .join(", ");
    const mail = failingPulseMail({
      to: owner.email,
      projectName: project.name,
      pulseName: pulse.name,
      source: sourceWords[pulse.source],
      pulseFigures: figures,
      verdicts,
      link: `${env().APP_URL}/projects/${project.id}?pulse=${pulse.id}`,
    });
    const ownerId = project.ownerId;
    const claimed = await db.transaction(async (tx) => {
      const [notice] = await tx
        .insert(notices)
        .values({
          workspaceId: project.workspaceId,
          subjectType: pulse.source,
          subjectId: pulse.id,
          recipientId: ownerId,
        })
        .onConflictDoNothing()
        .returning({ id: notices.id });
      if (notice) await enqueueMail(mail, { kind: "failing-pulse", workspaceId: project.workspaceId }, tx);
      return Boolean(notice);
    });
    if (claimed) queued++;
  }
  if (queued) await flushOutbox();
  return queued;
}
