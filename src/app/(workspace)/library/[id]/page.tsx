import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { cache, Suspense } from "react";
import { PageSkeleton } from "@/app/(workspace)/_components/page-skeleton";
import { Caution } from "@/components/caution";
import { CurveSetRevisions } from "@/components/library/curve-set-revisions";
import { LimitsPanel } from "@/components/library/limits-panel";
import { PartActions } from "@/components/library/part-actions";
import { LazyCurveUpload, LazyThermalEditor, LazyTransferEditor } from "@/components/library/part-page-lazy";
import { PartStats } from "@/components/library/part-stats";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { Section } from "@/components/page-header";
import { getActiveCurveSet, getPart, listCurveSets } from "@/db/queries/parts";
import { type PageMember, requireMember } from "@/lib/auth/page";
import { technologyLabels } from "@/lib/library/technologies";

/** The part, read once per request for both the title and the page. */
const pageOf = cache(async (partId: string) => {
  const member = await requireMember();
  return { member, part: await getPart({ workspaceId: member.workspace.id, partId }) };
});

export async function generateMetadata({ params }: { params: Promise<{ id: string }> }): Promise<Metadata> {
  const { part } = await pageOf((await params).id);
  return { title: part ? `${part.partNumber} · Library` : "Part" };
}

export default async function PartPage({ params }: { params: Promise<{ id: string }> }) {
  const { member, part } = await pageOf((await params).id);
  if (!part) notFound();
  // Found (or 404 above, answered before anything streams): the rest loads behind a loading state.
  return (
    <Suspense fallback={<PageSkeleton>Loading the part…</PageSkeleton>}>
      <PartView member={member} part={part} />
    </Suspense>
  );
}

async function PartView({
  member,
  part,
}: {
  member: PageMember;
  part: NonNullable<Awaited<ReturnType<typeof getPart>>>;
}) {
  const [sets, active] = await Promise.all([
    listCurveSets({ partId: part.id }),
    getActiveCurveSet({ partId: part.id }),
  ]);
  const canWrite = member.can("part.write");
  const canVerify = member.can("part.verify");

  return (
    <div className="space-y-8">
      <TitleBar
        title={
          <>
            {part.partNumber} <span className="font-normal text-ink-muted">{part.maker}</span>
          </>
        }
        context={
          <>
            <CrumbLink href="/library">Library</CrumbLink> · {technologyLabels[part.technology]} ·{" "}
            {part.package}
            {part.datasheetRevision ? ` · datasheet ${part.datasheetRevision}` : ""}
          </>
        }
        actions={
          <PartActions
            partId={part.id}
            archived={part.archivedAt !== null}
            status={part.status}
            hasCurves={active !== null}
            canWrite={canWrite}
            canVerify={canVerify}
            findings={active?.findings ?? []}
          />
        }
      />
      {part.archivedAt ? (
        <p className="rounded-md border border-line border-l-2 border-l-nodata bg-sunken px-3 py-2 text-sm">
          This part is archived: it is hidden from the library list and kept for the projects and decisions
          that used it.
        </p>
      ) : null}
      <PartStats part={part} />
      {part.notes ? (
        <p className="max-w-3xl text-sm whitespace-pre-line text-ink-muted">{part.notes}</p>
      ) : null}

      <Section
        id="soa"
        title="Safe operating area"
        description={
          active
            ? `Curve set ${active.fileName}: single pulse at ${active.refCaseTemp} °C case. Hover the chart for V, I and P.`
            : undefined
        }
      >
        {active ? (
          <LimitsPanel
            partId={part.id}
            partNumber={part.partNumber}
            tjMax={part.tjMax}
            curveSet={{
              id: active.id,
              fileName: active.fileName,
              refCaseTemp: active.refCaseTemp,
              curves: active.curves,
              findings: active.findings,
            }}
            accepted={part.status === "verified" ? part.acceptedFindings : []}
            hasTransfer={part.transfer !== null}
            hasThermal={Boolean(part.foster?.length)}
          />
        ) : (
          <div className="rounded-md border border-line bg-panel px-4 py-8 text-center text-sm text-ink-muted">
            <p className="font-medium text-ink">No SOA curves yet</p>
            <p className="mt-1">
              {canWrite
                ? "Upload the datasheet's SOA figure as a CSV file below; the chart appears here."
                : "An engineer uploads the datasheet's SOA curves; the chart appears here."}
            </p>
          </div>
        )}
      </Section>

      {canWrite ? (
        <Section
          id="upload"
          title="Upload a curve set"
          description="Trace the datasheet's SOA figure into V_DS, I_D points and upload them as CSV: a table or paired columns."
        >
          <LazyCurveUpload partId={part.id} />
        </Section>
      ) : null}

      <Section
        id="revisions"
        title="Curve-set revisions"
        description="Every curve set this part has had; one is active."
      >
        <CurveSetRevisions partId={part.id} sets={sets} canWrite={canWrite} />
      </Section>

      <Section
        id="thermal"
        title="Thermal model"
        description={
          <>
            Foster network, junction to case: Z<sub>th</sub>(t) = Σ R<sub>i</sub>·(1 − e
            <sup>
              −t/τ<sub>i</sub>
            </sup>
            ). It describes the transistor only and is never chained with heatsink stages.
          </>
        }
      >
        <LazyThermalEditor
          partId={part.id}
          canWrite={canWrite}
          model={{ foster: part.foster, thermalSource: part.thermalSource }}
        />
      </Section>

      <Section
        id="transfer"
        title="Transfer characteristics"
        description={
          <>
            Typical I<sub>D</sub>(V<sub>GS</sub>) at two junction temperatures, for the thermal-instability
            check of pulses in linear mode (METHODS.md §12).
          </>
        }
      >
        <LazyTransferEditor partId={part.id} canWrite={canWrite} transfer={part.transfer} />
      </Section>

      <Caution className="border-t border-line pt-4" />
    </div>
  );
}
