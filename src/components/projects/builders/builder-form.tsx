"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { Fragment, isValidElement, type ReactNode } from "react";
import {
  type DefaultValues,
  type FieldValues,
  type Path,
  type UseFormReturn,
  useForm,
  useWatch,
} from "react-hook-form";
import type { z } from "zod";
import { UnitField } from "@/components/library/fields";
import type { BuilderResult } from "@/lib/soa/builders";
import type { Pulse, PulseKind } from "@/lib/soa/types";
import { type BuilderProps, type BuiltPulse, PulseSummary, saveBuilt } from "./builder-layout";

// What every fault-case builder shares: its form (validated live, saved the same way), its unit fields written as
// a list of specs, and the name field at the foot. Each builder keeps only its own fields, figures and words.

/** What a builder's `build` gives: the pulse with the figures shown beside the form, or why there is none. */
export type Built =
  | { ok: true; pulse: BuiltPulse; figures: object; origin: { input: object; figures: object } }
  | { ok: false; reason: string };

/** A pulse built from `input`: the engine's figures are shown beside the form and stored with the input as origin. */
export function builtCase(pulse: BuiltPulse, input: object, figures: object): Built {
  return { ok: true, figures, pulse, origin: { input, figures } };
}

/**
 * The case an engine builder's one pulse makes: `shape` turns the pulse of `kind` into the fault case, stored with
 * `input`. The engine's refusal passes through; another kind is refused (`word` names the one expected).
 */
export function caseOfPulse<K extends PulseKind>(
  built: BuilderResult<object>,
  kind: K,
  word: string,
  input: object,
  shape: (pulse: Extract<Pulse, { kind: K }>) => BuiltPulse,
): Built {
  if (!built.ok) return built;
  const pulse = built.pulses[0];
  if (pulse.kind !== kind) return { ok: false, reason: `the builder made no ${word}` };
  return builtCase(shape(pulse as Extract<Pulse, { kind: K }>), input, built.figures);
}

/** One text field of a builder: the form value it edits and how it is labelled. */
export interface FieldSpec<V extends FieldValues> {
  name: Path<V>;
  id: string;
  label: ReactNode;
  unit?: string;
  inputMode?: "decimal" | "numeric";
  placeholder?: string;
  hint?: ReactNode;
  className?: string;
}

type NamedValues = FieldValues & { name: string };
type Form<V extends FieldValues, I> = UseFormReturn<V, unknown, I>;

/**
 * A builder's form: validated on touch, the pulse rebuilt live from every valid state, and on submit saved as a
 * fault case under `origin` (a builder's key, or one chosen from the input). Gives the form, the watched values,
 * what is built now, and `frame`: the BuilderLayout props every builder passes the same way (figures, reason, the
 * pulse in words, the server's error, the name footer, pending and submit).
 */
export function useBuilderForm<V extends NamedValues, I extends { name: string }>({
  schema,
  defaultValues,
  build,
  origin,
  create,
  nameId,
}: {
  schema: z.ZodType<I, V>;
  defaultValues: DefaultValues<V>;
  build: (input: I) => Built;
  origin: string | ((input: I) => string);
  create: BuilderProps["create"];
  /** The id of the name field at the foot ("seq-name"). */
  nameId: string;
}) {
  const form = useForm<V, unknown, I>({
    // The resolver's overloads cannot see through a generic schema; it is the schema's own resolver.
    resolver: zodResolver(schema as never) as never,
    mode: "onTouched",
    defaultValues,
  });
  const values = useWatch({ control: form.control }) as Partial<V>;
  const parsed = schema.safeParse(values);
  const built = parsed.success ? build(parsed.data) : null;
  const onSubmit = form.handleSubmit((input) =>
    saveBuilt(
      typeof origin === "string" ? origin : origin(input),
      input.name,
      build(input),
      create,
      form.setError,
    ),
  );
  const { errors, isSubmitting } = form.formState;
  const frame = {
    figures: built?.ok ? built.figures : null,
    reason: built && !built.ok ? built.reason : null,
    result: built?.ok ? <PulseSummary pulse={built.pulse} /> : null,
    footer: <NameField form={form} id={nameId} />,
    error: errors.root?.server?.message,
    pending: isSubmitting,
    onSubmit,
  };
  return { form, values, built, frame };
}

function errorOf<V extends FieldValues, I>(form: Form<V, I>, name: Path<V>): string | undefined {
  const error = (form.formState.errors as Record<string, { message?: unknown } | undefined>)[name];
  return typeof error?.message === "string" ? error.message : undefined;
}

/** One unit field bound to the builder's form: its value, its error under it. */
export function BuilderField<V extends FieldValues, I>({
  form,
  spec,
}: {
  form: Form<V, I>;
  spec: FieldSpec<V>;
}) {
  const { name, ...shown } = spec;
  return <UnitField {...shown} error={errorOf(form, name)} {...form.register(name)} />;
}

/** The name the fault case is saved under, at the foot of every builder. */
export function NameField<V extends NamedValues, I>({ form, id }: { form: Form<V, I>; id: string }) {
  const name = "name" as Path<V>;
  return (
    <UnitField
      id={id}
      label="Fault case name"
      className="max-w-sm"
      error={errorOf(form, name)}
      {...form.register(name)}
    />
  );
}

/**
 * A builder's inputs in a grid: field specs drawn as bound unit fields, anything else (a choice, a checkbox) as
 * given, in order. `false` and `null` entries are left out, for fields shown only in some cases.
 */
export function BuilderFields<V extends FieldValues, I>({
  form,
  className,
  items,
}: {
  form: Form<V, I>;
  className: string;
  items: (FieldSpec<V> | ReactNode)[];
}) {
  return (
    <div className={className}>
      {items.map((item, k) => {
        if (item === null || item === false || item === undefined) return null;
        if (isValidElement(item) || typeof item !== "object" || !("id" in item)) {
          // biome-ignore lint/suspicious/noArrayIndexKey: a builder's fixed list of inputs, in their order
          return <Fragment key={k}>{item as ReactNode}</Fragment>;
        }
        const spec = item as FieldSpec<V>;
        return <BuilderField key={spec.id} form={form} spec={spec} />;
      })}
    </div>
  );
}
