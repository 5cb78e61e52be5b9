import Link from "next/link";
import { DateText } from "@/components/date-text";
import { policyStat } from "@/components/decisions/policy-stat";
import { linkButtonClass } from "@/components/form";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { ProjectTrail } from "@/components/projects/project-trail";
import { StatBlocks } from "@/components/stat-blocks";
import { percent } from "@/lib/format";
import type { DecisionSnapshot, loadDecision } from "@/lib/projects/decisions";
import { revisionOf } from "@/lib/soa/revision";

// The decision record's sections above its rationale: the title bar, where the record stands, its key figures.

type Decision = Awaited<ReturnType<typeof loadDecision>>;

/** The title, the way back through projects, and the downloads of the frozen record. */
export function DecisionTitle({
  project,
  decision,
}: {
  project: { id: string; name: string };
  decision: Decision;
}) {
  const base = `/projects/${project.id}`;
  return (
    <TitleBar
      title={`Decision: ${decision.chosenLabel}`}
      context={
        <>
          <ProjectTrail project={project} />
          {" / "}
          <CrumbLink href={`${base}/decisions`}>Decisions</CrumbLink>
        </>
      }
      actions={
        <>
          <Link href={`${base}/compare`} className={linkButtonClass}>
            Compare now
          </Link>
          <a
            href={`/api/projects/${project.id}/decisions/${decision.id}/csv`}
            download
            className={linkButtonClass}
          >
            Download CSV (frozen)
          </a>
          <a
            href={`/api/projects/${project.id}/decisions/${decision.id}/report`}
            download
            className="inline-flex h-9 items-center rounded-md border border-transparent bg-accent px-4 text-sm font-medium text-white hover:bg-accent-strong"
          >
            Download PDF
          </a>
        </>
      }
    />
  );
}

/** Whether the record stands or a later one superseded it, and whether it was signed on unverified drafts. */
export function DecisionStanding({ projectId, decision }: { projectId: string; decision: Decision }) {
  const drafts = decision.snapshot.candidates.filter((c) => c.status !== "verified");
  return (
    <>
      {decision.supersededBy ? (
        <p className="rounded-md border border-line border-l-2 border-l-nodata bg-sunken px-3 py-2 text-sm">
          Superseded on <DateText value={decision.supersededAt} withTime /> by{" "}
          <Link
            href={`/projects/${projectId}/decisions/${decision.supersededBy}`}
            className="text-accent underline underline-offset-2"
          >
            a later decision
          </Link>
          . This record stays as it was signed.
        </p>
      ) : (
        <p className="rounded-md border border-line border-l-2 border-l-accent bg-panel px-3 py-2 text-sm">
          The standing decision for this project.
        </p>
      )}

      {drafts.length > 0 ? (
        <p
          data-testid="unverified-warning"
          className="rounded-md border border-line border-l-2 border-l-marginal bg-panel px-3 py-2 text-sm"
        >
          {drafts.length === decision.snapshot.candidates.length
            ? "Every candidate was an unverified library draft when this was signed"
            : `${drafts.map((c) => c.partNumber).join(", ")} ${drafts.length === 1 ? "was an unverified library draft" : "were unverified library drafts"} when this was signed`}
          : {drafts.length === 1 ? "its" : "their"} curves had no second check against the datasheet.
        </p>
      ) : null}
    </>
  );
}

/** The record's key figures: the part, the signature, the frozen verdict, the policy and the methods' revision. */
export function DecisionStats({ decision, snapshot }: { decision: Decision; snapshot: DecisionSnapshot }) {
  const chosen = snapshot.ranking.find((r) => r.partId === decision.chosenPartId);
  const chosenPart = snapshot.candidates.find((c) => c.partId === decision.chosenPartId);
  return (
    <StatBlocks
      items={[
        {
          label: "Chosen part",
          value: chosenPart?.partNumber ?? decision.chosenLabel,
          note: chosenPart?.maker,
        },
        {
          label: "Signed by",
          value: decision.signedByName,
          note: <DateText value={decision.signedAt} withTime />,
        },
        {
          label: "Frozen evaluation",
          value: chosen ? (chosen.passesAll ? "passes every pulse" : `worst: ${chosen.worstVerdict}`) : "—",
          note: chosen
            ? `rank ${chosen.rank} · worst utilisation ${percent(chosen.worstUtilisation)}`
            : undefined,
        },
        policyStat(snapshot.policy),
        {
          label: "Methods",
          value: `revision ${revisionOf(snapshot)}`,
          note: "the rules the evaluation was found under",
        },
      ]}
    />
  );
}
