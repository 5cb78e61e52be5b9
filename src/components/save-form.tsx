"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { type DefaultValues, type FieldValues, type Path, type Resolver, useForm } from "react-hook-form";
import { Button, FormActions, FormMessage } from "./form";
import { applyServerErrors, fieldBinder } from "./form-errors";

// The create-or-edit forms that open the saved item's page (a part, a project's settings).

/**
 * A create-or-edit form: `save` sends the checked values and gives the saved item's page, which then opens. A
 * server's error lands under the `fields` it names (or the field its code maps to in `codes`), else in
 * `root.server`. `pending` lasts until the page is open.
 */
export function useSaveForm<In extends FieldValues, Out>({
  resolver,
  defaultValues,
  fields,
  codes,
  save,
}: {
  resolver: Resolver<In, unknown, Out>;
  defaultValues: DefaultValues<In>;
  fields: readonly Path<In>[];
  codes?: Record<string, Path<In>>;
  save: (values: Out) => Promise<string>;
}) {
  const router = useRouter();
  const [navigating, startTransition] = useTransition();
  const form = useForm<In, unknown, Out>({ resolver, defaultValues });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const page = await save(values);
      startTransition(() => {
        router.push(page);
        router.refresh();
      });
    } catch (error) {
      applyServerErrors(error, form.setError, fields, codes);
    }
  });
  const { errors, isSubmitting } = form.formState;
  return { ...form, onSubmit, bind: fieldBinder(form.register, errors), pending: isSubmitting || navigating };
}

/** The close of such a form: the server's message, Cancel back to `cancelHref`, and the submit button. */
export function SaveFormActions({
  error,
  cancelHref,
  pending,
  label,
}: {
  error: string | undefined;
  cancelHref: string;
  pending: boolean;
  label: string;
}) {
  return (
    <>
      <FormMessage tone="error">{error}</FormMessage>
      <FormActions
        aside={
          <Link href={cancelHref} className="hover:text-ink hover:underline">
            Cancel
          </Link>
        }
      >
        <Button type="submit" variant="primary" pending={pending}>
          {label}
        </Button>
      </FormActions>
    </>
  );
}
