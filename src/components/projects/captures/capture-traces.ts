import { q } from "@/lib/format";
import type { PulseResult } from "@/lib/soa/types";
import type { CaptureDetail } from "./capture-api";
import type { TracePanel } from "./trace-charts";

// What the trace charts of one capture draw: its V, I and P panels, the junction panel when a candidate has a
// thermal model, and a mark at each candidate's binding sample.

type Candidate = CaptureDetail["candidates"][number];
type Trace = NonNullable<CaptureDetail["capture"]["trace"]>;

/** The stored result of a candidate; null without one, undefined while it is being rechecked. */
export type VerdictOf = (partId: string) => PulseResult | null | undefined;

const junctionStyles = [
  { stroke: "var(--color-accent)", dash: undefined },
  { stroke: "var(--color-ink)", dash: "6 3" },
  { stroke: "var(--color-ink-muted)", dash: "2 2" },
  { stroke: "var(--color-accent-strong)", dash: "9 3 2 3" },
];

export function tracePanels(
  trace: Trace,
  candidates: Candidate[],
  heatedCase: CaptureDetail["case"],
): TracePanel[] {
  const panels: TracePanel[] = [
    {
      key: "v",
      symbol: { main: "V", sub: "DS" },
      name: "V_DS",
      unit: "V",
      series: [{ key: "v", label: "V_DS", t: trace.t, y: trace.v, stroke: "var(--color-accent)" }],
    },
    {
      key: "i",
      symbol: { main: "I", sub: "D" },
      name: "I_D",
      unit: "A",
      series: [{ key: "i", label: "I_D", t: trace.t, y: trace.i, stroke: "var(--color-accent)" }],
    },
    {
      key: "p",
      symbol: { main: "P" },
      name: "P",
      unit: "W",
      series: [{ key: "p", label: "P", t: trace.t, y: trace.p, stroke: "var(--color-accent)" }],
    },
  ];
  const junctions = candidates.filter((c) => c.junction !== null);
  if (junctions.length) {
    panels.push({
      key: "tj",
      symbol: { main: "T", sub: "j" },
      name: heatedCase ? "T_j and the case T_C" : "T_j",
      unit: "°C",
      series: [
        ...junctions.map((c, k) => ({
          key: `tj-${c.partId}`,
          label: c.partNumber,
          t: c.junction!.trace.t,
          y: c.junction!.trace.y,
          ...junctionStyles[k % junctionStyles.length],
        })),
        // The case heated through the project's case path: the junction traces above include its rise.
        ...(heatedCase
          ? [
              {
                key: "case",
                label: "T_C, case path",
                t: heatedCase.trace.t,
                y: heatedCase.trace.y,
                stroke: "var(--color-marginal)",
                dash: "4 2",
              },
            ]
          : []),
      ],
    });
  }
  return panels;
}

/** A mark on the traces at each candidate's binding sample. */
export function bindingMarks(candidates: Candidate[], verdictOf: VerdictOf) {
  return candidates.flatMap((c) => {
    const result = verdictOf(c.partId);
    if (!result?.at) return [];
    return [
      {
        key: c.partId,
        t: result.at.t,
        verdict: result.verdict,
        label: `${c.partNumber}: binding sample, ${q(result.at.v, "V")} × ${q(result.at.i, "A")}`,
      },
    ];
  });
}
