import { percent } from "@/lib/format";
import type { Verdict } from "@/lib/soa/types";

const SCALE = 1.5;
const fill: Record<Verdict, string> = {
  pass: "bg-pass",
  marginal: "bg-marginal",
  fail: "bg-fail",
  "no-data": "bg-nodata",
};

/**
 * Utilisation as a short bar from 0 to 150 %, with ticks at the project's limit and at 100 %, and the figure in
 * words beside it (the verdict's word sits in its own cell: colour is never alone).
 */
export function UtilisationBar({
  utilisation,
  limit,
  verdict,
}: {
  utilisation: number | null;
  limit: number;
  verdict: Verdict;
}) {
  if (utilisation === null) return <span className="text-ink-faint">—</span>;
  const width = Math.min(utilisation, SCALE) / SCALE;
  return (
    <span className="inline-flex items-center justify-end gap-2">
      <span className="num font-mono text-xs">{percent(utilisation)}</span>
      <span aria-hidden="true" className="relative h-1.5 w-12 rounded-full bg-sunken">
        <span
          className={`absolute inset-y-0 left-0 rounded-full ${fill[verdict]}`}
          style={{ width: `${width * 100}%` }}
        />
        <span
          className="absolute -inset-y-0.5 w-px bg-ink-faint"
          style={{ left: `${(limit / SCALE) * 100}%` }}
        />
        <span className="absolute -inset-y-0.5 w-px bg-ink" style={{ left: `${(1 / SCALE) * 100}%` }} />
      </span>
    </span>
  );
}
