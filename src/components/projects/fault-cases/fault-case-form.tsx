"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useForm, useWatch } from "react-hook-form";
import { z } from "zod";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, SelectField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { TextAreaField, UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import { faultCaseSchema } from "@/lib/projects/schema";
import { type FaultCaseRecord, invalidateProject } from "../api";
import { editableValue } from "../format";

export interface FaultCaseFormValues {
  name: string;
  kind: "rect" | "triangle";
  v: string;
  i: string;
  duration: string;
  repeats: "single" | "period" | "frequency";
  period: string;
  frequency: string;
  continuous: boolean;
  count: string;
  caseTemp: string;
  notes: string;
}

const blank: FaultCaseFormValues = {
  name: "",
  kind: "rect",
  v: "",
  i: "",
  duration: "",
  repeats: "single",
  period: "",
  frequency: "",
  continuous: false,
  count: "",
  caseTemp: "",
  notes: "",
};

/** The form's shape, turned into what the shared fault-case schema takes (and checks). */
const formSchema = z
  .object({
    name: z.string(),
    kind: z.enum(["rect", "triangle"]),
    v: z.string(),
    i: z.string(),
    duration: z.string(),
    repeats: z.enum(["single", "period", "frequency"]),
    period: z.string(),
    frequency: z.string(),
    continuous: z.boolean(),
    count: z.string(),
    caseTemp: z.string(),
    notes: z.string(),
  })
  .transform(
    (f): z.input<typeof faultCaseSchema> => ({
      name: f.name,
      kind: f.kind,
      v: f.v,
      i: f.i,
      duration: f.duration,
      repeat:
        f.repeats === "single"
          ? null
          : {
              period: f.repeats === "period" ? f.period : "",
              frequency: f.repeats === "frequency" ? f.frequency : "",
              count: f.continuous ? "" : f.count,
            },
      caseTemp: f.caseTemp,
      notes: f.notes,
    }),
  )
  .pipe(faultCaseSchema);

function valuesOf(row: FaultCaseRecord): FaultCaseFormValues {
  return {
    name: row.name,
    // Only rectangles and triangles are edited here; the table offers no edit for the builders' other shapes.
    kind: row.kind === "triangle" ? "triangle" : "rect",
    v: editableValue(row.v),
    i: editableValue(row.i),
    duration: editableValue(row.duration),
    repeats: row.repeatPeriod === null ? "single" : "period",
    period: editableValue(row.repeatPeriod),
    frequency: "",
    continuous: row.repeatPeriod !== null && row.repeatCount === null,
    count: row.repeatCount === null ? "" : String(row.repeatCount),
    caseTemp: row.caseTemp === null ? "" : String(row.caseTemp),
    notes: row.notes ?? "",
  };
}

const fieldNames = ["name", "kind", "v", "i", "duration", "caseTemp", "notes"] as const;

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
  } = useForm<FaultCaseFormValues, unknown, z.output<typeof formSchema>>({
    resolver: zodResolver(formSchema),
    defaultValues: editing ? valuesOf(editing) : blank,
  });
  const repeats = useWatch({ control, name: "repeats" });
  const continuous = useWatch({ control, name: "continuous" });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const body = editing ? { ...values, origin: editing.origin } : values;
      if (editing) await sendJson("PATCH", `/api/projects/${projectId}/fault-cases/${editing.id}`, body);
      else await sendJson("POST", `/api/projects/${projectId}/fault-cases`, body);
      await invalidateProject(queryClient, projectId);
      if (!editing) reset(blank);
      onDone(values.name);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  const err = (name: string) => {
    const path = name.split(".");
    // biome-ignore lint/suspicious/noExplicitAny: react-hook-form's error tree is keyed by the schema's paths
    let node: any = errors;
    for (const key of path) node = node?.[key];
    return node?.message as string | undefined;
  };
  const periodError = err("repeat.period") ?? err("period");
  const id = editing ? `fc-edit-${editing.id}` : "fc-new";

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={editing ? `Edit ${editing.name}` : "New fault case"}
      className="space-y-4 rounded-md border border-line bg-panel p-4"
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-6">
        <UnitField
          id={`${id}-name`}
          label="Name"
          className="lg:col-span-2"
          error={err("name")}
          {...register("name")}
        />
        <SelectField id={`${id}-kind`} label="Shape" error={err("kind")} {...register("kind")}>
          <option value="rect">Rectangle</option>
          <option value="triangle">Falling triangle</option>
        </SelectField>
        <UnitField
          id={`${id}-v`}
          label={<Sym main="V" sub="DS" />}
          unit="V"
          inputMode="decimal"
          error={err("v")}
          {...register("v")}
        />
        <UnitField
          id={`${id}-i`}
          label={
            <>
              <Sym main="I" sub="D" /> (peak)
            </>
          }
          unit="A"
          inputMode="decimal"
          error={err("i")}
          {...register("i")}
        />
        <UnitField
          id={`${id}-width`}
          label="Width"
          unit="s"
          placeholder="2m"
          error={err("duration")}
          {...register("duration")}
        />
      </div>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-6">
        <SelectField id={`${id}-repeats`} label="Repetition" {...register("repeats")}>
          <option value="single">Single pulse</option>
          <option value="period">By period</option>
          <option value="frequency">By frequency</option>
        </SelectField>
        {repeats === "period" ? (
          <UnitField
            id={`${id}-period`}
            label="Period"
            unit="s"
            error={periodError}
            {...register("period")}
          />
        ) : null}
        {repeats === "frequency" ? (
          <UnitField
            id={`${id}-frequency`}
            label="Frequency"
            unit="Hz"
            error={periodError ?? err("repeat.frequency")}
            {...register("frequency")}
          />
        ) : null}
        {repeats !== "single" ? (
          <div>
            <UnitField
              id={`${id}-count`}
              label="Count"
              inputMode="numeric"
              disabled={continuous}
              placeholder={continuous ? "continuous" : "10"}
              error={err("repeat.count")}
              {...register("count")}
            />
            <label className="mt-1 flex items-center gap-1.5 text-xs text-ink-muted">
              <input type="checkbox" {...register("continuous")} className="accent-[var(--color-accent)]" />
              Continuous train
            </label>
          </div>
        ) : null}
        <UnitField
          id={`${id}-case`}
          label={
            <>
              Own case temperature <Sym main="T" sub="C" />
            </>
          }
          unit="°C"
          inputMode="decimal"
          hint="Optional: else the project's"
          className="lg:col-span-2"
          error={err("caseTemp")}
          {...register("caseTemp")}
        />
      </div>
      <TextAreaField
        id={`${id}-notes`}
        label="Notes"
        hint="Optional: where the figures come from."
        error={err("notes")}
        {...register("notes")}
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
