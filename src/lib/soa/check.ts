// One check (METHODS.md §9, revision 2): every pulse of a request against one part at one case temperature. Per
// pulse: the width read on the curves (§3; t_p/2 for triangles, every sample at its own width for captures, §6),
// the derating factor (§5, at the case heated by the pulse where a case network is given, §14), the repetition scale
// (§7), the hard limits V_DSS and I_DM (§2), the voltage margin (§8), the junction temperature from the Foster
// network (§4, between samples included; with the case network's rise, §14), the stability factor (§12), the
// avalanche energy of an unclamped turn-off (§13), and the verdicts (§8): curve, thermal and stability views, the
// final verdict being the worst of them, and no better than marginal where the record may miss part of the pulse
// (`starts-mid-pulse` decided by the engine, `ends-mid-pulse`).
// Choices where METHODS.md leaves one:
// - a capture's curve view: when no read sample has a value, no data; otherwise the utilisation and allowed
//   current are the binding sample's even when other samples had no value (the verdict then says no data);
// - a capture's stability: the largest S over the samples that have one; a sample without one flags
//   `stability-outside-data` and makes the stability verdict no data unless another sample already fails;
// - `at` is given for captures only (null when no sample was read with a value);
// - `repetitionScale` is null for pulses that do not repeat;
// - an avalanche pulse keeps the I_DM rule (METHODS.md lifts only the voltage rules for it); without avalanche
//   ratings its curve verdict is no data; with a case network its Tj includes the case rise, while k_av stays at
//   Tc (the case does not heat in microseconds);
// - `case-heating` is flagged on every pulse checked with a case network.
//
// Long file: the one place where every rule of METHODS.md §9 meets for a pulse; each kind of pulse has its own
// function here, and splitting them apart would scatter the order in which the rules apply.
import { avalancheDerating, avalancheEvent } from "./avalanche";
import { CurveReader, FLAG_BIT, flagsOf } from "./curve-reader";
import { type PreparedCurveSet, prepareCurveSet } from "./curve-set";
import { derate } from "./derate";
import { type FosterTerm, zth } from "./foster";
import { resolvePolicy } from "./policy";
import { repetitionScale } from "./repetition";
import {
  largestCoefficient,
  type PreparedTransfer,
  prepareTransfer,
  stabilityVerdict,
  temperatureCoefficient,
} from "./stability";
import { type ImpedanceSource, impedanceFromCurves } from "./thermal-impedance";
import { rectRise, trainRise } from "./thermal-rect";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRiseVI } from "./thermal-waveform";
import type {
  AvalanchePulse,
  CheckRequest,
  CheckResponse,
  PartLimits,
  Policy,
  Pulse,
  PulseResult,
  RectPulse,
  Repeat,
  ResolvedPolicy,
  TrianglePulse,
  Verdict,
  WaveformPulse,
} from "./types";
import { curveVerdict, thermalVerdict, utilisation, worse } from "./verdict";
import {
  READ_CURRENT_SHARE,
  readWaveform,
  recordCaseRise,
  recordFigures,
  recordStart,
} from "./waveform-check";

/** Everything about a part and its conditions that does not depend on the pulse, computed once per check. */
export interface CheckContext {
  part: PartLimits;
  caseTemp: number;
  policy: ResolvedPolicy;
  curves: PreparedCurveSet;
  reader: CurveReader;
  /** The derating factor at the case temperature (METHODS.md §5). */
  derating: number;
  network: FosterTerm[] | null;
  /** Z_th and R_th read off the curves, for repetition without a network (METHODS.md §7). */
  curveImpedance: ImpedanceSource;
  /** Transfer characteristics for the stability factor (METHODS.md §12), or null. */
  transfer: PreparedTransfer | null;
  /** Case-to-ambient network (METHODS.md §14), or null. */
  caseNetwork: FosterTerm[] | null;
  /** The network Tj is taken from: junction-to-case, with the case network's terms when there is one. */
  junction: FosterTerm[] | null;
}

