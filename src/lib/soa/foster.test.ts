import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { expectRelative, expectToShownDigits, fosterNetwork, ONE_TERM, TWO_TERMS } from "@/test/foster-data";
import { Solver } from "@/test/odex";
import { type FosterTerm, rth, zth } from "./foster";

const network = fosterNetwork();

describe("zth", () => {
  // Worked values, METHODS.md §10, derived from the Foster formula.
  it("one term reaches 0.632121, 0.950213 and 0.993262 of R at t = τ, 3τ and 5τ", () => {
    expectRelative(zth(ONE_TERM, 1), 0.632121, 1e-6);
    expectRelative(zth(ONE_TERM, 3), 0.950213, 1e-6);
    expectRelative(zth(ONE_TERM, 5), 0.993262, 1e-6);
  });

  // Worked values, METHODS.md §10, derived from the Foster formula. The table rounds to six decimals, which is
  // up to 4e-6 relative for these two, so they are held to the digits shown.
  it("two terms (0.1 K/W, 1 ms; 0.4 K/W, 100 ms) give 0.067192 K/W at 1 ms and 0.138060 K/W at 10 ms", () => {
    expectToShownDigits(zth(TWO_TERMS, 1e-3), "0.067192");
    expectToShownDigits(zth(TWO_TERMS, 10e-3), "0.138060");
  });

  // Worked value, METHODS.md §10, derived from the Foster formula (to the digits shown).
  it("500 W for 10 ms on the two-term network from 25 °C gives Tj = 94.03 °C", () => {
    expectToShownDigits(25 + 500 * zth(TWO_TERMS, 10e-3), "94.03");
  });

  // Derived: Taylor series 1 − e^(−x) = x − x²/2 + x³/6 − …
  // Derived from §4: use expm1 so that tiny x keeps full precision.
  it("keeps full relative precision for t ≪ τ", () => {
    const x = 1e-12;
    expectRelative(zth(ONE_TERM, x), x - x ** 2 / 2 + x ** 3 / 6, 1e-15);
  });

  // Derived from §4: Z_th(0) = 0 and an empty sum is 0; our choice: t < 0 is 0.
  it("is 0 for t ≤ 0 and for an empty network", () => {
    expect(zth(TWO_TERMS, 0)).toBe(0);
    expect(zth(TWO_TERMS, -1)).toBe(0);
    expect(zth([], 1)).toBe(0);
  });

  // Derived from §4: Z_th → R_th = Σ R_i as t → ∞.
  it("reaches R_th at t = Infinity and propagates NaN", () => {
    expect(zth(TWO_TERMS, Number.POSITIVE_INFINITY)).toBe(0.5);
    expect(zth(TWO_TERMS, Number.NaN)).toBeNaN();
  });

  // Derived from §4: each term R(1 − e^(−t/τ)) has a positive first and a negative second derivative.
  it("is increasing, concave and below R_th for positive terms", () => {
    fc.assert(
      fc.property(network, fc.double({ min: 1e-7, max: 1, noNaN: true }), (net, t) => {
        const [z0, z1, z2] = [zth(net, t), zth(net, 1.5 * t), zth(net, 2 * t)];
        expect(z1).toBeGreaterThanOrEqual(z0);
        expect(z1 - z0).toBeGreaterThanOrEqual((z2 - z1) * (1 - 1e-9) - 1e-15 * rth(net));
        expect(z2).toBeLessThanOrEqual(rth(net) * (1 + 1e-12));
      }),
    );
  });

  // Reference: general-purpose ODE integrator from npm (odex: Hairer and Wanner's ODEX extrapolation method)
  // integrating dθ_i/dt = (R_i·P − θ_i)/τ_i for a 1 W step. At these tolerances it agrees to about 1e-13;
  // asserted to 1e-11.
  it("matches an ODE integration of the Foster network for a power step", () => {
    const net: FosterTerm[] = [
      { r: 0.05, tau: 2e-4 },
      { r: 0.1, tau: 1e-3 },
      { r: 0.4, tau: 0.1 },
    ];
    for (const t of [1e-4, 1e-3, 10e-3, 0.3]) {
      const solver = new Solver(net.length);
      solver.relativeTolerance = 1e-13;
      solver.absoluteTolerance = 1e-15;
      solver.maxSteps = 100_000;
      const derivative = (_: number, y: number[]) => net.map(({ r, tau }, i) => (r - y[i]) / tau);
      const { y } = solver.solve(derivative, 0, [0, 0, 0], t);
      expectRelative(zth(net, t), y[0] + y[1] + y[2], 1e-11);
    }
  });
});

describe("rth", () => {
  // Derived from §4: R_th = Σ_i R_i.
  it("is the sum of the term resistances, 0 for an empty network", () => {
    expect(rth(TWO_TERMS)).toBeCloseTo(0.5, 15);
    expect(rth([])).toBe(0);
  });
});
