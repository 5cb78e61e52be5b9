// Fitting a Foster network to measured or datasheet thermal impedance points Z_th(t) (PRODUCT.md, library: the
// thermal model uploaded as a Z_th(t) CSV). The model is METHODS.md §4, Z_th(t) = Σ R_i·(1 − e^(−t/τ_i)), with
// every R_i and τ_i > 0. Method:
// 1. non-negative least squares (Lawson and Hanson, "Solving Least Squares Problems", 1974, ch. 23) for R_j on a
//    grid of τ_j, 8 per decade from t_min/10 to 10·t_max; the error is relative (each row divided by Z_k), because
//    Z_th spans decades and every decade matters;
// 2. adjacent grid terms that NNLS keeps are merged into one (R summed, τ the R-weighted geometric mean), then the
//    adjacent pair whose merge costs least is merged until one term more than wanted remains;
// 3. from each way of merging the last pair, R is solved again and refined by Levenberg–Marquardt (Marquardt,
//    SIAM J. Appl. Math. 11, 1963) on ln R_i and ln τ_i, which keeps both positive without constraints; τ stays
//    inside the grid's span, beyond which the data cannot tell R from τ. The best refinement is returned.
// Decisions: at least 4 points, t strictly increasing, t and Z finite and > 0; at most 3–6 terms (default 4) and
// never more than half the number of points (each term has two parameters). The result may have fewer terms when
// the data holds fewer time constants. Cost: O(grid² · points) for NNLS, small for the rest.
//
// Long file: one numerical method (NNLS, merging, refinement) whose steps share their working arrays.
import { type FosterTerm, zth } from "./foster";

/** One point of a thermal impedance curve: t in s, Z_th in K/W. */
export type ZthPoint = readonly [t: number, z: number];

export interface FosterFitOptions {
  /** Largest number of terms, a whole number from 3 to 6 (default 4). */
  maxTerms?: number;
}

export type FosterFit =
  | {
      ok: true;
      /** Terms sorted by τ, shortest first. */
      terms: FosterTerm[];
      /** Root mean square of (Z_fit − Z)/Z over the points. */
      rmsRelativeError: number;
      /** Largest |Z_fit − Z|/Z over the points. */
      maxRelativeError: number;
    }
  | { ok: false; reason: string };

const GRID_PER_DECADE = 8;
const GRID_MARGIN = 10;
const LM_ITERATIONS = 200;

function invalidInput(points: readonly ZthPoint[], maxTerms: number): string | null {
  if (!(Number.isInteger(maxTerms) && maxTerms >= 3 && maxTerms <= 6)) {
    return `maxTerms must be a whole number from 3 to 6, got ${maxTerms}`;
  }
  if (points.length < 4) return `at least 4 points are needed, got ${points.length}`;
  for (let k = 0; k < points.length; k++) {
    const [t, z] = points[k];
    if (!(Number.isFinite(t) && t > 0))
      return `point ${k + 1}: t must be finite and greater than 0, got ${t}`;
    if (!(Number.isFinite(z) && z > 0))
      return `point ${k + 1}: Z_th must be finite and greater than 0, got ${z}`;
    if (k > 0 && !(t > points[k - 1][0])) {
      return `point ${k + 1}: t must increase from one point to the next (${t} s follows ${points[k - 1][0]} s)`;
    }
  }
  return null;
}

/** Sum of squared relative residuals (Z_fit/Z − 1)². */
function costOf(terms: readonly FosterTerm[], points: readonly ZthPoint[]): number {
  let sum = 0;
  for (const [t, z] of points) sum += (zth(terms, t) / z - 1) ** 2;
  return sum;
}

// ---- Linear algebra --------------------------------------------------------------------------------------------

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/**
 * Least squares min ‖A x − b‖ by Householder QR, A given as columns. A column that turns out dependent on the
 * ones before it (a pivot below 1e-13 of the largest) gets x = 0.
 */
