import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { expectRelative, expectToShownDigits, fosterNetwork, ONE_TERM, TWO_TERMS } from "@/test/foster-data";
import { Solver } from "@/test/odex";
import { type FosterTerm, rth, zth } from "./foster";
import { rectRise, trainRise } from "./thermal-rect";

/** Term states after integrating dθ_i/dt = (R_i·P − θ_i)/τ_i at constant power from `from` to `to`. */
function integrate(net: readonly FosterTerm[], power: number, from: number, to: number, start: number[]) {
  const solver = new Solver(net.length);
  solver.relativeTolerance = 1e-13;
  solver.absoluteTolerance = 1e-15;
  solver.maxSteps = 100_000;
  const derivative = (_: number, y: number[]) => net.map(({ r, tau }, i) => (r * power - y[i]) / tau);
  return solver.solve(derivative, from, start, to).y;
}

/** Rise at the end of the `count`-th pulse, integrating pulse by pulse (each piece restarts at its edge). */
function integrateTrain(net: FosterTerm[], power: number, width: number, period: number, count: number) {
  let state = net.map(() => 0);
  for (let k = 0; k < count; k++) {
    state = integrate(net, power, k * period, k * period + width, state);
    if (k < count - 1) state = integrate(net, 0, k * period + width, (k + 1) * period, state);
  }
  return state.reduce((sum, theta) => sum + theta, 0);
}

const network = fosterNetwork();

describe("rectRise", () => {
  // Worked value, METHODS.md §10, derived from the Foster formula (to the digits shown).
  it("500 W for 10 ms on the two-term network from 25 °C gives Tj = 94.03 °C", () => {
    expectToShownDigits(25 + rectRise(TWO_TERMS, 500, 10e-3), "94.03");
  });

  // Derived: the Z_th definition is the rise per watt of a step (JEDEC JESD24-3).
  it("is P·Z_th(t_p)", () => {
    for (const width of [1e-9, 1e-4, 3e-3, 1, 100]) {
      expectRelative(rectRise(TWO_TERMS, 37, width), 37 * zth(TWO_TERMS, width), 1e-15);
    }
  });

  // Our choice: no width or no network heats nothing (0 K), so callers need no special case.
  it("is 0 for a width ≤ 0 and for an empty network", () => {
    expect(rectRise(TWO_TERMS, 500, 0)).toBe(0);
    expect(rectRise(TWO_TERMS, 500, -1)).toBe(0);
    expect(rectRise([], 500, 1)).toBe(0);
  });
});

describe("trainRise", () => {
  // Worked values, METHODS.md §10, derived from the Foster formula; 0.143050 is held to the digits shown (the
  // table's rounding is 1.4e-6 relative there).
  it("one term, t_p/τ = 0.1, T/τ = 1: steady peak 0.150545·P·R, after 3 pulses 0.143050·P·R", () => {
    expectRelative(trainRise(ONE_TERM, 1, 0.1, 1), 0.150545, 1e-6);
    expectToShownDigits(trainRise(ONE_TERM, 1, 0.1, 1, 3), "0.143050");
  });

  // Derived from §4: N = 1 gives (1 − b^1)/(1 − b) = 1; T → ∞ gives b = 0.
  it("one pulse equals rectRise, and an infinite period leaves every pulse alone", () => {
    expect(trainRise(TWO_TERMS, 500, 2e-3, 5e-3, 1)).toBe(rectRise(TWO_TERMS, 500, 2e-3));
    expect(trainRise(TWO_TERMS, 500, 2e-3, Number.POSITIVE_INFINITY)).toBe(rectRise(TWO_TERMS, 500, 2e-3));
  });

  // Derived from §4: continuous train is N → ∞ of the N-pulse closed form.
  it("tends to the continuous train as the count grows", () => {
    const continuous = trainRise(TWO_TERMS, 500, 2e-3, 5e-3);
    expect(trainRise(TWO_TERMS, 500, 2e-3, 5e-3, 10)).toBeLessThan(continuous);
    expectRelative(trainRise(TWO_TERMS, 500, 2e-3, 5e-3, 10_000), continuous, 1e-14);
    expect(trainRise(TWO_TERMS, 500, 2e-3, 5e-3, Number.POSITIVE_INFINITY)).toBe(continuous);
  });

  // Derived: a train with no gap is a DC load, so the continuous peak is P·R_th.
  // Derived from §4: with T = t_p, a = b and (1 − a)/(1 − b) = 1, so θ = P·Σ R_i.
  it("with the period equal to the width, the continuous train is DC: P·R_th", () => {
    expectRelative(trainRise(TWO_TERMS, 500, 2e-3, 2e-3), 500 * rth(TWO_TERMS), 1e-15);
  });

  // Derived: for x = T/τ → 0, Σ_(k<N) e^(−kx) = N − N(N−1)x/2 + O(x²) and 1 − e^(−y) = y − y²/2 + O(y³).
  // Derived from §4: expm1 keeps full precision for tiny x.
  it("stays precise when the pulse and the period are tiny against τ", () => {
    const [x, y, n] = [1e-12, 5e-13, 10];
    const expected = (y - y ** 2 / 2) * (n - (n * (n - 1) * x) / 2);
    expectRelative(trainRise(ONE_TERM, 1, y, x, n), expected, 1e-14);
  });

  // Our choice: no pulse heats nothing; a period shorter than the width is no train (NaN, refused upstream, §7).
  it("is 0 for a width ≤ 0 or fewer than one pulse, NaN when the period is shorter than the width", () => {
    expect(trainRise(TWO_TERMS, 500, 0, 1e-3)).toBe(0);
    expect(trainRise(TWO_TERMS, 500, 1e-3, 2e-3, 0)).toBe(0);
    expect(trainRise(TWO_TERMS, 500, 2e-3, 1e-3)).toBeNaN();
    expect(trainRise([], 500, 1e-3, 2e-3)).toBe(0);
  });

  // Reference: superposition of linear thermal responses (Stout and Billings, InterPACK 2007): N single pulses,
  // each the difference of two shifted step responses, summed at the end of the last one.
  it("the N-pulse closed form equals the brute-force superposition of N single pulses", () => {
    fc.assert(
      fc.property(
        network,
        fc.double({ min: 1e-6, max: 0.1, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.integer({ min: 1, max: 60 }),
        (net, width, ratio, count) => {
          const period = width * ratio;
          // Pulse k started (count − 1 − k) periods before the last one, which has just ended.
          let superposed = 0;
          for (let k = 0; k < count; k++) {
            const since = (count - 1 - k) * period;
            superposed += zth(net, since + width) - zth(net, since);
          }
          expectRelative(trainRise(net, 1, width, period, count), superposed, 1e-9);
        },
      ),
    );
  });

  // Reference: general-purpose ODE integrator from npm (odex: Hairer and Wanner's ODEX extrapolation method)
  // integrating dθ_i/dt = (R_i·P(t) − θ_i)/τ_i piece by piece; it agrees to about 2e-13, asserted to 1e-11.
  it("matches an ODE integration of the Foster network for a 3-pulse train and a steady train", () => {
    expectRelative(
      trainRise(TWO_TERMS, 500, 2e-3, 5e-3, 3),
      integrateTrain(TWO_TERMS, 500, 2e-3, 5e-3, 3),
      1e-11,
    );
    // 200 periods of 20 ms leave e^(−40) of the 100 ms term's transient: the train is steady.
    expectRelative(
      trainRise(TWO_TERMS, 500, 2e-3, 20e-3),
      integrateTrain(TWO_TERMS, 500, 2e-3, 20e-3, 200),
      1e-11,
    );
  });
});
