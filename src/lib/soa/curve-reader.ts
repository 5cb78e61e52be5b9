// Reading the curves at a voltage and a pulse width (METHODS.md §2 and §3), prepared once per part so that a
// capture's millions of samples each read at their own width cost no allocation and no sort: every curve holds
// ln V, ln I and the log-log slope of each segment, and remembers the segment it read last (consecutive samples
// mostly fall in the same one). Readings are logarithms, so a ratio i/I is a difference.
//
// Along one curve (§2): ln I(V) = ln I_j + s_j·(ln V − ln V_j), s_j = ln(I_(j+1)/I_j)/ln(V_(j+1)/V_j); below the
// first point the first current (flag `below-curve-range`), above the last no value (`above-curve-range`).
// Between widths t_k < t_p < t_(k+1) (§3):
// - "loglog": ln I = ln I_k + (ln t_p − ln t_k)/(ln t_(k+1) − ln t_k)·(ln I_(k+1) − ln I_k), flag `interpolated`;
// - "next-longer": curve k+1, flag `next-longer-curve`;
// - "thermal" (with a Foster network): I = I_k·Z_th(t_k)/Z_th(t_p), flag `thermal-scaled`, and so beyond the
//   longest curve too (k = m); without a network it reads as "next-longer" (or the DC curve beyond the longest)
//   and flags `thermal-scaling-unavailable`.
// Shorter than the shortest curve: the shortest (flag `shorter-than-shortest-curve`); longer than the longest:
// the DC curve (`dc-curve-used`) or no value (`longer-than-longest-curve`). Then (v2) the reading is capped by
// every finite curve of duration ≤ t_p that has a value at V, a DC or longer-than-longest reading by every
// finite curve; where that lowers it (beyond 1e-12 relative, so that rounding alone never flags), flag
// `capped-by-shorter-curve`. Flags of the curves read only for the cap are not raised: they do not make the value.
import type { PreparedCurve, PreparedCurveSet } from "./curve-set";
import { type FosterTerm, zth } from "./foster";
import { type BetweenCurves, FLAGS, type Flag } from "./types";

/** Relative tolerance within which a pulse width matches a digitised curve's width (METHODS.md §3). */
export const WIDTH_TOLERANCE = 1e-9;

/** Bit of each flag in a flag mask (the flag's position in FLAGS). */
export const FLAG_BIT = Object.fromEntries(FLAGS.map((flag, k) => [flag, 1 << k])) as Record<Flag, number>;

/** The flags of a mask, in FLAGS order. */
export function flagsOf(mask: number): Flag[] {
  return FLAGS.filter((_, k) => (mask & (1 << k)) !== 0);
}

// A cap lowers the reading only when below it by more than 1e-12 relative (as a difference of logarithms).
const LN_CAP_TOLERANCE = Math.log1p(-1e-12);

/** One curve in log-log form. */
class LnCurve {
  readonly lnV: Float64Array;
  readonly lnI: Float64Array;
  readonly slope: Float64Array;
  private hint = 0;
  /** Where the last read fell: −1 below the first point, 1 above the last, else 0. */
  side = 0;

  constructor(curve: Pick<PreparedCurve, "points">) {
    const n = curve.points.length;
    this.lnV = new Float64Array(n);
    this.lnI = new Float64Array(n);
    this.slope = new Float64Array(Math.max(n - 1, 0));
    for (let j = 0; j < n; j++) {
      this.lnV[j] = Math.log(curve.points[j][0]);
      this.lnI[j] = Math.log(curve.points[j][1]);
    }
    for (let j = 0; j + 1 < n; j++) {
      this.slope[j] = (this.lnI[j + 1] - this.lnI[j]) / (this.lnV[j + 1] - this.lnV[j]);
    }
  }

  /** ln I at ln V (−∞ reads below the range); NaN above the range or for an empty curve; `side` tells which. */
  read(lnV: number): number {
    const xs = this.lnV;
    const lnI = this.lnI;
    const n = xs.length;
    let j = this.hint;
    // The common case first: the segment the last read fell in.
    if (xs[j] <= lnV && lnV < xs[j + 1]) {
      this.side = 0;
      return lnV === xs[j] ? lnI[j] : lnI[j] + this.slope[j] * (lnV - xs[j]);
    }
    this.side = 0;
    if (n === 0 || Number.isNaN(lnV)) return Number.NaN;
    if (lnV < xs[0]) {
      this.side = -1;
      return lnI[0];
    }
    const last = n - 1;
    if (lnV > xs[last]) {
      this.side = 1;
      return Number.NaN;
    }
    if (lnV === xs[last]) return lnI[last];
    // Largest j with ln V_j ≤ ln V (j < last here).
    let lo = 0;
    let hi = last - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (xs[mid] <= lnV) lo = mid;
      else hi = mid - 1;
    }
    j = lo;
    this.hint = j;
    return lnV === xs[j] ? lnI[j] : lnI[j] + this.slope[j] * (lnV - xs[j]);
  }
}