function leastSquares(columns: readonly Float64Array[], b: Float64Array): Float64Array {
  const m = b.length;
  const k = columns.length;
  const a = columns.map((c) => Float64Array.from(c));
  const y = Float64Array.from(b);
  const pivot = new Float64Array(k);
  for (let j = 0; j < k && j < m; j++) {
    const v = a[j];
    let norm = 0;
    for (let i = j; i < m; i++) norm = Math.hypot(norm, v[i]);
    if (norm === 0) continue;
    const alpha = v[j] > 0 ? -norm : norm;
    v[j] -= alpha;
    let vv = 0;
    for (let i = j; i < m; i++) vv += v[i] * v[i];
    const reflect = (target: Float64Array) => {
      let s = 0;
      for (let i = j; i < m; i++) s += v[i] * target[i];
      const f = (2 * s) / vv;
      for (let i = j; i < m; i++) target[i] -= f * v[i];
    };
    for (let l = j + 1; l < k; l++) reflect(a[l]);
    reflect(y);
    pivot[j] = alpha;
  }
  const x = new Float64Array(k);
  const largest = Math.max(...Array.from(pivot, Math.abs));
  for (let j = Math.min(k, m) - 1; j >= 0; j--) {
    if (Math.abs(pivot[j]) <= 1e-13 * largest) continue;
    let s = y[j];
    for (let l = j + 1; l < k; l++) s -= a[l][j] * x[l];
    x[j] = s / pivot[j];
  }
  return x;
}

function residual(columns: readonly Float64Array[], x: Float64Array, b: Float64Array): Float64Array {
  const r = Float64Array.from(b);
  columns.forEach((col, j) => {
    if (x[j] !== 0) for (let i = 0; i < r.length; i++) r[i] -= x[j] * col[i];
  });
  return r;
}

/** Moves x toward the unconstrained solution on the passive set until no passive x_j is ≤ 0 (inner loop). */
function nnlsInner(
  columns: readonly Float64Array[],
  b: Float64Array,
  x: Float64Array,
  passive: boolean[],
  tolerance: number,
) {
  for (let inner = 0; inner < 3 * columns.length; inner++) {
    const set = passive.flatMap((p, j) => (p ? [j] : []));
    const solved = leastSquares(
      set.map((j) => columns[j]),
      b,
    );
    if (solved.every((s) => s > 0)) {
      set.forEach((j, q) => {
        x[j] = solved[q];
      });
      return;
    }
    let alpha = 1;
    set.forEach((j, q) => {
      if (solved[q] <= 0) alpha = Math.min(alpha, x[j] / (x[j] - solved[q]));
    });
    set.forEach((j, q) => {
      x[j] += alpha * (solved[q] - x[j]);
      if (x[j] <= tolerance) {
        x[j] = 0;
        passive[j] = false;
      }
    });
  }
}

/** Lawson–Hanson NNLS: min ‖A x − b‖ subject to x ≥ 0, A given as columns of unit norm. */
function nnls(columns: readonly Float64Array[], b: Float64Array): Float64Array {
  const n = columns.length;
  const x = new Float64Array(n);
  const passive = new Array<boolean>(n).fill(false);
  const tolerance = 10 * Number.EPSILON * Math.sqrt(b.length) * Math.max(b.length, n);
  for (let outer = 0; outer < 3 * n; outer++) {
    const r = residual(columns, x, b);
    let best = -1;
    let bestW = tolerance;
    for (let j = 0; j < n; j++) {
      const w = passive[j] ? 0 : dot(columns[j], r);
      if (w > bestW) [best, bestW] = [j, w];
    }
    if (best < 0) break;
    passive[best] = true;
    nnlsInner(columns, b, x, passive, tolerance);
  }
  return x;
}

