import Link from "next/link";
import type { ReactNode } from "react";

/** A page's one-line title with its context under it and its actions at the right, over a hairline. */
export function TitleBar({
  title,
  context,
  actions,
}: {
  title: ReactNode;
  context?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-4 border-b border-line pb-3">
      <div className="min-w-0">
        <h1 className="text-xl font-semibold tracking-tight">{title}</h1>
        {context ? <p className="mt-0.5 truncate text-sm text-ink-muted">{context}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
    </header>
  );
}

/** A link in a title bar's context line (the trail back to the list and the record the page belongs to). */
export function CrumbLink({ href, children }: { href: string; children: ReactNode }) {
  return (
    <Link href={href} className="hover:text-ink hover:underline">
      {children}
    </Link>
  );
}
