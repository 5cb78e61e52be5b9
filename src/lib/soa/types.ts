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

/**
 * Typical transfer characteristics I_D(V_GS) at two junction temperatures Ta < Tb (METHODS §12): each curve a list
 * of [V_GS, I_D] points, V_GS and I_D strictly ascending.
 */
export interface TransferData {
  temps: [number, number];
  curves: [[number, number][], [number, number][]];
}

/** Avalanche ratings (METHODS §13): E_AS in J at 25 °C start, optionally I_AS (A) and V_BR (V, default V_DSS). */
export interface AvalancheRating {
  energy: number;
  current?: number;
  breakdown?: number;
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
  transfer?: TransferData;
  avalanche?: AvalancheRating;
}

/** How to read the curves between two digitised pulse widths (METHODS §3). */
export type BetweenCurves = "loglog" | "next-longer" | "thermal";

/** Margin policy of a project (METHODS §8): u_max, ΔT_g (K), f_V (share of V_DSS) and the reading between widths. */
export interface Policy {
  utilisationLimit?: number;
  tjGuard?: number;
  voltageLimit?: number;
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

/**
 * What came before a captured record (METHODS §6): "rest" (nothing flowed before t_0) or "steady" (the first
 * sample's power had flowed long enough to settle). Absent: the engine decides from the data.
 */
export type RecordStart = "rest" | "steady";

/** A captured waveform: samples of time (s, strictly increasing), voltage (V) and current (A). */
export interface WaveformPulse {
  id: string;
  kind: "waveform";
  t: number[];
  v: number[];
  i: number[];
  start?: RecordStart;
}

/** An inductive current cut with no clamp below breakdown (METHODS §13): L (H), I (A) and supply V_DD (V). */
export interface AvalanchePulse {
  id: string;
  kind: "avalanche";
  inductance: number;
  current: number;
  supply: number;
}

export type Pulse = RectPulse | TrianglePulse | WaveformPulse | AvalanchePulse;
export type PulseKind = Pulse["kind"];

export interface CheckRequest {
  part: PartLimits;
  caseTemp: number;
  /** Foster network from case to ambient (METHODS §14): the case heats with the pulse's power. */
  caseNetwork?: FosterTerm[];
  policy?: Policy;
  pulses: Pulse[];
}

/** Every flag a result can carry (METHODS.md §2–§8), in the order results list them. */
export const FLAGS = [
  "over-voltage",
  "over-current",
  "voltage-margin",
  "shorter-than-shortest-curve",
  "interpolated",
  "next-longer-curve",
  "thermal-scaled",
  "thermal-scaling-unavailable",
  "dc-curve-used",
  "longer-than-longest-curve",
  "capped-by-shorter-curve",
  "below-curve-range",
  "above-curve-range",
  "equivalent-rectangle",
  "negative-power-clamped",
  "no-power",
  "starts-mid-pulse",
  "ends-mid-pulse",
  "repetition-applied",
  "repetition-outside-data",
  "thermal-instability",
  "stability-outside-data",
  "avalanche",
  "over-avalanche-current",
  "case-heating",
] as const;

export type Flag = (typeof FLAGS)[number];

/** Verdicts from best to worst: pass < marginal < no-data < fail. */
export type Verdict = "pass" | "marginal" | "fail" | "no-data";

/** The capture sample that decided a waveform's curve verdict (METHODS §6). */
export interface BindingSample {
  /** Time of the sample in s. */
  t: number;
  v: number;
  i: number;
  /** Width it was read at in s; null when the DC reading of a settled first sample binds. */
  width: number | null;
}

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
  /** The verdict of the curves alone (hard limits and voltage margin included). */
  curveVerdict: Verdict;
  /** Tj,peak against Tj,max and its guard; null without a Foster network. */
  thermalVerdict: Verdict | null;
  /** Electro-thermal stability (METHODS §12); null without transfer characteristics and a Foster network. */
  stabilityVerdict: Verdict | null;
  stability: number | null;
  /** The width read on the curves: t_p, t_p/2 or E/p_peak; null without one. */
  equivalentWidth: number | null;
  /** Factor on the single-pulse allowed current for a repeated pulse; null when not repeated or unknown. */
  repetitionScale: number | null;
  /** Waveforms only: the binding sample. */
  at?: BindingSample | null;
}

export interface CheckResponse {
  results: PulseResult[];
}