/** Solves the small dense system M x = v by Gaussian elimination with partial pivoting; null when singular. */
function solveDense(matrix: readonly Float64Array[], v: Float64Array): Float64Array | null {
  const n = v.length;
  const a = matrix.map((row, i) => Float64Array.of(...row, v[i]));
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    if (a[p][c] === 0) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let r = c + 1; r < n; r++) {
      const f = a[r][c] / a[c][c];
      for (let q = c; q <= n; q++) a[r][q] -= f * a[c][q];
    }
  }
  const x = new Float64Array(n);
  for (let r = n - 1; r >= 0; r--) {
    let s = a[r][n];
    for (let q = r + 1; q < n; q++) s -= a[r][q] * x[q];
    x[r] = s / a[r][r];
  }
  return x;
}

// ---- Foster-specific steps -------------------------------------------------------------------------------------

/** Columns (1 − e^(−t_k/τ))/Z_k, normalised, with their norms. */
function basis(taus: readonly number[], points: readonly ZthPoint[]) {
  return taus.map((tau) => {
    const col = Float64Array.from(points, ([t, z]) => -Math.expm1(-t / tau) / z);
    const norm = Math.sqrt(dot(col, col));
    for (let i = 0; i < col.length; i++) col[i] /= norm;
    return { col, norm };
  });
}

/** Non-negative R for fixed τ values; terms whose R is 0 are left out. */
function solveResistances(taus: readonly number[], points: readonly ZthPoint[]): FosterTerm[] {
  const cols = basis(taus, points);
  const x = nnls(
    cols.map((c) => c.col),
    new Float64Array(points.length).fill(1),
  );
  return taus.flatMap((tau, j) => (x[j] > 0 ? [{ r: x[j] / cols[j].norm, tau }] : []));
}

function logGrid(lo: number, hi: number): number[] {
  const steps = Math.max(1, Math.ceil(GRID_PER_DECADE * Math.log10(hi / lo)));
  return Array.from({ length: steps + 1 }, (_, k) => lo * (hi / lo) ** (k / steps));
}

function merge(a: FosterTerm, b: FosterTerm): FosterTerm {
  const r = a.r + b.r;
  return { r, tau: Math.exp((a.r * Math.log(a.tau) + b.r * Math.log(b.tau)) / r) };
}

/** `terms` with the adjacent pair j, j + 1 merged into one. */
function mergeAt(terms: readonly FosterTerm[], j: number): FosterTerm[] {
  return [...terms.slice(0, j), merge(terms[j], terms[j + 1]), ...terms.slice(j + 2)];
}

/** Runs of consecutive grid terms merged into one term each. */
function mergeRuns(grid: readonly number[], terms: readonly FosterTerm[]): FosterTerm[] {
  const runs: FosterTerm[] = [];
  let previous = -2;
  for (const term of terms) {
    const index = grid.indexOf(term.tau);
    runs.push(index === previous + 1 && runs.length > 0 ? merge(runs.pop() as FosterTerm, term) : term);
    previous = index;
  }
  return runs;
}

/** Merges adjacent terms (sorted by τ), cheapest first, until at most `count` remain. */
function reduce(terms: FosterTerm[], count: number, points: readonly ZthPoint[]): FosterTerm[] {
  let current = terms;
  while (current.length > count) {
    const candidates = current.slice(1).map((_, j) => mergeAt(current, j));
    const costs = candidates.map((candidate) => costOf(candidate, points));
    current = candidates[costs.indexOf(Math.min(...costs))];
  }
  return current;
}

// ---- Levenberg–Marquardt in log parameters ---------------------------------------------------------------------

function toTerms(p: Float64Array): FosterTerm[] {
  const k = p.length / 2;
  return Array.from({ length: k }, (_, i) => ({ r: Math.exp(p[i]), tau: Math.exp(p[k + i]) }));
}

/** Normal equations JᵀJ and −Jᵀr of the relative residuals in (ln R, ln τ). */
function normalEquations(p: Float64Array, points: readonly ZthPoint[]) {
  const n = p.length;
  const k = n / 2;
  const jtj = Array.from({ length: n }, () => new Float64Array(n));
  const g = new Float64Array(n);
  const row = new Float64Array(n);
  const terms = toTerms(p);
  for (const [t, z] of points) {
    const r = zth(terms, t) / z - 1;
    terms.forEach(({ r: ri, tau }, i) => {
      const x = t / tau;
      row[i] = (-ri * Math.expm1(-x)) / z;
      row[k + i] = (-ri * x * Math.exp(-x)) / z;
    });
    for (let a = 0; a < n; a++) {
      g[a] -= row[a] * r;
      for (let b = 0; b < n; b++) jtj[a][b] += row[a] * row[b];
    }
  }
  return { jtj, g };
}

