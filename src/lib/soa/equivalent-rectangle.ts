// Equivalent rectangles for reading non-rectangular pulses on the SOA curves (METHODS.md §6): equal energy at
// peak power. For any pulse with 0 ≤ p ≤ p_peak from equilibrium and any Foster network with positive terms
// (Z_th concave in t) the true peak rise never exceeds p_peak·Z_th(E/p_peak) (derived), so the rule is
// conservative. Reduced-amplitude variants (0.7·P for 0.7·t and the like) are not, and are not offered.

export interface EquivalentRectangle {
  /** Width of the rectangle in s. */
  duration: number;
  /** Energy of the pulse in J. */
  energy: number;
  /** Peak power in W. */
  peakPower: number;
}

/**
 * A triangle of peak current `iPeak` at constant `v` over `width`: energy V·I_pk·t_p/2, so the equal-energy
 * rectangle at peak power lasts t_p/2. Any input NaN gives NaN figures.
 */
export function triangleEquivalent(v: number, iPeak: number, width: number): EquivalentRectangle {
  const peakPower = v * iPeak;
  return { duration: width / 2, energy: (peakPower * width) / 2, peakPower };
}

export interface WaveformRectangle extends EquivalentRectangle {
  ok: true;
  /** Sample of peak power (first one if several are equal). */
  peakIndex: number;
}

export type WaveformEquivalent = WaveformRectangle | { ok: false; flag: "no-power" };

/**
 * Equal-energy rectangle of a record with times `t` (strictly increasing) and power samples `p` (METHODS.md §6,
 * v2): power taken as max(p, 0); peak at the first sample of maximum power; E by the trapezoid rule (compensated
 * sum) over the whole record; duration t_eq = E/p_peak. No sample, or a peak power that is not > 0 (NaN
 * included): `no-power`.
 */
export function waveformEquivalent(t: ArrayLike<number>, p: ArrayLike<number>): WaveformEquivalent {
  const n = Math.min(t.length, p.length);
  let peakIndex = -1;
  let peakPower = Number.NEGATIVE_INFINITY;
  for (let k = 0; k < n; k++) {
    if (p[k] > peakPower) {
      peakPower = p[k];
      peakIndex = k;
    }
  }
  if (!(peakPower > 0)) return { ok: false, flag: "no-power" };
  const energy = recordEnergy(t, p, undefined, n);
  return { ok: true, duration: energy / peakPower, energy, peakPower, peakIndex };
}

/**
 * Trapezoid integral of p_k = max(a_k·b_k, 0) over the first n samples at times t (b omitted: p_k = max(a_k, 0)),
 * Neumaier-compensated: captures run to 10^7 samples.
 */
export function recordEnergy(
  t: ArrayLike<number>,
  a: ArrayLike<number>,
  b?: ArrayLike<number>,
  n = t.length,
): number {
  const factor = b ?? ONE;
  const stride = b === undefined ? 0 : 1;
  let sum = 0;
  let compensation = 0;
  let previous = Math.max(a[0] * factor[0], 0);
  for (let k = 1; k < n; k++) {
    const current = Math.max(a[k] * factor[k * stride], 0);
    const term = ((previous + current) / 2) * (t[k] - t[k - 1]);
    const next = sum + term;
    compensation += Math.abs(sum) >= Math.abs(term) ? sum - next + term : term - next + sum;
    sum = next;
    previous = current;
  }
  return n > 0 ? sum + compensation : 0;
}

const ONE = Float64Array.of(1);
