// Foster network (junction to case): thermal impedance and resistance.
//
//   Z_th(t) = Σ_i R_i · (1 − e^(−t/τ_i)),   R_th = Σ_i R_i
//
// Z_th is the rise per watt of a power step applied at t = 0 from equilibrium (JEDEC JESD24-3 definition of the
// transient thermal impedance; METHODS.md §4 for the Foster form). Each term is evaluated as −R_i·expm1(−t/τ_i)
// so that t ≪ τ_i keeps full relative precision instead of cancelling in 1 − e^(−t/τ_i).
//
// Terms are taken as validated by the check contract (R_i and τ_i finite, τ_i > 0). A Foster network is
// junction-to-case only and must not be chained with heatsink stages (that needs a Cauer network).

/** One Foster term: R in K/W, τ in s. */
export interface FosterTerm {
  r: number;
  tau: number;
}

/** Z_th(t) in K/W. t ≤ 0 → 0 (nothing has happened yet); t = Infinity → R_th; NaN → NaN. */
export function zth(network: readonly FosterTerm[], t: number): number {
  if (t <= 0) return 0;
  let z = 0;
  for (const { r, tau } of network) z -= r * Math.expm1(-t / tau);
  return z;
}

/** R_th = Σ R_i in K/W (the steady-state limit of Z_th). Empty network → 0. */
export function rth(network: readonly FosterTerm[]): number {
  let sum = 0;
  for (const { r } of network) sum += r;
  return sum;
}
