// Only pages without an id in their path show a skeleton: a page that finds no such record must answer 404
// before anything is streamed, which a loading boundary above it would prevent.
import { PageSkeleton } from "../../_components/page-skeleton";

export default function Loading() {
  return <PageSkeleton>Loading the new-project form…</PageSkeleton>;
}
