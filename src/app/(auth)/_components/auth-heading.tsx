import type { ReactNode } from "react";

export function AuthHeading({
  eyebrow,
  title,
  children,
}: {
  eyebrow?: string;
  title: string;
  children?: ReactNode;
}) {
  return (
    <div className="mb-5">
      {eyebrow ? (
        <p className="mb-1 font-mono text-[0.7rem] uppercase tracking-widest text-ink-faint">{eyebrow}</p>
      ) : null}
      <h1 className="text-lg font-semibold tracking-tight">{title}</h1>
      {children ? <div className="mt-1 text-sm leading-relaxed text-ink-muted">{children}</div> : null}
    </div>
  );
}

/** The quiet line under a card's form: where else to go. */
export function AuthFooter({ children }: { children: ReactNode }) {
  return <p className="mt-6 border-t border-line pt-4 text-sm text-ink-muted">{children}</p>;
}

export const linkClass = "text-accent underline-offset-2 hover:underline";