/** Reads a prepared curve set at (V, t_p) under one policy; `flags` collects the flags of every reading made. */
export class CurveReader {
  /** Flags raised by readings so far (a mask of FLAG_BIT); the caller clears it when it wants. */
  flags = 0;
  private readonly finite: LnCurve[];
  private readonly widths: Float64Array;
  private readonly lnWidths: Float64Array;
  private readonly lnZ: Float64Array | null;
  private readonly dc: LnCurve | null;
  private readonly upper: Float64Array;

  constructor(
    set: PreparedCurveSet,
    private readonly betweenCurves: BetweenCurves = "loglog",
    private readonly network: readonly FosterTerm[] | null = null,
  ) {
    this.finite = set.finite.map((curve) => new LnCurve(curve));
    this.widths = Float64Array.from(set.finite, (curve) => curve.duration);
    this.lnWidths = this.widths.map(Math.log);
    this.upper = this.widths.map((t) => t * (1 + WIDTH_TOLERANCE));
    this.lnZ =
      betweenCurves === "thermal" && network !== null && network.length > 0
        ? this.widths.map((t) => Math.log(zth(network, t)))
        : null;
    this.dc = set.dc === null ? null : new LnCurve(set.dc);
  }

  private onCurve(curve: LnCurve): number {
    const value = curve.read(this.lnV);
    if (curve.side < 0) this.flags |= FLAG_BIT["below-curve-range"];
    else if (curve.side > 0) this.flags |= FLAG_BIT["above-curve-range"];
    return value;
  }

  private lnV = 0;

  /**
   * ln of the allowed current in A (not derated) at voltage e^lnV for a pulse of `width` s (Infinity: unlimited);
   * NaN where the curves give no value. A width that is NaN or ≤ 0 gives NaN and no flag. `lnWidth` may be given
   * when known (ln of `width`).
   */
  readLn(lnV: number, width: number, lnWidth = Math.log(width)): number {
    if (!(width > 0) || Number.isNaN(lnV)) return Number.NaN;
    this.lnV = lnV;
    const m = this.finite.length;
    const widths = this.widths;
    let raw: number;
    let capTo: number; // cap by finite curves 0..capTo−1
    let k = 0;
    while (k < m && this.upper[k] < width) k++;
    if (k < m && Math.abs(width - widths[k]) <= WIDTH_TOLERANCE * widths[k]) {
      raw = this.onCurve(this.finite[k]);
      capTo = k;
    } else if (k === 0 && m > 0) {
      this.flags |= FLAG_BIT["shorter-than-shortest-curve"];
      return this.onCurve(this.finite[0]);
    } else if (k === m) {
      raw = this.beyondLongest(width);
      capTo = m;
    } else {
      raw = this.between(k - 1, width, lnWidth);
      capTo = k;
    }
    if (Number.isNaN(raw)) return raw;
    let cap = Number.POSITIVE_INFINITY;
    for (let c = 0; c < capTo; c++) {
      const value = this.finite[c].read(lnV);
      if (value < cap) cap = value;
    }
    if (cap < raw + LN_CAP_TOLERANCE) {
      this.flags |= FLAG_BIT["capped-by-shorter-curve"];
      return cap;
    }
    return Math.min(raw, cap);
  }

  /** t_k < width < t_(k+1). */
  private between(k: number, width: number, lnWidth: number): number {
    const shorter = this.finite[k];
    const longer = this.finite[k + 1];
    if (this.betweenCurves === "thermal") {
      if (this.lnZ !== null) return this.scaled(k, width);
      this.flags |= FLAG_BIT["thermal-scaling-unavailable"];
    }
    if (this.betweenCurves !== "loglog") {
      this.flags |= FLAG_BIT["next-longer-curve"];
      return this.onCurve(longer);
    }
    this.flags |= FLAG_BIT.interpolated;
    const lnIk = this.onCurve(shorter);
    const lnIk1 = this.onCurve(longer);
    const lnTk = this.lnWidths[k];
    const fraction = (lnWidth - lnTk) / (this.lnWidths[k + 1] - lnTk);
    return lnIk + fraction * (lnIk1 - lnIk);
  }

  /** width beyond the longest finite curve (or no finite curve at all). */
  private beyondLongest(width: number): number {
    const m = this.finite.length;
    if (this.betweenCurves === "thermal" && m > 0) {
      if (this.lnZ !== null) return this.scaled(m - 1, width);
      this.flags |= FLAG_BIT["thermal-scaling-unavailable"];
    }
    if (this.dc === null) {
      this.flags |= FLAG_BIT["longer-than-longest-curve"];
      return Number.NaN;
    }
    this.flags |= FLAG_BIT["dc-curve-used"];
    return this.onCurve(this.dc);
  }

  /** I_k·Z_th(t_k)/Z_th(width) in ln form (METHODS.md §3, v2 "thermal"). */
  private scaled(k: number, width: number): number {
    this.flags |= FLAG_BIT["thermal-scaled"];
    const network = this.network as readonly FosterTerm[];
    return this.onCurve(this.finite[k]) + (this.lnZ as Float64Array)[k] - Math.log(zth(network, width));
  }
}
