import type { Metadata } from "next";
import { Suspense } from "react";
import { NewPartLink, PartTable } from "@/components/library/part-table";
import { TitleBar } from "@/components/library/title-bar";
import { LoadingBox } from "@/components/loading-box";
import { requireMember } from "@/lib/auth/page";

export const metadata: Metadata = { title: "Library" };

export default async function LibraryPage() {
  const member = await requireMember();
  const canWrite = member.can("part.write");
  return (
    <div className="space-y-5">
      <TitleBar title="Library" context={member.workspace.name} actions={canWrite ? <NewPartLink /> : null} />
      <p className="text-sm text-ink-muted">
        The workspace&apos;s transistors with their ratings, SOA curve sets and thermal models. A lead marks a
        part verified after checking it against its datasheet; new curves or ratings return it to draft.
      </p>
      <Suspense fallback={<LoadingBox className="h-64">Loading the part library…</LoadingBox>}>
        <PartTable canWrite={canWrite} />
      </Suspense>
    </div>
  );
}
