import Link from "next/link";
import { DateText } from "@/components/date-text";

export interface HistoryEntry {
  id: string;
  chosenLabel: string;
  rationale: string;
  signedByName: string;
  signedAt: Date | string;
  supersededBy: string | null;
  supersededAt: Date | string | null;
}

/** A project's decisions, newest first: the standing one marked, the superseded ones kept as they were signed. */
export function DecisionHistory({ projectId, decisions }: { projectId: string; decisions: HistoryEntry[] }) {
  return (
    <ol className="space-y-3" aria-label="Decision history">
      {decisions.map((d) => {
        const standing = d.supersededBy === null;
        return (
          <li
            key={d.id}
            className={`rounded-md border bg-panel px-4 py-3 ${standing ? "border-line-strong border-l-2 border-l-accent" : "border-line"}`}
          >
            <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
              <h3 className="text-sm">
                <Link
                  href={`/projects/${projectId}/decisions/${d.id}`}
                  className="font-semibold hover:text-accent hover:underline"
                >
                  {d.chosenLabel}
                </Link>
                <span
                  className={`ml-3 rounded-sm px-1.5 py-0.5 text-xs ${standing ? "bg-accent-soft text-accent-strong" : "bg-sunken text-ink-muted"}`}
                >
                  {standing ? "Standing" : "Superseded"}
                </span>
              </h3>
              <p className="text-xs text-ink-muted">
                signed by {d.signedByName} · <DateText value={d.signedAt} withTime />
                {d.supersededAt ? (
                  <>
                    {" "}
                    · superseded <DateText value={d.supersededAt} withTime />
                  </>
                ) : null}
              </p>
            </div>
            <p className="mt-1.5 line-clamp-3 max-w-4xl text-sm whitespace-pre-line text-ink-muted">
              {d.rationale}
            </p>
            <Link
              href={`/projects/${projectId}/decisions/${d.id}`}
              className="mt-1.5 inline-block text-sm text-accent underline underline-offset-2"
            >
              Open the record
            </Link>
          </li>
        );
      })}
    </ol>
  );
}
