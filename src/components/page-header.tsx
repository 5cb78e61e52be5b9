import type { ReactNode } from "react";

/** A page's one-line title, with its context (the workspace) at the right. */
export function PageHeader({ title, context }: { title: string; context?: ReactNode }) {
  return (
    <header className="flex items-baseline justify-between gap-4 border-b border-line pb-3">
      <h1 className="text-xl font-semibold tracking-tight">{title}</h1>
      {context ? <p className="truncate text-sm text-ink-muted">{context}</p> : null}
    </header>
  );
}

/** A titled block of a page. */
export function Section({
  id,
  title,
  description,
  aside,
  children,
}: {
  id: string;
  title: string;
  description?: ReactNode;
  aside?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className="min-w-0">
      <div className="mb-3 flex items-end justify-between gap-4">
        <div>
          <h2 id={id} className="text-sm font-semibold text-ink">
            {title}
          </h2>
          {description ? <p className="mt-0.5 text-sm text-ink-muted">{description}</p> : null}
        </div>
        {aside}
      </div>
      {children}
    </section>
  );
}
