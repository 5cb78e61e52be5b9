"use client";

import { Button, linkButtonClass } from "@/components/form";
import { useUrlState } from "@/components/use-url-state";

/** The comparison's title-bar actions: the matrix as CSV for everyone, and for leads the decision form. */
export function CompareActions({ projectId, canSign }: { projectId: string; canSign: boolean }) {
  const [params, set] = useUrlState();
  const open = params.get("decide") === "1";
  return (
    <>
      <a href={`/api/projects/${projectId}/matrix`} download className={linkButtonClass}>
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
