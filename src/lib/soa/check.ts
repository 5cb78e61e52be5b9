// One check (METHODS.md §9): every pulse of a request against one part at one case temperature. Per pulse:
// the width read on the curves (§3; equivalent rectangle for triangles and captures, §6), the derating factor
// (§5), the repetition scale (§7), hard limits V_DSS and I_DM (§2), the junction temperature from the Foster
// network (§4) and the verdict (§8). Decisions where METHODS.md leaves a choice:
// - with a Foster network, repetition takes Z_th and R_th = Σ R_i from it (R_th(j-c) of the part is then
//   unused); without one, from the curves, R_th from R_th(j-c) else the DC curve (§7);
// - the duty-cycle form on the curves is that of a continuous train; `count` only enters the Tj figure;
// - the repetition scale is worked out (and `repetition-outside-data` flagged) even without a curve value;
// - a case at or above Tj,max (derating 0) fails on the curves even where the curves give no value, flag
//   `case-at-or-above-tj-max`; allowedCurrent is then 0 (null where the curves give no value);
// - captures: V_DSS is checked against the largest sample of v, I_DM against the largest |i| (see `capture`).
import { allowedCurrent } from "./allowed-current";
import { type PreparedCurveSet, prepareCurveSet } from "./curve-set";
import { derate } from "./derate";
import { triangleEquivalent, waveformEquivalent } from "./equivalent-rectangle";
import type { FosterTerm } from "./foster";
import { resolvePolicy } from "./policy";
import { repetitionScale } from "./repetition";
import { type ImpedanceSource, impedanceFromCurves, impedanceFromFoster } from "./thermal-impedance";
import { rectRise, trainRise } from "./thermal-rect";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRise } from "./thermal-waveform";
import type {
  CheckRequest,
  CheckResponse,
  Flag,
  PartLimits,
  Policy,
  Pulse,
  PulseResult,
  RectPulse,
  ResolvedPolicy,
  TrianglePulse,
  Verdict,
  WaveformPulse,
} from "./types";
import { FLAGS } from "./types";
import { curveVerdict, thermalVerdict, utilisation, worseVerdict } from "./verdict";

/** Everything about a part and its conditions that does not depend on the pulse, computed once per check. */
export interface CheckContext {
  part: PartLimits;
  caseTemp: number;
  policy: ResolvedPolicy;
  curves: PreparedCurveSet;
  derating: number;
  network: FosterTerm[] | null;
  impedance: ImpedanceSource;
}

/** Prepares a part (sorted curves, derating, thermal impedance source) for checking many pulses. */
export function prepareCheck(part: PartLimits, caseTemp: number, policy?: Policy): CheckContext {
  const curves = prepareCurveSet(part.soa);
  const network = part.foster !== undefined && part.foster.length > 0 ? part.foster : null;
  return {
    part,
    caseTemp,
    policy: resolvePolicy(policy),
    curves,
    derating: derate(part.tjMax, caseTemp, curves.refCaseTemp),
    network,
    impedance: network ? impedanceFromFoster(network) : impedanceFromCurves(curves, part.tjMax, part.rthJc),
  };
}

interface PulseOutcome {
  /** Derated, scaled allowed current in A, or null. */
  allowed: number | null;
  /** The current compared with it: I, I_pk or i* (0 when the pulse has no point on the curves). */
  current: number;
  /** Peak temperature rise in K, or null without a Foster network. */
  rise: number | null;
}

function ordered(flags: Set<Flag>): Flag[] {
  return FLAGS.filter((f) => flags.has(f));
}

/** Over-voltage (V > V_DSS) and over-current (I > I_DM, when given) flags. */
function hardLimits(ctx: CheckContext, vMax: number, iMax: number, flags: Set<Flag>): void {
  if (vMax > ctx.part.vdsMax) flags.add("over-voltage");
  if (ctx.part.idPulseMax !== undefined && iMax > ctx.part.idPulseMax) flags.add("over-current");
}

/** Allowed current (derated, then scaled for repetition) at (v, width); adds the flags that explain it. */
function allowedAt(
  ctx: CheckContext,
  v: number,
  width: number,
  scale: number | null,
  flags: Set<Flag>,
): number | null {
  const read = allowedCurrent(ctx.curves, v, width, ctx.policy.betweenCurves);
  for (const f of read.flags) flags.add(f);
  if (read.current === null || scale === null) return null;
  return ctx.derating * read.current * scale;
}

