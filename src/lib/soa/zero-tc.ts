// Where the two transfer characteristics cross: the zero-temperature-coefficient point (METHODS.md §12). Each curve
// is read linearly in V_GS against ln I_D between its points, as the stability check reads them, so the difference
// ln I_b − ln I_a is piecewise linear in V_GS and its zeros are exact.
import type { PreparedTransfer } from "./stability";

export interface TransferCrossing {
  /** V_GS at the crossing (V). */
  gate: number;
  /** I_D at the crossing (A). */
  current: number;
  /** True where the hotter curve passes from above to below (the usual zero-TC point). */
  falling: boolean;
}

function lnAt(g: Float64Array, ln: Float64Array, x: number): number {
  for (let j = 0; j < g.length - 1; j++) {
    if (x >= g[j] && x <= g[j + 1]) return ln[j] + ((x - g[j]) / (g[j + 1] - g[j])) * (ln[j + 1] - ln[j]);
  }
  return Number.NaN;
}

/**
 * The crossings of the two curves over the gate voltages both cover, ascending in V_GS, and the sign of
 * ln I_b − ln I_a at the ends of that range (+1 hotter above, −1 below, 0 touching); null when they share no range.
 */
export function transferCrossings(
  transfer: PreparedTransfer,
): { crossings: TransferCrossing[]; first: number; last: number } | null {
  const { a, b } = transfer;
  const from = Math.max(a.g[0], b.g[0]);
  const to = Math.min(a.g[a.g.length - 1], b.g[b.g.length - 1]);
  if (!(from < to)) return null;
  const gates = [...new Set([from, to, ...a.g, ...b.g].filter((g) => g >= from && g <= to))].sort(
    (x, y) => x - y,
  );
  const diff = (g: number) => lnAt(b.g, b.ln, g) - lnAt(a.g, a.ln, g);
  const crossings: TransferCrossing[] = [];
  for (let k = 0; k < gates.length - 1; k++) {
    const d0 = diff(gates[k]);
    const d1 = diff(gates[k + 1]);
    if (d0 === 0 && k > 0) continue;
    if (d0 === 0 || d0 * d1 < 0) {
      const gate = d0 === 0 ? gates[k] : gates[k] + (d0 / (d0 - d1)) * (gates[k + 1] - gates[k]);
      crossings.push({ gate, current: Math.exp(lnAt(a.g, a.ln, gate)), falling: d1 < d0 });
    }
  }
  const dLast = diff(to);
  if (dLast === 0 && (crossings.length === 0 || crossings[crossings.length - 1].gate !== to)) {
    crossings.push({
      gate: to,
      current: Math.exp(lnAt(a.g, a.ln, to)),
      falling: diff(gates[gates.length - 2]) > 0,
    });
  }
  return { crossings, first: Math.sign(diff(from)), last: Math.sign(dLast) };
}