/** Prepares a part (sorted curves, their reader, derating, thermal impedance) for checking many pulses. */
export function prepareCheck(
  part: PartLimits,
  caseTemp: number,
  policy?: Policy,
  caseNetwork?: FosterTerm[],
): CheckContext {
  const curves = prepareCurveSet(part.soa);
  const network = part.foster !== undefined && part.foster.length > 0 ? part.foster : null;
  const caseTerms = caseNetwork !== undefined && caseNetwork.length > 0 ? caseNetwork : null;
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
    transfer: part.transfer === undefined ? null : prepareTransfer(part.transfer),
    caseNetwork: caseTerms,
    // Both networks driven by the same power: their sum is the response of the union of their terms (§14).
    junction: network === null ? null : caseTerms === null ? network : [...network, ...caseTerms],
  };
}

/**
 * The same part and conditions at another case temperature: only the derating differs, so the prepared curves,
 * their reader and the thermal data are shared (a project checks its fault cases at their own temperatures).
 */
export function atCaseTemp(ctx: CheckContext, caseTemp: number): CheckContext {
  if (caseTemp === ctx.caseTemp) return ctx;
  return { ...ctx, caseTemp, derating: derate(ctx.part.tjMax, caseTemp, ctx.curves.refCaseTemp) };
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
  /** The derating factor used (k at the heated case with a case network; k_av for an avalanche pulse). */
  derating: number;
  stability: number | null;
  stabilityVerdict: Verdict | null;
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

/** Peak rise of a rectangle or triangle (single or repeated) of peak power `power` on a network. */
function shapedRise(network: readonly FosterTerm[], pulse: RectPulse | TrianglePulse, power: number): number {
  const { repeat } = pulse;
  if (pulse.kind === "triangle") return trianglePeakRise(network, power, pulse.duration, repeat);
  if (repeat === undefined) return rectRise(network, power, pulse.duration);
  return trainRise(network, power, pulse.duration, repeat.period, repeat.count);
}

/** Z_th(t_eq), or Z_rep of §7 for a repeated pulse, from the junction network. */
function stabilityImpedance(
  network: readonly FosterTerm[],
  width: number,
  repeat: Repeat | undefined,
): number {
  return repeat === undefined
    ? zth(network, width)
    : trainRise(network, 1, width, repeat.period, repeat.count);
}

/** Stability value, verdict and flags from S, or from null where the data give none (METHODS.md §12). */
function stabilityOf(
  ctx: CheckContext,
  s: number | null,
): { stability: number | null; stabilityVerdict: Verdict; flags: number } {
  if (s === null) {
    return { stability: null, stabilityVerdict: "no-data", flags: FLAG_BIT["stability-outside-data"] };
  }
  const verdict = stabilityVerdict(s, ctx.policy.utilisationLimit);
  return {
    stability: s,
    stabilityVerdict: verdict,
    flags: verdict === "fail" ? FLAG_BIT["thermal-instability"] : 0,
  };
}

/** Rectangles and triangles, single or repeated. A triangle reads the curves as its equal-energy rectangle. */
function shapedPulse(ctx: CheckContext, pulse: RectPulse | TrianglePulse): Outcome {
  const isTriangle = pulse.kind === "triangle";
  const width = isTriangle ? pulse.duration / 2 : pulse.duration;
  const power = pulse.v * pulse.i;
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
  const derating =
    ctx.caseNetwork === null ? ctx.derating : deratingAt(ctx, shapedRise(ctx.caseNetwork, pulse, power));
  ctx.reader.flags = 0;
  const lnAllowed = ctx.reader.read(pulse.v, width);
  flags |= ctx.reader.flags;
  const allowed =
    Number.isNaN(lnAllowed) || (repeat !== undefined && scale === null)
      ? null
      : derating * Math.exp(lnAllowed) * (scale ?? 1);
  let stability: number | null = null;
  let stabilityV: Verdict | null = null;
  if (ctx.transfer !== null && ctx.network !== null) {
    const alpha = isTriangle
      ? (largestCoefficient(ctx.transfer, pulse.i)?.alpha ?? null)
      : temperatureCoefficient(ctx.transfer, pulse.i);
    const z = stabilityImpedance(ctx.network, width, repeat);
    const found = stabilityOf(ctx, alpha === null ? null : pulse.v * alpha * z);
    stability = found.stability;
    stabilityV = found.stabilityVerdict;
    flags |= found.flags;
  }
  return {
    allowed,
    current: pulse.i,
    noValueElsewhere: false,
    rise: ctx.junction === null ? null : shapedRise(ctx.junction, pulse, power),
    flags,
    equivalentWidth: width,
    repetitionScale: scale,
    capMarginal: false,
    derating,
    stability,
    stabilityVerdict: stabilityV,
  };
}

/** A capture: every read sample at its own width (§6), Tj over the whole record from its start. */
function capture(ctx: CheckContext, pulse: WaveformPulse): Outcome {
  const { t, v, i } = pulse;
  let derating = ctx.derating;
  if (ctx.caseNetwork !== null) {
    const { start } = recordStart(Math.max(v[0] * i[0], 0), recordFigures(pulse).peakPower, pulse.start);
    derating = deratingAt(ctx, recordCaseRise(pulse, ctx.caseNetwork, start === "steady"));
  }
  const reading = readWaveform(ctx.reader, pulse, derating);
  let flags = reading.flags | limitFlags(ctx, reading.vMax, reading.iMaxAbs);
  const steady = reading.start === "steady";
  const rise = ctx.junction === null ? null : waveformRiseVI(t, v, i, ctx.junction, { steady }).maxRise;
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
    derating,
    stability: null,
    stabilityVerdict: null,
  };
  const { binding } = reading;
  if (binding !== null) {
    const k = binding.index;
    outcome.allowed = derating * Math.exp(binding.lnAllowed);
    outcome.current = i[k];
    outcome.noValueElsewhere = reading.anyNoValue;
    outcome.at = { t: t[k], v: v[k], i: i[k], width: binding.width };
  }
  if (ctx.transfer !== null && ctx.network !== null && reading.equivalentWidth !== null) {
    const found = captureStability(ctx, ctx.transfer, ctx.network, pulse, reading.energy, reading.iMaxAbs);
    outcome.stability = found.stability;
    outcome.stabilityVerdict = found.stabilityVerdict;
    flags |= found.flags;
  }
  outcome.flags = flags;
  return outcome;
}