/**
 * Rectangles and triangles, single or repeated. A triangle reads the curves as its equal-energy rectangle.
 */
function shapedPulse(ctx: CheckContext, pulse: RectPulse | TrianglePulse, flags: Set<Flag>): PulseOutcome {
  const isTriangle = pulse.kind === "triangle";
  const width = isTriangle ? triangleEquivalent(pulse.v, pulse.i, pulse.duration).duration : pulse.duration;
  if (isTriangle) flags.add("equivalent-rectangle");
  hardLimits(ctx, pulse.v, pulse.i, flags);
  const { repeat } = pulse;
  let scale: number | null = 1;
  if (repeat !== undefined) {
    const repetition = repetitionScale(ctx.impedance, width, repeat.period);
    scale = repetition.scale;
    if (repetition.flag !== null) flags.add(repetition.flag);
  }
  const allowed = allowedAt(ctx, pulse.v, width, scale, flags);
  let rise: number | null = null;
  if (ctx.network !== null) {
    const power = pulse.v * pulse.i;
    if (isTriangle) rise = trianglePeakRise(ctx.network, power, pulse.duration, repeat);
    else if (repeat === undefined) rise = rectRise(ctx.network, power, pulse.duration);
    else rise = trainRise(ctx.network, power, pulse.duration, repeat.period, repeat.count);
  }
  return { allowed, current: pulse.i, rise };
}

/**
 * A capture. Hard limits use the largest sample of v (a negative V_DS is body-diode conduction, not blocking)
 * and of |i| (I_DM holds in either direction). The curves are read at the peak-power sample; p_peak > 0 means
 * v* and i* share a sign, so a capture with both probes reversed reads as (|v*|, |i*|).
 */
function capture(ctx: CheckContext, pulse: WaveformPulse, flags: Set<Flag>): PulseOutcome {
  const n = pulse.t.length;
  const power = new Float64Array(n);
  let vMax = Number.NEGATIVE_INFINITY;
  let iMax = 0;
  for (let k = 0; k < n; k++) {
    power[k] = pulse.v[k] * pulse.i[k];
    vMax = Math.max(vMax, pulse.v[k]);
    iMax = Math.max(iMax, Math.abs(pulse.i[k]));
  }
  hardLimits(ctx, vMax, iMax, flags);
  const rise = ctx.network === null ? null : waveformRise(pulse.t, power, ctx.network).peak;
  const rect = waveformEquivalent(pulse.t, power);
  if (!rect.ok) {
    flags.add(rect.flag);
    return { allowed: null, current: 0, rise };
  }
  flags.add("equivalent-rectangle");
  const v = Math.abs(pulse.v[rect.peakIndex]);
  const current = Math.abs(pulse.i[rect.peakIndex]);
  return { allowed: allowedAt(ctx, v, rect.duration, 1, flags), current, rise };
}

/** Checks one pulse against a prepared part. */
export function checkPulse(ctx: CheckContext, pulse: Pulse): PulseResult {
  const flags = new Set<Flag>();
  if (ctx.derating === 0) flags.add("case-at-or-above-tj-max");
  const outcome = pulse.kind === "waveform" ? capture(ctx, pulse, flags) : shapedPulse(ctx, pulse, flags);
  const hardFail = flags.has("over-voltage") || flags.has("over-current") || ctx.derating === 0;
  const verdicts: Verdict[] = [
    curveVerdict({
      current: outcome.current,
      allowed: outcome.allowed,
      utilisationLimit: ctx.policy.utilisationLimit,
      hardFail,
    }),
  ];
  let tjPeak: number | null = null;
  if (outcome.rise !== null) {
    tjPeak = ctx.caseTemp + outcome.rise;
    verdicts.push(thermalVerdict(tjPeak, ctx.part.tjMax, ctx.policy.tjGuard));
  }
  return {
    id: pulse.id,
    allowedCurrent: outcome.allowed,
    utilisation: utilisation(outcome.current, outcome.allowed),
    tjPeak,
    derating: ctx.derating,
    verdict: worseVerdict(...verdicts),
    flags: ordered(flags),
  };
}

/** Runs a validated check request (see schema.ts): one result per pulse, in request order. */
export function runCheck(request: CheckRequest): CheckResponse {
  const ctx = prepareCheck(request.part, request.caseTemp, request.policy);
  return { results: request.pulses.map((pulse) => checkPulse(ctx, pulse)) };
}
