// Shapes of the check contract (METHODS.md §9) and of the engine's inputs. Units are SI throughout:
// V, A, s, W, J, K/W, and °C for temperatures.
import type { FosterTerm } from "./foster";

/** Pulse width of one SOA curve in seconds, or "DC" for the steady-state line. */
export type Duration = number | "DC";

/** One SOA curve: the limit line of one pulse width. Points are [V, I]; the engine sorts them by V. */
export interface Curve {
  duration: Duration;
  points: [number, number][];
}

/** All curves of one datasheet figure, specified at `refCaseTemp` (default 25 °C) for a single pulse. */
export interface CurveSet {
  refCaseTemp?: number;
  curves: Curve[];
}

/** The ratings of a part that a check needs. `foster` is the junction-to-case thermal model. */
export interface PartLimits {
  vdsMax: number;
  tjMax: number;
  rdsOn?: number;
  idPulseMax?: number;
  rthJc?: number;
  foster?: FosterTerm[];
  soa: CurveSet;
}

/** How to read the curves between two digitised pulse widths (METHODS §3). */
export type BetweenCurves = "loglog" | "next-longer";

/** Margin policy of a project (METHODS §8). */
export interface Policy {
  utilisationLimit?: number;
  tjGuard?: number;
  betweenCurves?: BetweenCurves;
}

/** The policy with every default filled in. */
export type ResolvedPolicy = Required<Policy>;

/** Repetition of a rect or triangle pulse: period T (s) and count N (absent: continuous train). */
export interface Repeat {
  period: number;
  count?: number;
}

/** V and I constant for `duration` seconds. */
export interface RectPulse {
  id: string;
  kind: "rect";
  v: number;
  i: number;
  duration: number;
  repeat?: Repeat;
}

/** V constant, I falling linearly from `i` (the peak) to 0 over `duration` seconds. */
export interface TrianglePulse {
  id: string;
  kind: "triangle";
  v: number;
  i: number;
  duration: number;
  repeat?: Repeat;
}

/** A captured waveform: samples of time (s, strictly increasing), voltage (V) and current (A). */
export interface WaveformPulse {
  id: string;
  kind: "waveform";
  t: number[];
  v: number[];
  i: number[];
}

export type Pulse = RectPulse | TrianglePulse | WaveformPulse;
export type PulseKind = Pulse["kind"];

export interface CheckRequest {
  part: PartLimits;
  caseTemp: number;
  policy?: Policy;
  pulses: Pulse[];
}

/**
 * Every flag a result can carry, in the order results list them. All but the last two are named by
 * METHODS.md; `case-at-or-above-tj-max` (derating factor 0: nothing is allowed) and `no-power` (a capture
 * whose peak power is not positive, so no equivalent rectangle exists) are this engine's own.
 */
export const FLAGS = [
  "over-voltage",
  "over-current",
  "case-at-or-above-tj-max",
  "shorter-than-shortest-curve",
  "interpolated",
  "next-longer-curve",
  "dc-curve-used",
  "longer-than-longest-curve",
  "below-curve-range",
  "above-curve-range",
  "equivalent-rectangle",
  "pulse-too-short",
  "no-power",
  "repetition-outside-data",
] as const;

export type Flag = (typeof FLAGS)[number];

/** Verdicts from best to worst: pass < marginal < no-data < fail. */
export type Verdict = "pass" | "marginal" | "fail" | "no-data";

export interface PulseResult {
  id: string;
  /** Derated (and, for repeats, scaled) allowed current in A; null where the curves give no value. */
  allowedCurrent: number | null;
  /** I / allowedCurrent; null when allowedCurrent is null or 0. */
  utilisation: number | null;
  /** Peak junction temperature in °C; null without a Foster network. */
  tjPeak: number | null;
  /** Temperature derating factor k in [0, 1]. */
  derating: number;
  verdict: Verdict;
  flags: Flag[];
}

export interface CheckResponse {
  results: PulseResult[];
}
