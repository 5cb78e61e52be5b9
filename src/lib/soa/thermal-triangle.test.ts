import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { expectRelative, fosterNetwork, THREE_TERMS, TWO_TERMS } from "@/test/foster-data";
import { type OdexSolver, Solver } from "@/test/odex";
import { type FosterTerm, zth } from "./foster";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRise } from "./thermal-waveform";

function solver(n: number): OdexSolver {
  const s = new Solver(n);
  s.relativeTolerance = 1e-13;
  s.absoluteTolerance = 1e-15;
  s.maxSteps = 100_000;
  return s;
}

/**
 * Maximum of Σθ_i over one falling triangle starting from `start`, by ODE integration: on every accepted step the
 * integrator's own dense output is searched (golden section) between the step's ends. Returns the peak and the
 * end state.
 */
function integrateTriangle(net: readonly FosterTerm[], peakPower: number, width: number, start: number[]) {
  const derivative = (t: number, y: number[]) =>
    net.map(({ r, tau }, i) => (r * peakPower * (1 - t / width) - y[i]) / tau);
  const s = solver(net.length);
  s.denseOutput = true;
  let peak = start.reduce((a, b) => a + b, 0);
  const { y } = s.solve(derivative, 0, start, width, (n, xOld, x, state, dense) => {
    if (n === 1 || dense === undefined) return;
    const total = (t: number) => net.reduce((sum, _, i) => sum + dense(i, t), 0);
    let [lo, hi] = [xOld, x];
    const k = (Math.sqrt(5) - 1) / 2;
    for (let j = 0; j < 80; j++) {
      const [a, b] = [hi - k * (hi - lo), lo + k * (hi - lo)];
      if (total(a) < total(b)) lo = a;
      else hi = b;
    }
    peak = Math.max(
      peak,
      total((lo + hi) / 2),
      state.reduce((a, b) => a + b, 0),
    );
  });
  return { peak, end: y };
}

/** Peak over the last of `count` triangles of period `period`, every piece integrated from rest. */
function integrateTrain(net: FosterTerm[], peakPower: number, width: number, period: number, count: number) {
  let state = net.map(() => 0);
  for (let k = 0; k < count - 1; k++) {
    state = integrateTriangle(net, peakPower, width, state).end;
    const gap = (_: number, y: number[]) => net.map(({ tau }, i) => -y[i] / tau);
    state = solver(net.length).solve(gap, width, state, period).y;
  }
  return integrateTriangle(net, peakPower, width, state).peak;
}

/** Samples of a train of `count` falling triangles, exact as piecewise-linear power. */
function sampledTrain(peakPower: number, width: number, period: number, count: number, perTriangle: number) {
  const t: number[] = [];
  const p: number[] = [];
  for (let k = 0; k < count; k++) {
    // Zero power up to the start of the next triangle, then a step at one instant.
    if (k > 0) {
      t.push(k * period);
      p.push(0);
    }
    for (let j = 0; j <= perTriangle; j++) {
      t.push(k * period + (width * j) / perTriangle);
      p.push(peakPower * (1 - j / perTriangle));
    }
  }
  return { t, p };
}

const network = fosterNetwork();

