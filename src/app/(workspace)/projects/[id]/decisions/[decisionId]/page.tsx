import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { Caution } from "@/components/caution";
import { DateText } from "@/components/date-text";
import { DriftPanel } from "@/components/decisions/drift-panel";
import { FrozenCandidates } from "@/components/decisions/frozen-candidates";
import { FrozenMatrix } from "@/components/decisions/frozen-matrix";
import { LoadingBox } from "@/components/loading-box";
import { Section } from "@/components/page-header";
import type { Project } from "@/db/schema";
import { requireMember } from "@/lib/auth/page";
import { AppError } from "@/lib/errors";
import { computeDrift, type DecisionSnapshot, loadDecision, snapshotNow } from "@/lib/projects/decisions";
import { loadProject } from "@/lib/projects/projects";
import { DecisionStanding, DecisionStats, DecisionTitle } from "./decision-sections";

export const metadata: Metadata = { title: "Decision" };

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

  return (
    <div className="space-y-8">
      <DecisionTitle project={project} decision={decision} />
      <DecisionStanding projectId={project.id} decision={decision} />
      <DecisionStats decision={decision} snapshot={snapshot} />

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
