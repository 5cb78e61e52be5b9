import type { ReactNode } from "react";
import { LoadingBox } from "@/components/loading-box";

/** What a workspace page shows while its data loads: a title's place and words saying what is loading. */
export function PageSkeleton({ children }: { children: ReactNode }) {
  return (
    <div>
      <div className="h-7 w-40 rounded bg-sunken" />
      <LoadingBox className="mt-6 h-48">{children}</LoadingBox>
    </div>
  );
}
