// A physical model of a MOSFET's SOA figure, used to generate the demo library's curve sets instead of copying any
// datasheet. Each curve (one pulse width) is the lowest of these limits, each a straight line on log-log axes:
// - the R_DS(on) line I = V/R_DS(on),hot (the channel fully on at Tj,max);
// - the package limit: I_DM for pulses, the continuous I_D for DC (bond wires and clip);
// - the constant-power line I = P/V with P = (Tj,max − T_ref)/Z_th(t_p), R_th for DC, Z_th from the Foster
//   network (METHODS.md §4; derived: a rectangular pulse from T_ref just reaches Tj,max);
// - optionally, above a knee voltage V_k, the thermal-instability line I = (P/V_k)·(V_k/V)^n, steeper than
//   constant power (hot spots where the gate threshold falls with temperature: Spirito et al., MIEL 2002);
// and the curve ends at V_DSS. The curve is returned as its corners, exact on log-log interpolation.
import { type FosterTerm, rth, zth } from "@/lib/soa/foster";
import type { Curve, Duration } from "@/lib/soa/types";

export interface InstabilityKnee {
  duration: Duration;
  /** V_k in V: the curve falls as V^-n above it. */
  voltage: number;
}

export interface SoaModel {
  /** V_DSS in V: the right end of every curve. */
  vdsMax: number;
  /** Tj,max in °C. */
  tjMax: number;
  /** Case temperature of the figure in °C (25 unless stated). */
  refCaseTemp?: number;
  /** R_DS(on) at Tj,max in Ω. */
  rdsOnHot: number;
  /** Continuous drain current I_D in A (the DC curve's package limit). */
  idContinuous: number;
  /** Pulsed drain current I_DM in A (the pulse curves' package limit). */
  idPulseMax: number;
  foster: readonly FosterTerm[];
  /** Thermal instability: exponent n (> 1) and the knee of each affected pulse width. */
  instability?: { exponent: number; knees: readonly InstabilityKnee[] };
  /** Left end of every curve in V (default 0.1 V, where datasheet figures usually begin). */
  vMin?: number;
}

/** Pulse widths of the demo figures: 10 µs, 100 µs, 1 ms, 10 ms and DC. */
export const DEMO_WIDTHS: readonly Duration[] = [10e-6, 100e-6, 1e-3, 10e-3, "DC"];

/** A limit I = c·V^s, held as ln c and s. */
interface PowerLaw {
  lnC: number;
  s: number;
}

/** The power P_k of the constant-power line of one pulse width in W. */
export function thermalPower(model: SoaModel, duration: Duration): number {
  const impedance = duration === "DC" ? rth(model.foster) : zth(model.foster, duration);
  return (model.tjMax - (model.refCaseTemp ?? 25)) / impedance;
}

function limits(model: SoaModel, duration: Duration): PowerLaw[] {
  const power = thermalPower(model, duration);
  const pkg = duration === "DC" ? model.idContinuous : model.idPulseMax;
  const laws: PowerLaw[] = [
    { lnC: -Math.log(model.rdsOnHot), s: 1 },
    { lnC: Math.log(pkg), s: 0 },
    { lnC: Math.log(power), s: -1 },
  ];
  const knee = model.instability?.knees.find((k) => k.duration === duration);
  if (model.instability !== undefined && knee !== undefined) {
    const n = model.instability.exponent;
    laws.push({ lnC: Math.log(power) + (n - 1) * Math.log(knee.voltage), s: -n });
  }
  return laws;
}

function envelope(laws: readonly PowerLaw[], lnV: number): number {
  return Math.min(...laws.map((law) => law.lnC + law.s * lnV));
}

/** One curve of the model: the corners of the lowest limit from vMin to V_DSS, V ascending. */
export function modelCurve(model: SoaModel, duration: Duration): Curve {
  const laws = limits(model, duration);
  const lo = Math.log(model.vMin ?? 0.1);
  const hi = Math.log(model.vdsMax);
  const xs = [lo, hi];
  for (const a of laws) {
    for (const b of laws) {
      if (a.s >= b.s) continue;
      const x = (a.lnC - b.lnC) / (b.s - a.s);
      if (x > lo && x < hi) xs.push(x);
    }
  }
  xs.sort((a, b) => a - b);
  const distinct = xs.filter((x, k) => k === 0 || x - xs[k - 1] > 1e-12);
  const corners = distinct.map((x) => [x, envelope(laws, x)] as const);
  const slope = (p: readonly number[], q: readonly number[]) => (q[1] - p[1]) / (q[0] - p[0]);
  const kept = corners.filter((point, k) => {
    if (k === 0 || k === corners.length - 1) return true;
    const [before, after] = [corners[k - 1], corners[k + 1]];
    return Math.abs(slope(before, point) - slope(point, after)) > 1e-9;
  });
  return { duration, points: kept.map(([x, y]) => [Math.exp(x), Math.exp(y)]) };
}

/** The model's curve set for the given pulse widths (the demo's by default). */
export function modelCurveSet(model: SoaModel, widths: readonly Duration[] = DEMO_WIDTHS): Curve[] {
  return widths.map((duration) => modelCurve(model, duration));
}
