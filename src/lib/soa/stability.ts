// Electro-thermal stability in linear mode (METHODS.md §12, v2). Below the zero-temperature-coefficient point of its
// transfer characteristic a MOSFET at fixed gate voltage carries more current as it heats; the loop gain
// S = V·α(I)·Z_th(t) ≥ 1 runs away. Criterion: Spirito et al., "Analytical model for thermal instability of low
// voltage power MOS and SOA in pulse operation", ISPSD 2002 (from memory; also Breglio, Irace, Spirito, ISPSD 1999).
//
// Each transfer curve is read linearly in V_GS against ln I_D between its points and has no value outside them.
// α(I): the gate voltage g with I_a(g) = I on the cooler curve (Ta), then α = (I_b(g) − I)/(Tb − Ta) in A/K.
// Over a range of currents [I_lo, I_pk] (a falling triangle passes through all of them), between the breakpoints of
// the two curves mapped to currents, I_b = C·I^q with q the ratio of the Tb to the Ta curve's log-slopes there, so
// α·(Tb − Ta) = C·I^q − I, largest at a piece's end or, when 0 < q < 1, at I* = (C·q)^(1/(1 − q)).
import type { TransferData } from "./types";

/** One transfer curve: V_GS and ln I_D at its points, both ascending. */
interface LnTransfer {
  g: Float64Array;
  ln: Float64Array;
}

export interface PreparedTransfer {
  ta: number;
  tb: number;
  a: LnTransfer;
  b: LnTransfer;
}

function lnTransfer(points: readonly [number, number][]): LnTransfer {
  return { g: Float64Array.from(points, ([g]) => g), ln: Float64Array.from(points, ([, i]) => Math.log(i)) };
}

export function prepareTransfer(data: TransferData): PreparedTransfer {
  return {
    ta: data.temps[0],
    tb: data.temps[1],
    a: lnTransfer(data.curves[0]),
    b: lnTransfer(data.curves[1]),
  };
}

/** Index j of the segment [x_j, x_(j+1)] holding x (x inside [x_0, x_last]), or −1 outside. */
function segment(xs: Float64Array, x: number): number {
  const last = xs.length - 1;
  if (!(x >= xs[0] && x <= xs[last])) return -1;
  let j = 0;
  while (j < last - 1 && xs[j + 1] <= x) j++;
  return j;
}

/** ln I_D at gate voltage g on one curve, linear in g between points; NaN outside them. */
function lnAt(curve: LnTransfer, g: number): number {
  const j = segment(curve.g, g);
  if (j < 0) return Number.NaN;
  const { g: gs, ln } = curve;
  return ln[j] + ((g - gs[j]) / (gs[j + 1] - gs[j])) * (ln[j + 1] - ln[j]);
}

/** The gate voltage where the cooler curve carries e^lnI; NaN outside its currents. */
function gateAt(curve: LnTransfer, lnI: number): number {
  const j = segment(curve.ln, lnI);
  if (j < 0) return Number.NaN;
  const { g, ln } = curve;
  return g[j] + ((lnI - ln[j]) / (ln[j + 1] - ln[j])) * (g[j + 1] - g[j]);
}

/** α(I) in A/K, or null where the data give no value (no g on the Ta curve, or no I_b(g)). */
export function temperatureCoefficient(transfer: PreparedTransfer, current: number): number | null {
  if (!(current > 0)) return null;
  const g = gateAt(transfer.a, Math.log(current));
  const lnB = lnAt(transfer.b, g);
  if (Number.isNaN(lnB)) return null;
  return (Math.exp(lnB) - current) / (transfer.tb - transfer.ta);
}

/**
 * The largest α over currents [I_lo, iPeak], I_lo the cooler curve's lowest current, with the current where it is
 * reached; null when some current of the range has no value (iPeak below I_lo included: nothing can be read).
 */
export function largestCoefficient(
  transfer: PreparedTransfer,
  iPeak: number,
): { alpha: number; current: number } | null {
  const { a, b } = transfer;
  const lo = Math.exp(a.ln[0]);
  if (!(iPeak >= lo)) return null;
  // Every current of the range must map to a gate voltage both curves cover.
  const gLo = a.g[0];
  const gHi = gateAt(a, Math.log(iPeak));
  if (Number.isNaN(gHi) || gLo < b.g[0] || gHi > b.g[b.g.length - 1]) return null;
  const breaks = new Set<number>([gLo, gHi]);
  for (const g of a.g) if (g > gLo && g < gHi) breaks.add(g);
  for (const g of b.g) if (g > gLo && g < gHi) breaks.add(g);
  const gates = [...breaks].sort((x, y) => x - y);
  let best: { alpha: number; current: number } | null = null;
  const consider = (current: number) => {
    const alpha = temperatureCoefficient(transfer, current);
    if (alpha !== null && (best === null || alpha > best.alpha)) best = { alpha, current };
  };
  for (let k = 0; k < gates.length; k++) {
    const g0 = gates[k];
    consider(k === 0 ? lo : Math.exp(lnAt(a, g0)));
    if (k === gates.length - 1) break;
    const g1 = gates[k + 1];
    const mid = (g0 + g1) / 2;
    const ja = segment(a.g, mid);
    const jb = segment(b.g, mid);
    const slopeA = (a.ln[ja + 1] - a.ln[ja]) / (a.g[ja + 1] - a.g[ja]);
    const slopeB = (b.ln[jb + 1] - b.ln[jb]) / (b.g[jb + 1] - b.g[jb]);
    const q = slopeB / slopeA;
    if (!(q > 0 && q < 1)) continue;
    // ln I_b = ln C + q·ln I on this piece.
    const lnC = lnAt(b, a.g[ja]) - q * a.ln[ja];
    const star = Math.exp((lnC + Math.log(q)) / (1 - q));
    const gStar = gateAt(a, Math.log(star));
    if (gStar > g0 && gStar < g1) consider(star);
  }
  if (gates.length === 1) consider(iPeak);
  return best;
}

/** Stability verdict from S (METHODS.md §12): pass if S ≤ u_max, marginal if S < 1, fail if S ≥ 1. */
export function stabilityVerdict(s: number, utilisationLimit: number): "pass" | "marginal" | "fail" {
  if (s <= utilisationLimit) return "pass";
  if (s < 1) return "marginal";
  return "fail";
}
