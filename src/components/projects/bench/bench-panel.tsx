"use client";

import { Caution } from "@/components/caution";
import { Section } from "@/components/page-header";
import type { PanelProps } from "../project-workspace";
import { MeasuredTable } from "./measured-table";
import { PasteMeasurements } from "./paste-measurements";

/** The bench tab: paste what the bench measured, preview the verdicts, save; then every measured pulse. */
export function BenchPanel({ projectId, detail, check, viewer, canMeasure, people }: PanelProps) {
  return (
    <div className="space-y-8">
      {canMeasure ? (
        <Section
          id="paste"
          title="Log bench measurements"
          description="Paste, preview the verdict of every row against every candidate, then save."
        >
          <PasteMeasurements projectId={projectId} />
        </Section>
      ) : null}
      <Section
        id="measured"
        title="Measured pulses"
        description="Open a label to see its results against every candidate."
      >
        <MeasuredTable
          projectId={projectId}
          rows={detail.measuredPulses}
          check={check}
          viewer={viewer}
          canMeasure={canMeasure}
          people={people}
        />
        <Caution className="mt-3" />
      </Section>
    </div>
  );
}
