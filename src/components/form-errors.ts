import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
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