/**
 * S of a capture (METHODS.md §12): the largest v_n·α(i_n)·Z_th(t_n) over the samples read on the curves (§6), each
 * at its own width t_n = min(E/p_n, T_rec).
 */
function captureStability(
  ctx: CheckContext,
  transfer: PreparedTransfer,
  network: readonly FosterTerm[],
  pulse: WaveformPulse,
  energy: number,
  iMaxAbs: number,
): { stability: number | null; stabilityVerdict: Verdict; flags: number } {
  const { t, v, i } = pulse;
  const recordLength = t[t.length - 1] - t[0];
  const threshold = READ_CURRENT_SHARE * iMaxAbs;
  let best = Number.NEGATIVE_INFINITY;
  let missing = false;
  for (let k = 0; k < t.length; k++) {
    if (!(v[k] > 0 && i[k] > threshold)) continue;
    const alpha = temperatureCoefficient(transfer, i[k]);
    if (alpha === null) {
      missing = true;
      continue;
    }
    const width = Math.min(energy / (v[k] * i[k]), recordLength);
    best = Math.max(best, v[k] * alpha * zth(network, width));
  }
  if (best === Number.NEGATIVE_INFINITY) return stabilityOf(ctx, null);
  const found = stabilityOf(ctx, best);
  if (missing && found.stabilityVerdict !== "fail") {
    return {
      stability: best,
      stabilityVerdict: "no-data",
      flags: found.flags | FLAG_BIT["stability-outside-data"],
    };
  }
  return missing ? { ...found, flags: found.flags | FLAG_BIT["stability-outside-data"] } : found;
}

