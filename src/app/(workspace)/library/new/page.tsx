import type { Metadata } from "next";
import { emptyPart, PartForm } from "@/components/library/part-form";
import { CrumbLink, TitleBar } from "@/components/library/title-bar";
import { partFacets } from "@/db/queries/parts";
import { requireAction } from "@/lib/auth/page";

export const metadata: Metadata = { title: "New part" };

export default async function NewPartPage() {
  const member = await requireAction("part.write");
  const facets = await partFacets({ workspaceId: member.workspace.id });
  return (
    <div className="space-y-5">
      <TitleBar
        title="New part"
        context={
          <>
            <CrumbLink href="/library">Library</CrumbLink> · {member.workspace.name}
          </>
        }
      />
      <p className="text-sm text-ink-muted">
        Enter the ratings from the datasheet. The part starts as a draft; its SOA curves and thermal model are
        added on its page next.
      </p>
      <PartForm defaults={emptyPart} facets={facets} />
    </div>
  );
}
