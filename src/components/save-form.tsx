"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { type FormEventHandler, type ReactNode, useTransition } from "react";
import { type DefaultValues, type FieldValues, type Path, type Resolver, useForm } from "react-hook-form";
import { Button, FormActions, FormMessage } from "./form";
import { applyServerErrors, fieldBinder } from "./form-errors";

// The create-or-edit forms that open the saved item's page (a part, a project's settings).

/**
 * A create-or-edit form: `save` sends the checked values and gives the saved item's page, which then opens. A
 * server's error lands under the `fields` it names (or the field its code maps to in `codes`), else in
 * `root.server`. `shell` is what its SaveFormShell takes from it: the submit, the server's message, and pending,
 * which lasts until the page is open.
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
  const shell = { onSubmit, error: errors.root?.server?.message, pending: isSubmitting || navigating };
  return { ...form, shell, bind: fieldBinder(form.register, errors) };
}

/** Such a form: its fields, then the server's message, Cancel back to `cancelHref`, and the submit button. */
export function SaveFormShell({
  onSubmit,
  error,
  pending,
  cancelHref,
  label,
  children,
}: {
  onSubmit: FormEventHandler<HTMLFormElement>;
  error: string | undefined;
  pending: boolean;
  cancelHref: string;
  label: string;
  children: ReactNode;
}) {
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6 rounded-md border border-line bg-panel p-5">
      {children}
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
    </form>
  );
}
