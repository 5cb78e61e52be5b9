import type { FormEventHandler, ReactNode } from "react";
import {
  type DefaultValues,
  type FieldValues,
  type Path,
  type Resolver,
  type UseFormSetError,
  useForm,
} from "react-hook-form";
import type { z } from "zod";
import { Button, FormActions, FormMessage, TextField } from "./form";
import { applyServerErrors, fieldBinder } from "./form-errors";

// The forms that post to the API and stay on the page (sign-in, sign-up, password, profile, …): zod checks the
// values in the browser; a server's field errors land under their fields, anything else in the form's message.
// A form names its schema by a loader: the schema, and zod with it, load at the form's first check, not with the
// page (a page's first load stays within its budget).

/**
 * A form's zod schema, loaded when first needed: `() => import("@/lib/auth/schemas").then((m) => m.signInSchema)`;
 * it checks the form's values (`In`) and gives what is sent (`Out`).
 */
export type SchemaLoader<In extends FieldValues, Out = In> = () => Promise<z.ZodType<Out, In>>;

/** A react-hook-form resolver that loads its schema, and zod with it, at the form's first check. */
export function lazyResolver<In extends FieldValues, Out = In>(
  load: SchemaLoader<In, Out>,
): Resolver<In, unknown, Out> {
  return async (values, context, options) => {
    const [{ zodResolver }, schema] = await Promise.all([import("@hookform/resolvers/zod"), load()]);
    return zodResolver(schema)(values, context, options);
  };
}

/**
 * A react-hook-form form whose fields are the keys of `defaultValues`. `send` posts the values; an error it
 * throws goes to `onError` first (true when that placed it) and then under the fields it names, or in
 * `root.server`. `shell` is what its ApiFormShell takes from it: the submit, the server's message, pending.
 */
export function useApiForm<T extends FieldValues>({
  schema,
  defaultValues,
  send,
  onError,
}: {
  schema: SchemaLoader<T>;
  defaultValues: DefaultValues<T>;
  send: (values: T) => Promise<void>;
  onError?: (error: unknown, setError: UseFormSetError<T>) => boolean;
}) {
  const form = useForm<T>({ resolver: lazyResolver(schema), defaultValues });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await send(values);
    } catch (error) {
      if (onError?.(error, form.setError)) return;
      applyServerErrors(error, form.setError, Object.keys(defaultValues) as Path<T>[]);
    }
  });
  const shell = {
    onSubmit,
    error: form.formState.errors.root?.server?.message,
    pending: form.formState.isSubmitting,
  };
  return { ...form, onSubmit, shell, bind: fieldBinder(form.register, form.formState.errors) };
}

/**
 * The frame of such a form: its fields, the server's message, an optional done message, and the submit button
 * at the bottom right (its label swaps to `pendingLabel` while it works, where one is given).
 */
export function ApiFormShell({
  onSubmit,
  className = "space-y-4",
  error,
  status,
  label,
  pendingLabel,
  pending,
  disabled,
  after,
  children,
}: {
  onSubmit: FormEventHandler<HTMLFormElement>;
  className?: string;
  error: ReactNode;
  status?: ReactNode;
  label: string;
  pendingLabel?: string;
  pending: boolean;
  disabled?: boolean;
  /** After the button in the page's order, e.g. a "Forgot password?" link. */
  after?: ReactNode;
  children: ReactNode;
}) {
  return (
    <form onSubmit={onSubmit} noValidate className={className}>
      {children}
      <FormMessage tone="error">{error}</FormMessage>
      {status}
      <FormActions>
        <Button type="submit" variant="primary" pending={pending} disabled={disabled}>
          {pending && pendingLabel ? pendingLabel : label}
        </Button>
      </FormActions>
      {after}
    </form>
  );
}

type FieldProps = Parameters<typeof TextField>[0];

/** The e-mail field of the sign-in, sign-up and reset forms. */
export function EmailField(props: Omit<FieldProps, "label" | "type" | "autoComplete">) {
  return <TextField label="E-mail" type="email" autoComplete="email" {...props} />;
}

/** A field for choosing a new password, with the rule under it. */
export function NewPasswordField(props: Omit<FieldProps, "type" | "autoComplete" | "hint">) {
  return <TextField type="password" autoComplete="new-password" hint="At least 10 characters." {...props} />;
}

/** Lets password managers file a new password under the right account. */
export function AccountHint({ email }: { email: string }) {
  return <input type="hidden" name="username" autoComplete="username" value={email} readOnly />;
}
