import type { InputHTMLAttributes, Ref, TextareaHTMLAttributes } from "react";
import { type FieldFrame, FieldNote, Frame, splitField } from "@/components/form";

// Fields of the part form: the label above (symbols with subscripts), the unit inside the field at its right,
// the hint or the error under it, tied to the input with aria-describedby (the frame of `@/components/form`).

const control =
  "mt-1 block h-9 w-full rounded-md border border-line-strong bg-panel px-2.5 text-sm text-ink " +
  "placeholder:text-ink-faint focus-visible:border-accent focus-visible:outline-1 focus-visible:outline-offset-0 " +
  "aria-invalid:border-fail disabled:cursor-not-allowed disabled:bg-sunken";

type PlainFrame = Omit<FieldFrame, "labelAside">;

/** A text field with an optional unit shown inside it, at the right. */
export function UnitField(
  props: PlainFrame & { unit?: string; ref?: Ref<HTMLInputElement> } & Omit<
      InputHTMLAttributes<HTMLInputElement>,
      "id" | "className"
    >,
) {
  const {
    frame,
    tie,
    own: { unit, ...input },
  } = splitField(props);
  return (
    <Frame {...frame}>
      <div className="relative">
        <input {...tie} className={`${control} ${unit ? "pr-12 font-mono" : ""}`} {...input} />
        {unit ? (
          <span className="pointer-events-none absolute top-1/2 right-2.5 -translate-y-1/2 pt-1 text-sm text-ink-faint">
            {unit}
          </span>
        ) : null}
      </div>
    </Frame>
  );
}

export function TextAreaField(
  props: PlainFrame & { ref?: Ref<HTMLTextAreaElement> } & Omit<
      TextareaHTMLAttributes<HTMLTextAreaElement>,
      "id" | "className"
    >,
) {
  const {
    frame: { id, label, hint, error, className = "" },
    tie,
    own,
  } = splitField(props);
  return (
    <div className={className}>
      <label htmlFor={id} className="text-sm font-medium text-ink">
        {label}
      </label>
      <textarea {...tie} className={`${control} h-auto min-h-20 py-2`} {...own} />
      <FieldNote id={id} hint={hint} error={error} />
    </div>
  );
}
