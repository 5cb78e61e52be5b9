"use client";

import { useState } from "react";
import { FormMessage } from "@/components/form";
import { Section } from "@/components/page-header";
import { BuilderPanel } from "../builders/builder-panel";
import type { PanelProps } from "../project-workspace";
import { FaultCaseForm } from "./fault-case-form";
import { FaultCaseTable } from "./fault-case-table";

/** The fault cases tab: the table, then (for engineers) the pulse builders and the typed form. */
export function FaultCasesPanel({ projectId, detail, canWrite }: PanelProps) {
  const [added, setAdded] = useState<string | null>(null);
  return (
    <div className="space-y-8">
      <Section
        id="fault-cases"
        title="Fault cases"
        description="The pulses this design must survive, from calculations. Open one to see where it came from."
      >
        <FaultCaseTable
          projectId={projectId}
          faultCases={detail.faultCases}
          canWrite={canWrite}
          projectCaseTemp={detail.project.caseTemp}
        />
      </Section>
      {canWrite ? (
        <>
          <Section
            id="builders"
            title="Pulse builders"
            description="Derive a fault case from the circuit; the figures follow as you type, with their units."
          >
            <BuilderPanel projectId={projectId} detail={detail} />
          </Section>
          <Section
            id="typed"
            title="Type a fault case"
            description="Engineering notation works in every field: 48, 1.5k, 2m, 150u."
          >
            <FaultCaseForm projectId={projectId} onDone={(name) => setAdded(name)} />
            {added ? <FormMessage tone="done">Fault case &ldquo;{added}&rdquo; added.</FormMessage> : null}
          </Section>
        </>
      ) : (
        <p className="text-sm text-ink-muted">Engineers, leads and admins add and edit fault cases.</p>
      )}
    </div>
  );
}
