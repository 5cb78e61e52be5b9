"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { useWatch } from "react-hook-form";
import { requestJson } from "@/components/api-client";
import { lazyResolver } from "@/components/api-form";
import { Button, FormActions, FormMessage, SelectField } from "@/components/form";
import { TextAreaField } from "@/components/library/fields";
import { useSaveForm } from "@/components/save-form";
import { percent } from "@/lib/format";
import type { MatrixRow } from "@/lib/projects/matrix";
import type { SignDecisionValues } from "@/lib/projects/schema";
import { verdictWords } from "@/lib/vocabulary";
import { CandidateLibraryStatus } from "./candidate-status";
import { bestPassing } from "./matrix-model";
import { type CheckedCandidate, decisionKeys } from "./types";

/**
 * A lead signs the choice: the candidate (the best one that passes every pulse, unless changed) and why. The
 * server freezes the evaluation with it; on success the decision's record opens.
 */
export function DecisionForm({
  projectId,
  candidates,
  ranking,
  onCancel,
}: {
  projectId: string;
  candidates: CheckedCandidate[];
  ranking: MatrixRow[];
  onCancel: () => void;
}) {
  const client = useQueryClient();
  // One key per opened form: a double click or a resent request is answered 409, not signed twice.
  const idempotencyKey = useRef(crypto.randomUUID());
  const form = useSaveForm<SignDecisionValues, SignDecisionValues>({
    resolver: lazyResolver(() => import("@/lib/projects/schema").then((m) => m.signDecisionSchema)),
    defaultValues: { partId: bestPassing(ranking) ?? "", rationale: "" },
    fields: ["partId", "rationale"],
    codes: { "invalid:candidate": "partId" },
    save: async (values) => {
      const { decision } = await requestJson<{ decision: { id: string } }>(
        "POST",
        `/api/projects/${projectId}/decisions`,
        { ...values, idempotencyKey: idempotencyKey.current },
      );
      await client.invalidateQueries({ queryKey: decisionKeys.decisions(projectId) });
      return `/projects/${projectId}/decisions/${decision.id}`;
    },
  });
  const { errors, isSubmitting, isSubmitSuccessful } = form.formState;
  const { pending } = form.shell;
  const partId = useWatch({ control: form.control, name: "partId" });
  const chosen = ranking.find((r) => r.partId === partId);
  const byId = new Map(candidates.map((c) => [c.partId, c]));
  const frame = useRef<HTMLFormElement>(null);
  // Signing on an unverified draft is allowed, but only after the lead has read the warning and said so.
  const [acknowledged, setAcknowledged] = useState(false);
  const chosenDraft = chosen ? byId.get(chosen.partId)?.status !== "verified" : false;
  // Opened from the title bar: bring the form into view and put the caret in the rationale.
  const { setFocus } = form;
  useEffect(() => {
    frame.current?.scrollIntoView({ block: "nearest", behavior: "smooth" });
    setFocus("rationale");
  }, [setFocus]);

  return (
    <form
      ref={frame}
      id="record-decision"
      onSubmit={form.shell.onSubmit}
      noValidate
      aria-labelledby="record-decision-title"
      className="rounded-md border border-line border-l-2 border-l-accent bg-panel p-5"
    >
      <h2 id="record-decision-title" className="text-sm font-semibold">
        Record decision
      </h2>
      <p className="mt-0.5 text-sm text-ink-muted">
        The current evaluation of every candidate and pulse is frozen with your signature; it is never edited,
        only superseded by a later decision.
      </p>
      <div className="mt-4 grid gap-4 md:grid-cols-[minmax(0,22rem)_1fr]">
        <SelectField
          id="decision-part"
          label="Chosen candidate"
          error={errors.partId?.message}
          hint={choiceHint(chosen, byId, ranking)}
          {...form.register("partId")}
        >
          <option value="">Choose…</option>
          {ranking.map((r) => {
            const c = byId.get(r.partId);
            return c ? (
              <option key={r.partId} value={r.partId}>
                {r.rank}. {c.partNumber} —{" "}
                {r.passesAll ? "passes all" : `worst ${verdictWords[r.worstVerdict]}`}
              </option>
            ) : null;
          })}
        </SelectField>
        <TextAreaField
          id="decision-rationale"
          label="Rationale"
          rows={4}
          placeholder="Why this part: margins on the decisive cases, cost, availability, bench evidence…"
          error={errors.rationale?.message}
          hint="At least 10 characters. It goes into the record and the report as written."
          {...form.register("rationale")}
        />
      </div>
      <CandidateLibraryStatus
        candidates={candidates}
        chosenDraft={chosenDraft}
        acknowledged={acknowledged}
        onAcknowledge={setAcknowledged}
      />
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions aside="Signing is final: a later decision supersedes this one, nothing edits it.">
        <Button variant="quiet" onClick={onCancel} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button
          type="submit"
          variant="primary"
          pending={pending || isSubmitSuccessful}
          disabled={chosenDraft && !acknowledged}
        >
          Sign decision
        </Button>
      </FormActions>
    </form>
  );
}

/** Under the choice: the chosen part's maker and how it fared, or that no candidate passes every pulse. */
function choiceHint(
  chosen: MatrixRow | undefined,
  byId: Map<string, CheckedCandidate>,
  ranking: MatrixRow[],
): string | undefined {
  if (chosen) {
    return `${byId.get(chosen.partId)?.maker ?? ""}. ${
      chosen.passesAll
        ? `Passes every pulse, worst utilisation ${percent(chosen.worstUtilisation)}.`
        : `Worst verdict ${verdictWords[chosen.worstVerdict]}: say in the rationale why it is still the choice.`
    }`;
  }
  return ranking.some((r) => r.passesAll) ? undefined : "No candidate passes every pulse.";
}
