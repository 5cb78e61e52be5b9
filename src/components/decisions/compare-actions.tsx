"use client";

import { Button } from "@/components/form";
import { useUrlState } from "@/components/use-url-state";

const link =
  "inline-flex h-9 items-center rounded-md border border-line-strong bg-panel px-4 text-sm font-medium hover:bg-sunken";

/** The comparison's title-bar actions: the matrix as CSV for everyone, and for leads the decision form. */
export function CompareActions({ projectId, canSign }: { projectId: string; canSign: boolean }) {
  const [params, set] = useUrlState();
  const open = params.get("decide") === "1";
  return (
    <>
      <a href={`/api/projects/${projectId}/matrix`} download className={link}>
        Download CSV
      </a>
      {canSign ? (
        <Button
          variant="primary"
          aria-expanded={open}
          aria-controls={open ? "record-decision" : undefined}
          onClick={() => set({ decide: open ? null : "1" })}
        >
          Record decision
        </Button>
      ) : null}
    </>
  );
}
