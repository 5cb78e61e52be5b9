import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { Caution } from "@/components/caution";
import { DateText } from "@/components/date-text";
import { DriftPanel } from "@/components/decisions/drift-panel";
import { percent, q } from "@/components/decisions/format";
import { FrozenCandidates } from "@/components/decisions/frozen-candidates";
import { FrozenMatrix } from "@/components/decisions/frozen-matrix";
import { TitleBar } from "@/components/library/title-bar";
import { LoadingBox } from "@/components/loading-box";
import { Section } from "@/components/page-header";
import { StatBlocks } from "@/components/stat-blocks";
import type { Project } from "@/db/schema";
import { requireMember } from "@/lib/auth/page";
import { AppError } from "@/lib/errors";
import { computeDrift, type DecisionSnapshot, loadDecision, snapshotNow } from "@/lib/projects/decisions";
import { loadProject } from "@/lib/projects/projects";
import { revisionOf } from "@/lib/soa/revision";

export const metadata: Metadata = { title: "Decision" };

const button =
  "inline-flex h-9 items-center rounded-md border border-line-strong bg-panel px-4 text-sm font-medium hover:bg-sunken";

export default async function DecisionPage({
  params,
}: {
  params: Promise<{ id: string; decisionId: string }>;
}) {
  const member = await requireMember();
  const { id, decisionId } = await params;
  const project = await loadProject({ workspaceId: member.workspace.id }, id).catch(missing);
  const decision = await loadDecision(project.id, decisionId).catch(missing);
  const snapshot = decision.snapshot;
  const chosen = snapshot.ranking.find((r) => r.partId === decision.chosenPartId);
  const chosenPart = snapshot.candidates.find((c) => c.partId === decision.chosenPartId);
  const base = `/projects/${project.id}`;
  const drafts = snapshot.candidates.filter((c) => c.status !== "verified");

  return (
    <div className="space-y-8">
      <TitleBar
        title={`Decision: ${decision.chosenLabel}`}
        context={
          <>
            <Link href="/projects" className="hover:text-ink hover:underline">
              Projects
            </Link>
            {" / "}
            <Link href={base} className="hover:text-ink hover:underline">
              {project.name}
            </Link>
            {" / "}
            <Link href={`${base}/decisions`} className="hover:text-ink hover:underline">
              Decisions
            </Link>
          </>
        }
        actions={
          <>
            <Link href={`${base}/compare`} className={button}>
              Compare now
            </Link>
            <a href={`/api/projects/${project.id}/decisions/${decision.id}/csv`} download className={button}>
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

      {decision.supersededBy ? (
        <p className="rounded-md border border-line border-l-2 border-l-nodata bg-sunken px-3 py-2 text-sm">
          Superseded on <DateText value={decision.supersededAt} withTime /> by{" "}
          <Link
            href={`${base}/decisions/${decision.supersededBy}`}
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
          {drafts.length === snapshot.candidates.length
            ? "Every candidate was an unverified library draft when this was signed"
            : `${drafts.map((c) => c.partNumber).join(", ")} ${drafts.length === 1 ? "was an unverified library draft" : "were unverified library drafts"} when this was signed`}
          : {drafts.length === 1 ? "its" : "their"} curves had no second check against the datasheet.
        </p>
      ) : null}

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
          {
            label: "Case temperature",
            value: q(snapshot.policy.caseTemp, "°C"),
            note: (
              <>
                limit {percent(snapshot.policy.utilisationLimit)} · T<sub>j</sub> guard{" "}
                {`${q(snapshot.policy.tjGuard, "")}\u2009K`}
                {snapshot.policy.voltageLimit === undefined
                  ? null
                  : ` · voltage limit ${percent(snapshot.policy.voltageLimit)}`}
              </>
            ),
          },
          {
            label: "Methods",
            value: `revision ${revisionOf(snapshot)}`,
            note: "the rules the evaluation was found under",
          },
        ]}
      />

      <Section id="rationale" title="Rationale">
        <blockquote className="max-w-4xl rounded-md border border-line bg-panel px-4 py-3 text-sm whitespace-pre-line">
          {decision.rationale}
        </blockquote>
      </Section>

      <Section
        id="drift"
        title="Checked again now"
        description="The project checked today with the current library, against what the decision froze."
      >
        <Suspense
          fallback={
            <LoadingBox className="h-16">Checking the project again to compare with the record…</LoadingBox>
          }
        >
          <Drift project={project} frozen={snapshot} />
        </Suspense>
      </Section>

      <Section
        id="frozen-matrix"
        title="Frozen matrix"
        description={
          <>
            As evaluated when signed (<DateText value={snapshot.takenAt} withTime /> UTC), in the rank order
            of that moment. Later edits to the library or the project never change it.
          </>
        }
      >
        <FrozenMatrix
          data={{
            candidates: snapshot.candidates.map(
              ({ partId, partNumber, maker, unitCost, currency, hasCurves }) => ({
                partId,
                partNumber,
                maker,
                unitCost,
                currency,
                hasCurves,
              }),
            ),
            pulses: snapshot.pulses,
            results: snapshot.results,
          }}
          ranking={snapshot.ranking}
        />
        <Caution className="mt-3" />
      </Section>

      <Section id="frozen-candidates" title="Candidates as frozen">
        <FrozenCandidates snapshot={snapshot} />
      </Section>
    </div>
  );
}

/** A project or decision that is not there (or not this workspace's) is the not-found page. */
function missing(error: unknown): never {
  if (error instanceof AppError) notFound();
  throw error;
}

async function Drift({ project, frozen }: { project: Project; frozen: DecisionSnapshot }) {
  const now = await snapshotNow(project);
  return <DriftPanel drift={computeDrift(frozen, now)} frozen={frozen.policy} now={now.policy} />;
}
