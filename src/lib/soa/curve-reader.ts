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
//
// Long file: the reader's hot loop and the bookkeeping it relies on (remembered segments, flags) belong together.
import type { PreparedCurve, PreparedCurveSet } from "./curve-set";
import { type FosterTerm, zth } from "./foster";
import { type BetweenCurves, FLAGS, type Flag } from "./types";

/** Relative tolerance within which a pulse width matches a digitised curve's width (METHODS.md §3). */
export const WIDTH_TOLERANCE = 1e-9;

/** Bit of each flag in a flag mask (the flag's position in FLAGS). */
export const FLAG_BIT = Object.fromEntries(FLAGS.map((flag, k) => [flag, 1 << k])) as Record<Flag, number>;

// The flag lists made so far, one per mask: a matrix of 50 000 results has a few dozen distinct masks, so results
// share them instead of each allocating its own. Frozen, so that no caller can change another result's flags.
const flagLists = new Map<number, readonly Flag[]>();
const MAX_FLAG_LISTS = 4096;

/** The flags of a mask, in FLAGS order (a shared, frozen array). */
export function flagsOf(mask: number): Flag[] {
  let list = flagLists.get(mask);
  if (list === undefined) {
    list = Object.freeze(FLAGS.filter((_, k) => (mask & (1 << k)) !== 0));
    if (flagLists.size < MAX_FLAG_LISTS) flagLists.set(mask, list);
  }
  return list as Flag[];
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

  /** The first and last digitised voltage (NaN for an empty curve). */
  readonly vFirst: number;
  readonly vLast: number;

  constructor(curve: Pick<PreparedCurve, "points">) {
    const n = curve.points.length;
    this.vFirst = n > 0 ? curve.points[0][0] : Number.NaN;
    this.vLast = n > 0 ? curve.points[n - 1][0] : Number.NaN;
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

/** How a width is read (METHODS.md §3): which curves give the value, and which cap it. */
enum Plan {
  /** Curve k exactly; capped by 0..k−1. */
  Exact,
  /** The shortest curve, unchanged, uncapped. */
  Shorter,
  /** Log-log between curves k and k+1; capped by 0..k. */
  LogLog,
  /** Curve k+1; capped by 0..k. */
  Longer,
  /** Curve k scaled by Z_th(t_k)/Z_th(t); capped by 0..k. */
  Scaled,
  /** The DC curve; capped by every finite curve. */
  Dc,
  /** No value. */
  None,
}

/**
 * Reads a prepared curve set at (V, t_p) under one policy; `flags` collects the flags of every reading made. A
 * reading is two steps: `classify` (which curves, which flags, whether there is a value: comparisons only) and
 * `evaluate` (the value, in logarithms), so that a caller can classify every sample and evaluate only those that
 * matter; `readLn` does both.
 */
export class CurveReader {
  /** Flags raised by readings so far (a mask of FLAG_BIT); the caller clears it when it wants. */
  flags = 0;
  private readonly finite: LnCurve[];
  private readonly widths: Float64Array;
  private readonly lnWidths: Float64Array;
  private readonly lnZ: Float64Array | null;
  private readonly dc: LnCurve | null;
  private readonly upper: Float64Array;
  private plan = Plan.None;
  private k = 0;

  constructor(
    set: PreparedCurveSet,
    readonly betweenCurves: BetweenCurves = "loglog",
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

  /** Flags for reading `curve` at v: below or above its range; false above it (no value there). */
  private side(curve: LnCurve, v: number): boolean {
    if (v < curve.vFirst) {
      this.flags |= FLAG_BIT["below-curve-range"];
      return true;
    }
    if (v > curve.vLast) {
      this.flags |= FLAG_BIT["above-curve-range"];
      return false;
    }
    return !Number.isNaN(curve.vLast);
  }

  /**
   * Step one: which curves a reading at voltage v (V) and `width` (s; Infinity: unlimited) uses, with its flags
   * (all but `capped-by-shorter-curve`, which needs the values). False when the reading has no value; a width
   * that is NaN or ≤ 0, or a NaN voltage, has none and raises no flag.
   */
  classify(v: number, width: number): boolean {
    this.plan = Plan.None;
    if (!(width > 0) || Number.isNaN(v)) return false;
    const m = this.finite.length;
    const widths = this.widths;
    let k = 0;
    while (k < m && this.upper[k] < width) k++;
    const thermal = this.betweenCurves === "thermal";
    if (k < m && Math.abs(width - widths[k]) <= WIDTH_TOLERANCE * widths[k]) {
      this.plan = Plan.Exact;
      this.k = k;
      return this.side(this.finite[k], v);
    }
    if (k === 0 && m > 0) {
      this.flags |= FLAG_BIT["shorter-than-shortest-curve"];
      this.plan = Plan.Shorter;
      this.k = 0;
      return this.side(this.finite[0], v);
    }
    if (k < m) {
      this.k = k - 1;
      if (thermal && this.lnZ !== null) {
        this.flags |= FLAG_BIT["thermal-scaled"];
        this.plan = Plan.Scaled;
        return this.side(this.finite[k - 1], v);
      }
      if (thermal) this.flags |= FLAG_BIT["thermal-scaling-unavailable"];
      if (this.betweenCurves !== "loglog") {
        this.flags |= FLAG_BIT["next-longer-curve"];
        this.plan = Plan.Longer;
        return this.side(this.finite[k], v);
      }
      this.flags |= FLAG_BIT.interpolated;
      this.plan = Plan.LogLog;
      const shorter = this.side(this.finite[k - 1], v);
      const longer = this.side(this.finite[k], v);
      return shorter && longer;
    }
    // Beyond the longest finite curve (or no finite curve at all).
    if (thermal && m > 0) {
      if (this.lnZ !== null) {
        this.flags |= FLAG_BIT["thermal-scaled"];
        this.plan = Plan.Scaled;
        this.k = m - 1;
        return this.side(this.finite[m - 1], v);
      }
      this.flags |= FLAG_BIT["thermal-scaling-unavailable"];
    }
    if (this.dc === null) {
      this.flags |= FLAG_BIT["longer-than-longest-curve"];
      return false;
    }
    this.flags |= FLAG_BIT["dc-curve-used"];
    this.plan = Plan.Dc;
    return this.side(this.dc, v);
  }

  /**
   * Step two, after a `classify` that answered true with the same voltage and width: ln of the allowed current in
   * A (not derated), capped by the shorter curves (flag `capped-by-shorter-curve` where that lowers it). lnV and
   * lnWidth are the logarithms of the voltage and width classified (lnV −∞ for v ≤ 0).
   */
  evaluate(lnV: number, width: number, lnWidth: number): number {
    const k = this.k;
    const finite = this.finite;
    let raw: number;
    let capTo = k + 1;
    switch (this.plan) {
      case Plan.Exact:
        raw = finite[k].read(lnV);
        capTo = k;
        break;
      case Plan.Shorter:
        return finite[0].read(lnV);
      case Plan.LogLog: {
        const lnIk = finite[k].read(lnV);
        const lnIk1 = finite[k + 1].read(lnV);
        const lnTk = this.lnWidths[k];
        raw = lnIk + ((lnWidth - lnTk) / (this.lnWidths[k + 1] - lnTk)) * (lnIk1 - lnIk);
        break;
      }
      case Plan.Longer:
        raw = finite[k + 1].read(lnV);
        break;
      case Plan.Scaled: {
        const network = this.network as readonly FosterTerm[];
        raw = finite[k].read(lnV) + (this.lnZ as Float64Array)[k] - Math.log(zth(network, width));
        break;
      }
      case Plan.Dc:
        raw = (this.dc as LnCurve).read(lnV);
        capTo = finite.length;
        break;
      default:
        return Number.NaN;
    }
    let cap = Number.POSITIVE_INFINITY;
    for (let c = 0; c < capTo; c++) {
      const value = finite[c].read(lnV);
      if (value < cap) cap = value;
    }
    if (cap < raw + LN_CAP_TOLERANCE) {
      this.flags |= FLAG_BIT["capped-by-shorter-curve"];
      return cap;
    }
    return Math.min(raw, cap);
  }

  /**
   * ln of the allowed current in A (not derated) at voltage v for a pulse of `width` s (Infinity: unlimited); NaN
   * where the curves give no value. `classify`, then `evaluate`.
   */
  read(v: number, width: number): number {
    if (!this.classify(v, width)) return Number.NaN;
    return this.evaluate(v > 0 ? Math.log(v) : Number.NEGATIVE_INFINITY, width, Math.log(width));
  }

  /** Every digitised voltage of the set, ascending, without repeats. */
  voltages(): number[] {
    const curves = [...this.finite, ...(this.dc === null ? [] : [this.dc])];
    return [...new Set(curves.flatMap((c) => [...c.lnV].map(Math.exp)))].sort((x, y) => x - y);
  }

  /**
   * True when no reading can ever be lowered by the cap: every finite curve lies at or below every shorter one,
   * and the DC curve below all, wherever both have a value (checked at every digitised voltage, where their
   * log-log difference, linear in between, is largest). Readings of such a set never rise with width, except under
   * the thermal policy.
   */
  ordered(): boolean {
    const curves = [...this.finite, ...(this.dc === null ? [] : [this.dc])];
    const voltages = [...new Set(curves.flatMap((c) => [...c.lnV]))];
    for (let longer = 1; longer < curves.length; longer++) {
      for (let shorter = 0; shorter < longer; shorter++) {
        for (const lnV of voltages) {
          const a = curves[shorter].read(lnV);
          const b = curves[longer].read(lnV);
          if (a < b + LN_CAP_TOLERANCE) return false;
        }
      }
    }
    return true;
  }
}