/** An unclamped inductive turn-off (§13): the avalanche energy against E_AS derated for the starting temperature. */
function avalanche(
  ctx: CheckContext,
  pulse: AvalanchePulse,
): Outcome & { energy: number; allowedEnergy: number | null } {
  const { part } = ctx;
  const rating = part.avalanche;
  const breakdown = rating?.breakdown ?? part.vdsMax;
  const derating = avalancheDerating(part.tjMax, ctx.caseTemp);
  let flags = FLAG_BIT.avalanche;
  // The contract refuses a supply at or above breakdown (schema.ts); a project can still pair such a fault case with
  // a candidate. The transistor then cannot block the supply at all: a hard fail, never a negative energy.
  const blocked = pulse.supply < breakdown;
  if (!blocked) flags |= FLAG_BIT["over-voltage"];
  const event = blocked
    ? avalancheEvent(pulse.inductance, pulse.current, pulse.supply, breakdown)
    : { energy: Number.POSITIVE_INFINITY, peakPower: Number.NaN, time: Number.NaN };
  if (part.idPulseMax !== undefined && pulse.current > part.idPulseMax) flags |= FLAG_BIT["over-current"];
  if (rating?.current !== undefined && pulse.current > rating.current)
    flags |= FLAG_BIT["over-avalanche-current"];
  const rise =
    ctx.junction === null || !blocked ? null : trianglePeakRise(ctx.junction, event.peakPower, event.time);
  return {
    allowed: null,
    current: 0,
    noValueElsewhere: false,
    rise,
    flags,
    equivalentWidth: null,
    repetitionScale: null,
    capMarginal: false,
    derating,
    stability: null,
    stabilityVerdict: null,
    energy: event.energy,
    allowedEnergy: rating === undefined ? null : rating.energy * derating,
  };
}

/** The derating factor at the case temperature raised by `caseRise` K (METHODS.md §5, §14). */
function deratingAt(ctx: CheckContext, caseRise: number): number {
  return caseRise > 0
    ? derate(ctx.part.tjMax, ctx.caseTemp + caseRise, ctx.curves.refCaseTemp)
    : ctx.derating;
}

/** Checks one pulse against a prepared part. */
export function checkPulse(ctx: CheckContext, pulse: Pulse): PulseResult {
  let curve: Verdict;
  let outcome: Outcome;
  let used: number | null;
  if (pulse.kind === "avalanche") {
    const event = avalanche(ctx, pulse);
    outcome = event;
    used = utilisation(event.energy, event.allowedEnergy);
    curve = curveVerdict({
      current: event.energy,
      allowed: event.allowedEnergy,
      utilisationLimit: ctx.policy.utilisationLimit,
      hardFail:
        (event.flags &
          (FLAG_BIT["over-current"] | FLAG_BIT["over-avalanche-current"] | FLAG_BIT["over-voltage"])) !==
        0,
    });
  } else {
    outcome = pulse.kind === "waveform" ? capture(ctx, pulse) : shapedPulse(ctx, pulse);
    used = utilisation(outcome.current, outcome.allowed);
    curve = curveVerdict({
      current: outcome.current,
      allowed: outcome.allowed,
      utilisationLimit: ctx.policy.utilisationLimit,
      hardFail: (outcome.flags & (FLAG_BIT["over-voltage"] | FLAG_BIT["over-current"])) !== 0,
    });
    if (outcome.noValueElsewhere && curve !== "fail") curve = "no-data";
    if ((outcome.flags & FLAG_BIT["voltage-margin"]) !== 0) curve = worse(curve, "marginal");
  }
  let { flags } = outcome;
  if (ctx.caseNetwork !== null) flags |= FLAG_BIT["case-heating"];
  let tjPeak: number | null = null;
  let thermal: Verdict | null = null;
  if (outcome.rise !== null) {
    tjPeak = ctx.caseTemp + outcome.rise;
    thermal = thermalVerdict(tjPeak, ctx.part.tjMax, ctx.policy.tjGuard);
  }
  let verdict = curve;
  if (thermal !== null) verdict = worse(verdict, thermal);
  if (outcome.stabilityVerdict !== null) verdict = worse(verdict, outcome.stabilityVerdict);
  if (outcome.capMarginal) verdict = worse(verdict, "marginal");
  const result: PulseResult = {
    id: pulse.id,
    allowedCurrent: outcome.allowed,
    utilisation: used,
    tjPeak,
    derating: outcome.derating,
    verdict,
    flags: flagsOf(flags),
    curveVerdict: curve,
    thermalVerdict: thermal,
    stabilityVerdict: outcome.stabilityVerdict,
    stability: outcome.stability,
    equivalentWidth: outcome.equivalentWidth,
    repetitionScale: outcome.repetitionScale,
  };
  if (outcome.at !== undefined) result.at = outcome.at;
  return result;
}

/** Runs a validated check request (see schema.ts): one result per pulse, in request order. */
export function runCheck(request: CheckRequest): CheckResponse {
  const ctx = prepareCheck(request.part, request.caseTemp, request.policy, request.caseNetwork);
  return { results: request.pulses.map((pulse) => checkPulse(ctx, pulse)) };
}