/** Levenberg–Marquardt with Marquardt's diagonal scaling; steps of at most e^±3, τ kept within `tauRange`. */
function levenbergMarquardt(
  start: readonly FosterTerm[],
  points: readonly ZthPoint[],
  tauRange: [number, number],
) {
  const k = start.length;
  let p = Float64Array.from([...start.map((s) => Math.log(s.r)), ...start.map((s) => Math.log(s.tau))]);
  let cost = costOf(start, points);
  let lambda = 1e-3;
  const [lo, hi] = tauRange.map(Math.log);
  for (let iteration = 0; iteration < LM_ITERATIONS && lambda < 1e12; iteration++) {
    const { jtj, g } = normalEquations(p, points);
    const largest = Math.max(...jtj.map((row, a) => row[a]));
    const damped = jtj.map((row, a) =>
      row.map((value, b) => (a === b ? value + lambda * (value + 1e-12 * largest) : value)),
    );
    const step = solveDense(damped, g);
    if (step === null) break;
    const trial = p.map((value, a) => {
      const moved = value + Math.max(-3, Math.min(3, step[a]));
      return a >= k ? Math.max(lo, Math.min(hi, moved)) : moved;
    });
    const trialCost = costOf(toTerms(trial), points);
    if (trialCost < cost) {
      const gain = cost - trialCost;
      [p, cost] = [trial, trialCost];
      lambda = Math.max(lambda / 3, 1e-12);
      if (gain <= 1e-14 * cost + 1e-30) break;
    } else lambda *= 4;
  }
  return toTerms(p);
}

/**
 * The best refinement started from each way of merging one adjacent pair of `terms` (or from `terms` themselves
 * when there are few enough): the last merge decides which time constants the data must share, and the merge that
 * is cheapest before refinement is not always the best after it.
 */
function refine(terms: FosterTerm[], count: number, points: readonly ZthPoint[], tauRange: [number, number]) {
  const starts = terms.length <= count ? [terms] : terms.slice(1).map((_, j) => mergeAt(terms, j));
  let best: FosterTerm[] = [];
  let bestCost = Number.POSITIVE_INFINITY;
  for (const start of starts) {
    const resistances = solveResistances(
      start.map((term) => term.tau),
      points,
    );
    const candidate = levenbergMarquardt(resistances, points, tauRange);
    const cost = costOf(candidate, points);
    if (cost < bestCost) [best, bestCost] = [candidate, cost];
  }
  return best.sort((a, b) => a.tau - b.tau);
}

/** Fits a Foster network of at most `maxTerms` positive terms to Z_th(t) points (see the header). */
export function fitFoster(points: readonly ZthPoint[], options: FosterFitOptions = {}): FosterFit {
  const maxTerms = options.maxTerms ?? 4;
  const invalid = invalidInput(points, maxTerms);
  if (invalid !== null) return { ok: false, reason: invalid };
  const count = Math.min(maxTerms, Math.floor(points.length / 2));
  const tauRange: [number, number] = [points[0][0] / GRID_MARGIN, points[points.length - 1][0] * GRID_MARGIN];
  const grid = logGrid(...tauRange);
  const runs = mergeRuns(grid, solveResistances(grid, points));
  const terms = refine(reduce(runs, count + 1, points), count, points, tauRange);
  let sum = 0;
  let max = 0;
  for (const [t, z] of points) {
    const e = Math.abs(zth(terms, t) / z - 1);
    sum += e * e;
    max = Math.max(max, e);
  }
  return { ok: true, terms, rmsRelativeError: Math.sqrt(sum / points.length), maxRelativeError: max };
}
