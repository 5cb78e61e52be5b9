// Equivalent rectangles for reading non-rectangular pulses on the SOA curves (METHODS.md §6): equal energy at
// peak power. For any pulse with 0 ≤ p ≤ p_peak from equilibrium and any Foster network with positive terms
// (Z_th concave in t) the true peak rise never exceeds p_peak·Z_th(E/p_peak) (derived), so the rule is
// conservative. Reduced-amplitude variants (0.7·P for 0.7·t and the like) are not, and are not offered.

export interface EquivalentRectangle {
  /** Width of the rectangle in s. */
  duration: number;
  /** Energy of the pulse (or of the window around its peak) in J. */
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

/** Share of the peak power that bounds the window around a capture's peak (METHODS.md §6). */
export const WINDOW_THRESHOLD = 0.05;

export interface WaveformRectangle extends EquivalentRectangle {
  ok: true;
  /** Sample of peak power (first one if several are equal). */
  peakIndex: number;
  /** First and last sample of the window where p ≥ 5 % of the peak, contiguous around the peak. */
  window: [first: number, last: number];
}

export type WaveformEquivalent = WaveformRectangle | { ok: false; flag: "pulse-too-short" | "no-power" };

/**
 * Equal-energy rectangle of a capture with times `t` (strictly increasing) and power samples `p`: peak p at
 * the first sample of maximum power; E by the trapezoid rule (compensated sum) over the contiguous window
 * where p ≥ 5 % of the peak; duration E/p_peak. Fewer than one sample, or a peak power that is not > 0 (NaN
 * included): `no-power`. A window of a single sample has no width: `pulse-too-short`.
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
  const threshold = WINDOW_THRESHOLD * peakPower;
  let first = peakIndex;
  while (first > 0 && p[first - 1] >= threshold) first--;
  let last = peakIndex;
  while (last < n - 1 && p[last + 1] >= threshold) last++;
  if (first === last) return { ok: false, flag: "pulse-too-short" };
  // Neumaier-compensated trapezoid sum: captures run to 10^5–10^6 samples.
  let sum = 0;
  let compensation = 0;
  for (let k = first; k < last; k++) {
    const term = ((p[k] + p[k + 1]) / 2) * (t[k + 1] - t[k]);
    const next = sum + term;
    compensation += Math.abs(sum) >= Math.abs(term) ? sum - next + term : term - next + sum;
    sum = next;
  }
  const energy = sum + compensation;
  return { ok: true, duration: energy / peakPower, energy, peakPower, peakIndex, window: [first, last] };
}
