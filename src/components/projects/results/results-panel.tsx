"use client";

import { Caution } from "@/components/caution";
import { LoadingBox } from "@/components/loading-box";
import { Section } from "@/components/page-header";
import { useUrlState } from "@/components/use-url-state";
import { VerdictBadge } from "@/components/verdict-shape";
import { CandidatesPanel } from "../candidates/candidates-panel";
import type { PanelProps } from "../project-workspace";
import { CandidateChart } from "./candidate-chart";
import { ResultsTable } from "./results-table";

/** The results tab: the candidates, every pulse against each of them, and each candidate's SOA chart. */
export function ResultsPanel(props: PanelProps & { checkError: string | null }) {
  const { check, checkError, detail, canWrite, projectId } = props;
  const [params] = useUrlState();
  const highlight = params.get("pulse");
  return (
    <div className="space-y-8">
      <CandidatesPanel projectId={projectId} candidates={detail.candidates} canWrite={canWrite} />

      <Section
        id="results"
        title="Results"
        description="Open a pulse to see how each verdict was found: the figures, the derating and every assumption."
        aside={
          <p className="flex items-center gap-3">
            <span className="sr-only">Verdicts:</span>
            <VerdictBadge verdict="pass" />
            <VerdictBadge verdict="marginal" />
            <VerdictBadge verdict="fail" />
            <VerdictBadge verdict="no-data" />
          </p>
        }
      >
        {checkError ? (
          <p role="alert" className="text-sm text-fail">
            {checkError}
          </p>
        ) : !check ? (
          <LoadingBox className="h-48">Checking every pulse against every candidate…</LoadingBox>
        ) : (
          <ResultsTable check={check} highlight={highlight} />
        )}
        <Caution className="mt-3" />
      </Section>

      {check && check.candidates.length > 0 ? (
        <Section
          id="charts"
          title="Pulses on the SOA charts"
          description="Each candidate's curves at the project's case temperature, with every pulse at its voltage and current."
        >
          <div className="grid gap-4 lg:grid-cols-2">
            {check.candidates.map((c) => (
              <CandidateChart key={c.partId} candidate={c} check={check} />
            ))}
          </div>
          <Caution className="mt-3" />
        </Section>
      ) : null}
    </div>
  );
}
