import type { Verdict } from "@/components/verdict-shape";

/** Pulse width of a curve in seconds, or "DC". */
export type ChartDuration = number | "DC";

/** One limit line: its pulse width and its [V, I] points, sorted by V (SI units). */
export interface ChartCurve {
  duration: ChartDuration;
  points: [number, number][];
}

/** A quality finding of a curve set (src/lib/soa/findings.ts), marked on its curve at its voltage. */
export interface ChartFinding {
  kind: string;
  /** Stable identity (absent in findings stored before keys existed). */
  key?: string;
  /** Absent for a part-level finding (the thermal model against the rated R_th(j-c)). */
  curve?: { index: number; duration: ChartDuration };
  location?: { v: number } | { index: number };
  /** How large the finding is, with its unit. */
  size?: string;
  message: string;
}

/** A pulse drawn at (V, I) in its verdict's shape; `label` is shown on hover and in the text alternative. */
export interface ChartPulse {
  id: string;
  v: number;
  i: number;
  verdict: Verdict;
  label: string;
}

/** The curves scaled for a case temperature (METHODS.md §5), drawn dashed in their curve's hue. */
export interface ChartDerated {
  caseTemp: number;
  /** The derating factor k applied to every curve. */
  factor: number;
  curves: ChartCurve[];
}

/** The limit line for a typed pulse width, read between the curves. */
export interface ChartInterpolated {
  width: number;
  points: [number, number][];
  /** Extra words for its label and legend, e.g. "interpolated" or "next longer curve". */
  note?: string;
}

/** The instability boundary for one pulse width (METHODS.md §12): where S = V·α(I)·Z_th(t) reaches 1. */
export interface ChartInstability {
  width: number;
  /** Points [V_max, I], ascending in I. */
  points: [number, number][];
}

export interface SoaChartProps {
  /** What the chart shows, for its accessible name and the export file names (e.g. the part number). */
  title: string;
  curves: ChartCurve[];
  /** Case temperature of the curves as specified (25 °C unless the datasheet says otherwise). */
  refCaseTemp?: number;
  derated?: ChartDerated | null;
  interpolated?: ChartInterpolated | null;
  instability?: ChartInstability | null;
  findings?: ChartFinding[];
  pulses?: ChartPulse[];
}
