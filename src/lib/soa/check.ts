// One check (METHODS.md §9, revision 2): every pulse of a request against one part at one case temperature. Per
// pulse: the width read on the curves (§3; t_p/2 for triangles, every sample at its own width for captures, §6),
// the derating factor (§5), the repetition scale (§7), the hard limits V_DSS and I_DM (§2), the voltage margin
// (§8), the junction temperature from the Foster network (§4, between samples included) and the verdicts (§8):
// curve, thermal and stability views, the final verdict being the worst of them, and no better than marginal
// where the record may miss part of the pulse (`starts-mid-pulse` decided by the engine, `ends-mid-pulse`).
// Choices where METHODS.md leaves one:
// - a capture's curve view: when no read sample has a value, no data; otherwise the utilisation and allowed
//   current are the binding sample's even when other samples had no value (the verdict then says no data);
// - `at` is given for captures only (null when no sample was read with a value);
// - `repetitionScale` is null for pulses that do not repeat.
import { CurveReader, FLAG_BIT, flagsOf } from "./curve-reader";
import { type PreparedCurveSet, prepareCurveSet } from "./curve-set";
import { derate } from "./derate";
import type { FosterTerm } from "./foster";
import { resolvePolicy } from "./policy";
import { repetitionScale } from "./repetition";
import { type ImpedanceSource, impedanceFromCurves } from "./thermal-impedance";
import { rectRise, trainRise } from "./thermal-rect";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRiseVI } from "./thermal-waveform";
import type {
  CheckRequest,
  CheckResponse,
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
import { curveVerdict, thermalVerdict, utilisation, worseVerdict } from "./verdict";
import { readWaveform } from "./waveform-check";

/** Everything about a part and its conditions that does not depend on the pulse, computed once per check. */
export interface CheckContext {
  part: PartLimits;
  caseTemp: number;
  policy: ResolvedPolicy;
  curves: PreparedCurveSet;
  reader: CurveReader;
  derating: number;
  network: FosterTerm[] | null;
  /** Z_th and R_th read off the curves, for repetition without a network (METHODS.md §7). */
  curveImpedance: ImpedanceSource;
}

/** Prepares a part (sorted curves, their reader, derating, thermal impedance) for checking many pulses. */
export function prepareCheck(part: PartLimits, caseTemp: number, policy?: Policy): CheckContext {
  const curves = prepareCurveSet(part.soa);
  const network = part.foster !== undefined && part.foster.length > 0 ? part.foster : null;
  const resolved = resolvePolicy(policy);
  return {
    part,
    caseTemp,
    policy: resolved,
    curves,
    reader: new CurveReader(curves, resolved.betweenCurves, network),
    derating: derate(part.tjMax, caseTemp, curves.refCaseTemp),
    network,
    curveImpedance: impedanceFromCurves(curves, part.tjMax, part.rthJc),
  };
}

/** What a pulse's kind contributes to its result. */
interface Outcome {
  /** Derated, scaled allowed current in A, or null. */
  allowed: number | null;
  /** The current compared with it: I, I_pk or the binding sample's i. */
  current: number;
  /** Some reading had no value although the binding one did (captures). */
  noValueElsewhere: boolean;
  /** Peak temperature rise in K, or null without a Foster network. */
  rise: number | null;
  flags: number;
  equivalentWidth: number | null;
  repetitionScale: number | null;
  /** The verdict may be no better than marginal (the record may miss part of the pulse). */
  capMarginal: boolean;
  at?: PulseResult["at"];
}

/** Hard limits (§2) and the voltage margin (§8) as flags. */
function limitFlags(ctx: CheckContext, vMax: number, iMax: number): number {
  const { part, policy } = ctx;
  let flags = 0;
  if (vMax > part.vdsMax) flags |= FLAG_BIT["over-voltage"];
  else if (vMax > policy.voltageLimit * part.vdsMax) flags |= FLAG_BIT["voltage-margin"];
  if (part.idPulseMax !== undefined && iMax > part.idPulseMax) flags |= FLAG_BIT["over-current"];
  return flags;
}

function lnOf(v: number): number {
  return v > 0 ? Math.log(v) : Number.NEGATIVE_INFINITY;
}

/** Rectangles and triangles, single or repeated. A triangle reads the curves as its equal-energy rectangle. */
function shapedPulse(ctx: CheckContext, pulse: RectPulse | TrianglePulse): Outcome {
  const isTriangle = pulse.kind === "triangle";
  const width = isTriangle ? pulse.duration / 2 : pulse.duration;
  let flags = limitFlags(ctx, pulse.v, pulse.i);
  if (isTriangle) flags |= FLAG_BIT["equivalent-rectangle"];
  const { repeat } = pulse;
  let scale: number | null = null;
  if (repeat !== undefined) {
    flags |= FLAG_BIT["repetition-applied"];
    const repetition = repetitionScale({
      network: ctx.network,
      curves: ctx.curveImpedance,
      tEq: width,
      period: repeat.period,
      count: repeat.count,
    });
    scale = repetition.scale;
    if (repetition.flag !== null) flags |= FLAG_BIT[repetition.flag];
  }
  ctx.reader.flags = 0;
  const lnAllowed = ctx.reader.readLn(lnOf(pulse.v), width);
  flags |= ctx.reader.flags;
  const allowed =
    Number.isNaN(lnAllowed) || (repeat !== undefined && scale === null)
      ? null
      : ctx.derating * Math.exp(lnAllowed) * (scale ?? 1);
  let rise: number | null = null;
  if (ctx.network !== null) {
    const power = pulse.v * pulse.i;
    if (isTriangle) rise = trianglePeakRise(ctx.network, power, pulse.duration, repeat);
    else if (repeat === undefined) rise = rectRise(ctx.network, power, pulse.duration);
    else rise = trainRise(ctx.network, power, pulse.duration, repeat.period, repeat.count);
  }
  return {
    allowed,
    current: pulse.i,
    noValueElsewhere: false,
    rise,
    flags,
    equivalentWidth: width,
    repetitionScale: scale,
    capMarginal: false,
  };
}

/** A capture: every read sample at its own width (§6), Tj over the whole record from its start. */
function capture(ctx: CheckContext, pulse: WaveformPulse): Outcome {
  const reading = readWaveform(ctx.reader, pulse, ctx.derating);
  const flags = reading.flags | limitFlags(ctx, reading.vMax, reading.iMaxAbs);
  const rise =
    ctx.network === null
      ? null
      : waveformRiseVI(pulse.t, pulse.v, pulse.i, ctx.network, { steady: reading.start === "steady" })
          .maxRise;
  const { binding } = reading;
  const outcome: Outcome = {
    allowed: null,
    current: 0,
    noValueElsewhere: false,
    rise,
    flags,
    equivalentWidth: reading.equivalentWidth,
    repetitionScale: null,
    capMarginal: reading.startDecided || reading.endsMidPulse,
    at: null,
  };
  if (binding !== null) {
    const k = binding.index;
    outcome.allowed = ctx.derating * Math.exp(binding.lnAllowed);
    outcome.current = pulse.i[k];
    outcome.noValueElsewhere = reading.anyNoValue;
    outcome.at = { t: pulse.t[k], v: pulse.v[k], i: pulse.i[k], width: binding.width };
  }
  return outcome;
}

/** Checks one pulse against a prepared part. */
export function checkPulse(ctx: CheckContext, pulse: Pulse): PulseResult {
  const outcome = pulse.kind === "waveform" ? capture(ctx, pulse) : shapedPulse(ctx, pulse);
  const { flags } = outcome;
  let curve = curveVerdict({
    current: outcome.current,
    allowed: outcome.allowed,
    utilisationLimit: ctx.policy.utilisationLimit,
    hardFail: (flags & (FLAG_BIT["over-voltage"] | FLAG_BIT["over-current"])) !== 0,
  });
  if (outcome.noValueElsewhere && curve !== "fail") curve = "no-data";
  if ((flags & FLAG_BIT["voltage-margin"]) !== 0) curve = worseVerdict(curve, "marginal");
  let tjPeak: number | null = null;
  let thermal: Verdict | null = null;
  if (outcome.rise !== null) {
    tjPeak = ctx.caseTemp + outcome.rise;
    thermal = thermalVerdict(tjPeak, ctx.part.tjMax, ctx.policy.tjGuard);
  }
  let verdict = worseVerdict(curve, thermal ?? "pass");
  if (outcome.capMarginal) verdict = worseVerdict(verdict, "marginal");
  const result: PulseResult = {
    id: pulse.id,
    allowedCurrent: outcome.allowed,
    utilisation: utilisation(outcome.current, outcome.allowed),
    tjPeak,
    derating: ctx.derating,
    verdict,
    flags: flagsOf(flags),
    curveVerdict: curve,
    thermalVerdict: thermal,
    stabilityVerdict: null,
    stability: null,
    equivalentWidth: outcome.equivalentWidth,
    repetitionScale: outcome.repetitionScale,
  };
  if (outcome.at !== undefined) result.at = outcome.at;
  return result;
}

/** Runs a validated check request (see schema.ts): one result per pulse, in request order. */
export function runCheck(request: CheckRequest): CheckResponse {
  const ctx = prepareCheck(request.part, request.caseTemp, request.policy);
  return { results: request.pulses.map((pulse) => checkPulse(ctx, pulse)) };
}
