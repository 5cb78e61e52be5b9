import type { ButtonHTMLAttributes, InputHTMLAttributes, ReactNode, Ref, SelectHTMLAttributes } from "react";

// Form pieces shared by every form: label above the field, hint and error under it, tied with aria-describedby.

export interface FieldFrame {
  id: string;
  label: ReactNode;
  /** Shown at the right of the label, e.g. a "Forgot password?" link. */
  labelAside?: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
}

function describedBy(id: string, hint: unknown, error: unknown): string | undefined {
  return [hint ? `${id}-hint` : "", error ? `${id}-error` : ""].filter(Boolean).join(" ") || undefined;
}

const control =
  "mt-1 block h-9 w-full rounded-md border border-line-strong bg-panel px-2.5 text-sm text-ink " +
  "placeholder:text-ink-faint focus-visible:border-accent focus-visible:outline-1 focus-visible:outline-offset-0 " +
  "aria-invalid:border-fail disabled:cursor-not-allowed disabled:bg-sunken disabled:text-ink-muted";

/** The hint, or else the error, under a field, with the ids its control's aria-describedby names. */
export function FieldNote({ id, hint, error }: { id: string; hint?: ReactNode; error?: string }) {
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

/** A field's frame: the label (and what stands at its right) above the control, the hint or error under it. */
export function Frame({
  id,
  label,
  labelAside,
  hint,
  error,
  className = "",
  children,
}: FieldFrame & { children: ReactNode }) {
  return (
    <div className={className}>
      <div className="flex items-baseline justify-between gap-3">
        <label htmlFor={id} className="text-sm font-medium text-ink">
          {label}
        </label>
        {labelAside}
      </div>
      {children}
      <FieldNote id={id} hint={hint} error={error} />
    </div>
  );
}

/** A field's props split into its frame's, its control's ties to the hint and error, and the control's own. */
export function splitField<P extends FieldFrame>({
  id,
  label,
  labelAside,
  hint,
  error,
  className,
  ...own
}: P) {
  return {
    frame: { id, label, labelAside, hint, error, className },
    tie: {
      id,
      "aria-invalid": error ? true : undefined,
      "aria-describedby": describedBy(id, hint && !error, error),
    },
    own,
  };
}

export function TextField(
  props: FieldFrame &
    Omit<InputHTMLAttributes<HTMLInputElement>, "id" | "className"> & { ref?: Ref<HTMLInputElement> },
) {
  const { frame, tie, own } = splitField(props);
  return (
    <Frame {...frame}>
      <input {...tie} className={control} {...own} />
    </Frame>
  );
}

export function SelectField(
  props: FieldFrame &
    Omit<SelectHTMLAttributes<HTMLSelectElement>, "id" | "className"> & { ref?: Ref<HTMLSelectElement> },
) {
  const { frame, tie, own } = splitField(props);
  return (
    <Frame {...frame}>
      <select {...tie} className={`${control} pr-8`} {...own} />
    </Frame>
  );
}

type Variant = "primary" | "secondary" | "quiet" | "danger";

const variants: Record<Variant, string> = {
  primary: "bg-accent text-white hover:bg-accent-strong border border-transparent",
  secondary: "border border-line-strong bg-panel text-ink hover:bg-sunken",
  quiet: "border border-transparent text-ink-muted hover:bg-sunken hover:text-ink",
  danger: "border border-line-strong bg-panel text-fail hover:border-fail",
};

export function Button({
  variant = "secondary",
  size = "md",
  pending = false,
  className = "",
  children,
  type = "button",
  disabled,
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: "sm" | "md"; pending?: boolean }) {
  // At least 44 px tall on touch screens and narrow windows (a thumb at the bench), compact on a desktop.
  const sizing = `${size === "sm" ? "h-7 px-2.5 text-xs" : "h-9 px-4 text-sm"} max-md:min-h-11 pointer-coarse:min-h-11`;
  return (
    <button
      type={type}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      className={`inline-flex shrink-0 items-center justify-center gap-1.5 whitespace-nowrap rounded-md font-medium disabled:cursor-not-allowed disabled:opacity-60 ${sizing} ${variants[variant]} ${className}`}
      {...rest}
    >
      {children}
    </button>
  );
}

/** A link that looks like a secondary button: to another page, or a download. */
export const linkButtonClass =
  "inline-flex h-9 items-center rounded-md border border-line-strong bg-panel px-4 text-sm font-medium hover:bg-sunken";

/** The row that closes a form: secondary things at the left, the primary action at the bottom right. */
export function FormActions({ children, aside }: { children: ReactNode; aside?: ReactNode }) {
  return (
    <div className="mt-5 flex items-center justify-between gap-3">
      <div className="text-sm text-ink-muted">{aside}</div>
      <div className="flex items-center gap-2">{children}</div>
    </div>
  );
}

/** A form-level message: a problem the server reported (role alert) or a done thing (role status). */
export function FormMessage({ tone, children }: { tone: "error" | "done"; children: ReactNode }) {
  if (!children) return null;
  return tone === "error" ? (
    <p
      role="alert"
      className="mt-4 rounded-md border border-line border-l-2 border-l-fail bg-sunken px-3 py-2 text-sm"
    >
      {children}
    </p>
  ) : (
    <p
      role="status"
      className="mt-4 rounded-md border border-line border-l-2 border-l-pass bg-sunken px-3 py-2 text-sm"
    >
      {children}
    </p>
  );
}

/** A short problem beside the button that met it (role alert); nothing while there is none. */
export function InlineAlert({ children }: { children: ReactNode }) {
  if (!children) return null;
  return (
    <span role="alert" className="text-xs text-fail">
      {children}
    </span>
  );
}
