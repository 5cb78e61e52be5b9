import Link from "next/link";
import { DateText } from "@/components/date-text";
import { SampleProjectButton } from "./sample-project-button";

/** Recent projects and the parts awaiting verification, each a link to open it. */
export function RecentWork({
  projects,
  awaiting,
  mayAddSample,
}: {
  projects: { id: string; name: string; updatedAt: Date }[];
  awaiting: { id: string; partNumber: string; maker: string; findings: number }[];
  mayAddSample: boolean;
}) {
  return (
    <div className="grid items-start gap-4 md:grid-cols-2">
      <section aria-labelledby="recent-projects" className="rounded-md border border-line bg-panel">
        <h2
          id="recent-projects"
          className="border-b border-line px-4 py-2 text-xs font-medium text-ink-muted"
        >
          Recent projects
        </h2>
        {projects.length === 0 ? (
          <p className="px-4 py-3 text-sm text-ink-muted">No projects yet.</p>
        ) : (
          <ul className="divide-y divide-line text-sm">
            {projects.map((p) => (
              <li key={p.id} className="flex items-center justify-between gap-3 px-4">
                <Link
                  href={`/projects/${p.id}`}
                  className="min-w-0 truncate py-2.5 text-accent hover:underline"
                >
                  {p.name}
                </Link>
                <span className="shrink-0 text-xs text-ink-faint">
                  changed <DateText value={p.updatedAt} />
                </span>
              </li>
            ))}
          </ul>
        )}
        {mayAddSample ? (
          <div className="border-t border-line px-4 py-2.5">
            <SampleProjectButton variant="secondary" />
          </div>
        ) : null}
      </section>
      <section aria-labelledby="awaiting-verification" className="rounded-md border border-line bg-panel">
        <h2
          id="awaiting-verification"
          className="border-b border-line px-4 py-2 text-xs font-medium text-ink-muted"
        >
          Parts awaiting verification
        </h2>
        {awaiting.length === 0 ? (
          <p className="px-4 py-3 text-sm text-ink-muted">Every library part is verified.</p>
        ) : (
          <ul className="divide-y divide-line text-sm">
            {awaiting.slice(0, 6).map((p) => (
              <li key={p.id} className="flex items-center justify-between gap-3 px-4">
                <Link
                  href={`/library/${p.id}`}
                  className="min-w-0 truncate py-2.5 text-accent hover:underline"
                >
                  {p.partNumber} <span className="text-ink-muted">· {p.maker}</span>
                </Link>
                <span className="shrink-0 text-xs text-ink-faint">
                  {p.findings === 0
                    ? "no findings"
                    : `${p.findings} open ${p.findings === 1 ? "finding" : "findings"}`}
                </span>
              </li>
            ))}
            {awaiting.length > 6 ? (
              <li className="px-4 py-2 text-xs text-ink-muted">
                and {awaiting.length - 6} more in the{" "}
                <Link href="/library" className="text-accent underline">
                  library
                </Link>
              </li>
            ) : null}
          </ul>
        )}
      </section>
    </div>
  );
}
