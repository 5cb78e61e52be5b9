import type { InputHTMLAttributes, ReactNode, Ref, TextareaHTMLAttributes } from "react";

// Fields of the part form: the label above (symbols with subscripts), the unit inside the field at its right,
// the hint or the error under it, tied to the input with aria-describedby.

const control =
  "mt-1 block h-9 w-full rounded-md border border-line-strong bg-panel px-2.5 text-sm text-ink " +
  "placeholder:text-ink-faint focus-visible:border-accent focus-visible:outline-1 focus-visible:outline-offset-0 " +
  "aria-invalid:border-fail disabled:cursor-not-allowed disabled:bg-sunken";

interface Frame {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
}

function describedBy(id: string, hint: unknown, error: unknown) {
  return (
    [hint && !error ? `${id}-hint` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined
  );
}

function Under({ id, hint, error }: { id: string; hint?: ReactNode; error?: string }) {
  if (error) {
    return (
      <p id={`${id}-error`} className="mt-1 text-xs text-fail">
        {error}
      </p>
    );
  }
  return hint ? (
    <p id={`${id}-hint`} className="mt-1 text-xs text-ink-muted">
      {hint}
    </p>
  ) : null;
}

/** A text field with an optional unit shown inside it, at the right. */
export function UnitField({
  id,
  label,
  hint,
  error,
  unit,
  className = "",
  ref,
  ...input
}: Frame & { unit?: string; ref?: Ref<HTMLInputElement> } & Omit<
    InputHTMLAttributes<HTMLInputElement>,
    "id" | "className"
  >) {
  return (
    <div className={className}>
      <div className="flex items-baseline justify-between gap-3">
        <label htmlFor={id} className="text-sm font-medium text-ink">
          {label}
        </label>
      </div>
      <div className="relative">
        <input
          id={id}
          ref={ref}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(id, hint, error)}
          className={`${control} ${unit ? "pr-12 font-mono" : ""}`}
          {...input}
        />
        {unit ? (
          <span className="pointer-events-none absolute top-1/2 right-2.5 -translate-y-1/2 pt-1 text-sm text-ink-faint">
            {unit}
          </span>
        ) : null}
      </div>
      <Under id={id} hint={hint} error={error} />
    </div>
  );
}

export function TextAreaField({
  id,
  label,
  hint,
  error,
  className = "",
  ref,
  ...area
}: Frame & { ref?: Ref<HTMLTextAreaElement> } & Omit<
    TextareaHTMLAttributes<HTMLTextAreaElement>,
    "id" | "className"
  >) {
  return (
    <div className={className}>
      <label htmlFor={id} className="text-sm font-medium text-ink">
        {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={`${control} h-auto min-h-20 py-2`}
        {...area}
      />
      <Under id={id} hint={hint} error={error} />
    </div>
  );
}
