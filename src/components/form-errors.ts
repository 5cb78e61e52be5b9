import {
  type FieldErrors,
  type FieldValues,
  get,
  type Path,
  type UseFormRegister,
  type UseFormRegisterReturn,
  type UseFormSetError,
} from "react-hook-form";
import { ApiError, messageOf } from "./api-client";

/**
 * Puts a server's answer where it belongs: field errors under their fields, an error code that concerns one
 * field (`{ "conflict:email": "email" }`) under that field, anything else as the form's `root.server` message.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
  codes: Record<string, Path<T>> = {},
): void {
  if (error instanceof ApiError) {
    const byCode = codes[error.code];
    if (byCode) {
      setError(byCode, { type: "server", message: error.message }, { shouldFocus: true });
      return;
    }
    let placed = false;
    for (const [key, messages] of Object.entries(error.fieldErrors)) {
      const field = fields.find((f) => f === key);
      if (field && messages[0]) {
        setError(field, { type: "server", message: messages[0] }, { shouldFocus: !placed });
        placed = true;
      }
    }
    if (placed) return;
  }
  setError("root.server", { type: "server", message: messageOf(error) });
}

/** What a field takes from its form: the registration and the error message under it. */
export type FieldBinding<T extends FieldValues> = UseFormRegisterReturn<Path<T>> & {
  error: string | undefined;
};

/** Binds fields by name, `<UnitField {...bind("v")} />`; nested paths ("repeat.period") read nested errors. */
export type Bind<T extends FieldValues> = (name: Path<T>) => FieldBinding<T>;

export function fieldBinder<T extends FieldValues>(
  register: UseFormRegister<T>,
  errors: FieldErrors<T>,
): Bind<T> {
  return (name) => ({ ...register(name), error: errorAt(errors, name) });
}

/** The message of the error at a path of the form's error tree, if any. */
export function errorAt<T extends FieldValues>(errors: FieldErrors<T>, path: string): string | undefined {
  return get<FieldErrors<T>, { message?: string } | undefined>(errors, path)?.message;
}
