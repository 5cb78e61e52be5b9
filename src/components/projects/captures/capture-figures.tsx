import type { ReactNode } from "react";
import { Sym } from "@/components/library/symbols";
import { StatBlock } from "@/components/stat-blocks";
import type { CaptureSummary } from "@/db/schema";
import { count, q } from "@/lib/format";
import { explainFlag } from "@/lib/soa/explain";

function Figure(props: { label: ReactNode; value: string; note?: string }) {
  return <StatBlock {...props} numeric compact />;
}

/** A processed capture's key figures: samples, length, peaks, energy and its equal-energy rectangle. */
export function CaptureFigures({ summary }: { summary: CaptureSummary }) {
  const eq = summary.equivalent;
  return (
    <dl className="grid grid-cols-[repeat(auto-fill,minmax(8rem,1fr))] gap-2">
      <Figure
        label="Samples"
        value={count(summary.samples)}
        note={summary.uniform ? "uniform time step" : "uneven time step"}
      />
      <Figure label="Length" value={q(summary.tEnd - summary.tStart, "s")} />
      <Figure
        label={
          <>
            Highest <Sym main="V" sub="DS" />
          </>
        }
        value={q(summary.vMax, "V")}
      />
      <Figure
        label={
          <>
            Highest |<Sym main="I" sub="D" />|
          </>
        }
        value={q(summary.iMaxAbs, "A")}
      />
      <Figure label="Peak power" value={q(summary.pPeak, "W")} note={`at ${q(summary.tPeak, "s")}`} />
      <Figure label="Energy" value={q(summary.energy, "J")} />
      <Figure
        label="Equal-energy rectangle"
        value={eq.ok ? q(eq.duration, "s") : "none"}
        note={
          eq.ok
            ? `at ${q(eq.v, "V")} × ${q(eq.i, "A")}`
            : explainFlag(eq.flag as Parameters<typeof explainFlag>[0])
        }
      />
    </dl>
  );
}
