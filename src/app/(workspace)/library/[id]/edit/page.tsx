import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { PageSkeleton } from "@/app/(workspace)/_components/page-skeleton";
import { PartForm } from "@/components/library/part-form";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { getPart, partFacets } from "@/db/queries/parts";
import { type PageMember, requireAction } from "@/lib/auth/page";
import { editable } from "@/lib/format";

export const metadata: Metadata = { title: "Edit part" };

export default async function EditPartPage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requireAction("part.write");
  const { id } = await params;
  const part = await getPart({ workspaceId: member.workspace.id, partId: id });
  if (!part) notFound();
  // Found (or 404 above, answered before anything streams): the rest loads behind a loading state.
  return (
    <Suspense fallback={<PageSkeleton>Loading the part form…</PageSkeleton>}>
      <EditPartView member={member} part={part} />
    </Suspense>
  );
}

async function EditPartView({
  member,
  part,
}: {
  member: PageMember;
  part: NonNullable<Awaited<ReturnType<typeof getPart>>>;
}) {
  const facets = await partFacets({ workspaceId: member.workspace.id });
  return (
    <div className="space-y-5">
      <TitleBar
        title={`Edit ${part.partNumber}`}
        context={
          <>
            <CrumbLink href="/library">Library</CrumbLink> ·{" "}
            <CrumbLink href={`/library/${part.id}`}>
              {part.maker} {part.partNumber}
            </CrumbLink>
          </>
        }
      />
      {part.status === "verified" ? (
        <p className="rounded-md border border-line border-l-2 border-l-accent bg-sunken px-3 py-2 text-sm">
          This part is verified. Changing V<sub>DSS</sub>, I<sub>DM</sub>, R<sub>DS(on)</sub>, T
          <sub>j,max</sub> or R<sub>th(j-c)</sub> returns it to draft until a lead checks it again.
        </p>
      ) : null}
      <PartForm
        partId={part.id}
        facets={facets}
        defaults={{
          partNumber: part.partNumber,
          maker: part.maker,
          technology: part.technology,
          package: part.package,
          vdsMax: editable(part.vdsMax),
          idMax: editable(part.idMax),
          idPulseMax: editable(part.idPulseMax),
          rdsOn: editable(part.rdsOn),
          tjMax: editable(part.tjMax, "plain"),
          rthJc: editable(part.rthJc, "plain"),
          avalancheEnergy: editable(part.avalancheEnergy),
          avalancheCurrent: editable(part.avalancheCurrent),
          avalancheBreakdown: editable(part.avalancheBreakdown),
          unitCost: editable(part.unitCost, "plain"),
          currency: part.currency ?? "",
          datasheetRevision: part.datasheetRevision ?? "",
          notes: part.notes ?? "",
        }}
      />
    </div>
  );
}
