"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { requestJson } from "@/components/api-client";
import { Button, FormActions, FormMessage } from "@/components/form";
import { applyServerErrors, fieldBinder } from "@/components/form-errors";
import { TextAreaField } from "@/components/library/fields";
import { type FaultCaseRecord, invalidateProject } from "../api";
import { PulseFields, RepetitionFields } from "./fault-case-fields";
import {
  blankFaultCase,
  type FaultCaseFormValues,
  faultCaseFields,
  faultCaseFormSchema,
  faultCaseValues,
} from "./fault-case-form-schema";

/**
 * A fault case typed by hand, new or edited: unit-aware fields (engineering notation, the unit inside the field),
 * the shape, an optional repetition by period or frequency, counted or continuous, and an optional case
 * temperature of its own. An edited case keeps the builder origin it came from.
 */
export function FaultCaseForm({
  projectId,
  editing,
  onDone,
}: {
  projectId: string;
  editing?: FaultCaseRecord;
  onDone: (name: string) => void;
}) {
  const queryClient = useQueryClient();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors, isSubmitting },
  } = useForm<FaultCaseFormValues, unknown, z.output<typeof faultCaseFormSchema>>({
    resolver: zodResolver(faultCaseFormSchema),
    defaultValues: editing ? faultCaseValues(editing) : blankFaultCase,
  });
  const repeats = useWatch({ control, name: "repeats" });
  const continuous = useWatch({ control, name: "continuous" });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const body = editing ? { ...values, origin: editing.origin } : values;
      if (editing) await requestJson("PATCH", `/api/projects/${projectId}/fault-cases/${editing.id}`, body);
      else await requestJson("POST", `/api/projects/${projectId}/fault-cases`, body);
      await invalidateProject(queryClient, projectId);
      if (!editing) reset(blankFaultCase);
      onDone(values.name);
    } catch (error) {
      applyServerErrors(error, setError, faultCaseFields);
    }
  });

  const bind = fieldBinder(register, errors);
  const id = editing ? `fc-edit-${editing.id}` : "fc-new";

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={editing ? `Edit ${editing.name}` : "New fault case"}
      className="space-y-4 rounded-md border border-line bg-panel p-4"
    >
      <PulseFields id={id} bind={bind} />
      <RepetitionFields
        id={id}
        register={register}
        errors={errors}
        repeats={repeats}
        continuous={continuous}
      />
      <TextAreaField
        id={`${id}-notes`}
        label="Notes"
        hint="Optional: where the figures come from."
        {...bind("notes")}
      />
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions
        aside={editing?.origin ? `Made by the ${editing.origin.builder} builder; its inputs are kept.` : null}
      >
        {editing ? (
          <Button variant="quiet" onClick={() => onDone("")}>
            Cancel
          </Button>
        ) : null}
        <Button type="submit" variant="primary" pending={isSubmitting}>
          {editing ? "Save fault case" : "Add fault case"}
        </Button>
      </FormActions>
    </form>
  );
}
