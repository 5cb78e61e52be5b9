// The instability boundary the SOA chart draws for one pulse width (METHODS.md §12): with the loop gain
// S = V·α(I)·Z_th(t), the pulse runs away where S ≥ 1, so the largest drain voltage at current I is
// V_max(I) = 1/(α(I)·Z_th(t)), drawn over the currents where α > 0 (below the zero-temperature-coefficient point).
import { type PreparedTransfer, temperatureCoefficient } from "./stability";

const samplesPerDecade = 48;

/**
 * Points [V_max, I] of the boundary for thermal impedance `z` (K/W) at the width in view, ascending in I, over the
 * cooler curve's currents where α > 0. Empty when z ≤ 0 or no current of the data has α > 0.
 */
export function instabilityBoundary(transfer: PreparedTransfer, z: number): [number, number][] {
  if (!(z > 0)) return [];
  const ln = transfer.a.ln;
  const lo = Math.exp(ln[0]);
  const hi = Math.exp(ln[ln.length - 1]);
  const currents = new Set<number>();
  for (const l of ln) currents.add(Math.exp(l));
  const n = Math.max(1, Math.ceil(Math.log10(hi / lo) * samplesPerDecade));
  for (let j = 0; j <= n; j++) currents.add(lo * (hi / lo) ** (j / n));
  const points: [number, number][] = [];
  for (const current of [...currents].sort((x, y) => x - y)) {
    const alpha = temperatureCoefficient(transfer, current);
    if (alpha !== null && alpha > 0) points.push([1 / (alpha * z), current]);
  }
  return points;
}