describe("trianglePeakRise", () => {
  // Derived from §4 and §6 (one Foster term, a triangle from rest): θ(t) = R·P·[(1 − e^(−x))(1 + 1/u) − x/u] with x = t/τ, u = w/τ; dθ/dt = 0 at
  // e^(−x) = 1/(1 + u), where θ = R·P·(1 − ln(1 + u)/u).
  it("one term from rest peaks at R·P·(1 − ln(1 + u)/u), u = w/τ", () => {
    for (const u of [1e-3, 0.1, 1, 3, 10, 1e4]) {
      expectRelative(
        trianglePeakRise([{ r: 0.5, tau: 2e-3 }], 80, u * 2e-3),
        40 * (1 - Math.log1p(u) / u),
        1e-11,
      );
    }
  });

  // Energy of a triangle: P·t/2 (common practice, no source). Bound: derived; METHODS.md §6 (Z_th concave).
  it("never exceeds the equal-energy rectangle bound p_peak·Z_th(E/p_peak) = p_peak·Z_th(w/2)", () => {
    fc.assert(
      fc.property(
        network,
        fc.double({ min: 1, max: 1e4, noNaN: true }),
        fc.double({ min: -7, max: 1, noNaN: true }).map((e) => 10 ** e),
        (net, peakPower, width) => {
          const energy = (peakPower * width) / 2;
          const bound = peakPower * zth(net, energy / peakPower);
          expect(trianglePeakRise(net, peakPower, width)).toBeLessThanOrEqual(bound * (1 + 1e-12));
        },
      ),
    );
  });

  // Derived: the exact update of METHODS.md §4 is exact for piecewise-linear power, so a densely sampled triangle
  // gives the true rise at every sample: never above the true peak, and within the sampling's reach of it.
  it("is the true maximum: at or above every sample of the exact update, above the rise at the pulse's end", () => {
    const { t, p } = sampledTrain(500, 10e-3, 1, 1, 100_000);
    const sampled = waveformRise(t, p, THREE_TERMS);
    const peak = trianglePeakRise(THREE_TERMS, 500, 10e-3);
    expect(peak).toBeGreaterThanOrEqual(sampled.peak);
    expectRelative(peak, sampled.peak, 1e-9);
    expect(sampled.peakIndex).toBeLessThan(t.length - 1);
    expect(peak).toBeGreaterThan(waveformRise([0, 10e-3], [500, 0], THREE_TERMS).peak);
  });

  // Derived from §4 and §7, as above, over the last of four triangles.
  it("for a train, is the maximum over the last triangle of the sampled train", () => {
    const { t, p } = sampledTrain(500, 10e-3, 25e-3, 4, 20_000);
    const sampled = waveformRise(t, p, THREE_TERMS);
    const peak = trianglePeakRise(THREE_TERMS, 500, 10e-3, { period: 25e-3, count: 4 });
    expect(peak).toBeGreaterThanOrEqual(sampled.peak);
    expectRelative(peak, sampled.peak, 1e-8);
  });

  // Reference: general-purpose ODE integrator from npm (odex: Hairer and Wanner's ODEX extrapolation method)
  // integrating dθ_i/dt = (R_i·P(t) − θ_i)/τ_i, peak searched on its dense output; it agrees to about 5e-13,
  // asserted to 1e-10.
  it("matches an ODE integration for one triangle, the 3rd of a train and a steady train", () => {
    const start = THREE_TERMS.map(() => 0);
    expectRelative(
      trianglePeakRise(THREE_TERMS, 500, 10e-3),
      integrateTriangle(THREE_TERMS, 500, 10e-3, start).peak,
      1e-10,
    );
    const third = trianglePeakRise(THREE_TERMS, 500, 10e-3, { period: 25e-3, count: 3 });
    expectRelative(third, integrateTrain(THREE_TERMS, 500, 10e-3, 25e-3, 3), 1e-10);
    // 150 periods of 40 ms leave e^(−60) of the 100 ms term's transient: the train is steady.
    const steady = trianglePeakRise(THREE_TERMS, 500, 10e-3, { period: 40e-3 });
    expectRelative(steady, integrateTrain(THREE_TERMS, 500, 10e-3, 40e-3, 150), 1e-10);
  });

  // Derived from §7: N = 1 starts from rest; N → ∞ is the continuous train's start state.
  it("a train of one is the single triangle; more pulses rise towards the continuous train", () => {
    const single = trianglePeakRise(TWO_TERMS, 500, 10e-3);
    expect(trianglePeakRise(TWO_TERMS, 500, 10e-3, { period: 25e-3, count: 1 })).toBe(single);
    const five = trianglePeakRise(TWO_TERMS, 500, 10e-3, { period: 25e-3, count: 5 });
    const continuous = trianglePeakRise(TWO_TERMS, 500, 10e-3, { period: 25e-3 });
    expect(five).toBeGreaterThan(single);
    expect(continuous).toBeGreaterThan(five);
    expectRelative(
      trianglePeakRise(TWO_TERMS, 500, 10e-3, { period: 25e-3, count: 10_000 }),
      continuous,
      1e-12,
    );
  });

  // Our choice: nothing heats, so the rise is 0 (an empty sum, §4).
  it("is 0 for a width ≤ 0, an empty network or fewer than one pulse", () => {
    expect(trianglePeakRise(TWO_TERMS, 500, 0)).toBe(0);
    expect(trianglePeakRise(TWO_TERMS, 500, -1)).toBe(0);
    expect(trianglePeakRise([], 500, 1e-3)).toBe(0);
    expect(trianglePeakRise(TWO_TERMS, 500, 1e-3, { period: 2e-3, count: 0 })).toBe(0);
  });

  // Derived from §4: θ_i is linear in P; P = 0 gives 0.
  it("is 0 for zero peak power, alone or in a train", () => {
    expect(trianglePeakRise(TWO_TERMS, 0, 1e-3)).toBe(0);
    expect(trianglePeakRise(TWO_TERMS, 0, 1e-3, { period: 2e-3 })).toBe(0);
  });

  // Derived from §7: T must be greater than the pulse's width; our choice: NaN, not a number that looks real.
  it("is NaN when the period is shorter than the width or the power is NaN", () => {
    expect(trianglePeakRise(TWO_TERMS, 500, 2e-3, { period: 1e-3 })).toBeNaN();
    expect(trianglePeakRise(TWO_TERMS, Number.NaN, 1e-3)).toBeNaN();
  });
});
