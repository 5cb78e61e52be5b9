"use client";

import dynamic from "next/dynamic";
import { useMemo } from "react";
import { messageOf } from "@/components/api-client";
import { Caution } from "@/components/caution";
import { LoadingBox } from "@/components/loading-box";
import { Section } from "@/components/page-header";
import { useUrlState } from "@/components/use-url-state";
import { ComparisonStats } from "./comparison-stats";
import { filterFrom, type MatrixFilter, rankAll } from "./matrix-model";
import { MatrixSection } from "./matrix-section";
import { OverlayPanel } from "./overlay-panel";
import { useCheck } from "./queries";
import type { ProjectCheck } from "./types";

// The decision form (with its zod schema) loads when a lead opens it.
const DecisionForm = dynamic(() => import("./decision-form").then((m) => m.DecisionForm), {
  loading: () => <LoadingBox className="h-48">Loading the decision form…</LoadingBox>,
});

/**
 * The lead's comparison: key figures, the decision form when asked for (leads only), the ranked matrix with its
 * filters in the URL, the explanation of a chosen cell, and the overlay of every candidate's limit lines.
 */
export function CompareView({
  projectId,
  projectName,
  canSign,
}: {
  projectId: string;
  projectName: string;
  canSign: boolean;
}) {
  const check = useCheck(projectId);
  if (check.isPending) {
    return (
      <LoadingBox className="h-96">Checking the project: every pulse against every candidate…</LoadingBox>
    );
  }
  if (check.isError) {
    return (
      <p role="alert" className="text-sm text-fail">
        {messageOf(check.error)}
      </p>
    );
  }
  return <Comparison projectId={projectId} projectName={projectName} canSign={canSign} check={check.data} />;
}

function Comparison({
  projectId,
  projectName,
  canSign,
  check,
}: {
  projectId: string;
  projectName: string;
  canSign: boolean;
  check: ProjectCheck;
}) {
  const [params, setParams] = useUrlState();
  const filter = useMemo(() => filterFrom(params), [params]);
  const deciding = canSign && params.get("decide") === "1";
  const ranking = useMemo(() => rankAll(check), [check]);

  function setFilter(next: MatrixFilter) {
    setParams({ pulses: next.scope === "all" ? null : next.scope, failures: next.failuresOnly ? "1" : null });
  }

  const empty =
    check.candidates.length === 0
      ? "No candidates yet. Add the parts to compare on the project page."
      : check.pulses.length === 0
        ? "No fault cases or measured pulses yet. Add them on the project page to compare the candidates."
        : null;

  return (
    <div className="space-y-8">
      <ComparisonStats projectId={projectId} check={check} ranking={ranking} />

      {deciding ? (
        <DecisionForm
          projectId={projectId}
          candidates={check.candidates}
          ranking={ranking}
          onCancel={() => setParams({ decide: null })}
        />
      ) : null}

      <MatrixSection
        projectId={projectId}
        check={check}
        ranking={ranking}
        empty={empty}
        filter={filter}
        onFilter={setFilter}
      />

      {empty ? null : (
        <Section
          id="overlay"
          title="Limits side by side"
          description="Every candidate's derated SOA limit for the chosen pulses, on one chart."
        >
          <OverlayPanel check={check} title={projectName} />
          <Caution className="mt-3" />
        </Section>
      )}
    </div>
  );
}
