// Long file: the waveform thermal model against an independent ODE solver, case by case.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { expectRelative, fosterNetwork, ONE_TERM, THREE_TERMS } from "@/test/foster-data";
import { Solver } from "@/test/odex";
import { rectRise } from "./thermal-rect";
import { trianglePeakRise } from "./thermal-triangle";
import type { WaveformRise } from "./thermal-waveform";
import { powerFromVI, rampFactor, waveformRise, waveformRiseVI } from "./thermal-waveform";

/** Largest |a − b| over two traces, relative to the largest |b| (0 for two all-zero traces). */
function traceDifference(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let difference = 0;
  let scale = 0;
  for (let j = 0; j < b.length; j++) {
    difference = Math.max(difference, Math.abs(a[j] - b[j]));
    scale = Math.max(scale, Math.abs(b[j]));
  }
  return difference / Math.max(scale, Number.MIN_VALUE);
}

const network = fosterNetwork(9);

describe("waveformRise", () => {
  // Worked values, METHODS.md §10, derived from the Foster formula. A power step is a zero-length step.
  it("R = 1 K/W, h = τ, from rest: 10 W → 6.321206 K, then 0 W for τ → 2.325442 K; a 0 → 10 W ramp → 3.678794 K", () => {
    expectRelative(waveformRise([0, 1], [10, 10], ONE_TERM).peak, 6.321206, 1e-6);
    const stepDown = waveformRise([0, 1, 1, 2], [10, 10, 0, 0], ONE_TERM, { trace: true });
    expectRelative(stepDown.trace![3], 2.325442, 1e-6);
    expect(stepDown.trace![2]).toBe(stepDown.trace![1]);
    expectRelative(waveformRise([0, 1], [0, 10], ONE_TERM).peak, 3.678794, 1e-6);
  });

  // Derived: for x → 0, 1 − e^(−x) = x − x²/2 + x³/6 and φ(x) = x/2 − x²/6 + x³/24, to O(x⁴).
  // Derived from §4: use expm1 so that tiny x keeps full precision.
  it("keeps full precision for a step of 1e-12 τ", () => {
    const x = 1e-12;
    const { peak } = waveformRise([0, x], [3, 7], ONE_TERM);
    const expected = 3 * (x - x ** 2 / 2 + x ** 3 / 6) + 4 * (x / 2 - x ** 2 / 6 + x ** 3 / 24);
    expectRelative(peak, expected, 1e-15);
  });

  // Derived from §4: constant power P from rest gives R·P·(1 − e^(−t/τ)); a million steps of 1e-6 τ must not drift.
  it("does not drift over a million steps far shorter than τ", () => {
    const n = 1_000_000;
    const t = Float64Array.from({ length: n + 1 }, (_, j) => j * 1e-6);
    const p = new Float64Array(n + 1).fill(2);
    expectRelative(waveformRise(t, p, ONE_TERM).peak, -2 * Math.expm1(-1), 1e-13);
  });

  // Reference: general-purpose ODE integrator from npm (odex: Hairer and Wanner's ODEX extrapolation method)
  // integrating dθ_i/dt = (R_i·p(t) − θ_i)/τ_i with p linear between samples, restarted at every sample; it agrees
  // to about 2e-14 of the largest rise, asserted to 1e-11.
  it("matches an ODE integration on a non-uniform time axis", () => {
    const t = Array.from({ length: 41 }, (_, j) => 5e-3 * (j / 40) ** 2 + (j % 3) * 1e-6 * Math.sign(j));
    const p = t.map((time) => 300 * Math.exp(-time / 2e-3) * -Math.expm1(-time / 1e-4) + 20);
    const { trace } = waveformRise(t, p, THREE_TERMS, { trace: true });
    const reference = [0];
    let state = THREE_TERMS.map(() => 0);
    for (let j = 0; j + 1 < t.length; j++) {
      const [t0, t1, p0, p1] = [t[j], t[j + 1], p[j], p[j + 1]];
      const power = (time: number) => p0 + ((p1 - p0) * (time - t0)) / (t1 - t0);
      const derivative = (time: number, y: number[]) =>
        THREE_TERMS.map(({ r, tau }, i) => (r * power(time) - y[i]) / tau);
      const solver = new Solver(THREE_TERMS.length);
      solver.relativeTolerance = 1e-13;
      solver.absoluteTolerance = 1e-15;
      solver.maxSteps = 100_000;
      state = solver.solve(derivative, t0, state, t1).y;
      reference.push(state.reduce((a, b) => a + b, 0));
    }
    expect(traceDifference(trace!, reference)).toBeLessThan(1e-11);
  });

  // Derived: a constant power sampled at any points is piecewise-linear, so the update is exact: P·Z_th(t_p).
  // Derived from §4: the exact update of a constant power is the rectangle's closed form.
  it("a sampled rectangle ends at rectRise, on uniform and non-uniform axes", () => {
    fc.assert(
      fc.property(
        network,
        fc.double({ min: 1e-6, max: 1, noNaN: true }),
        fc.integer({ min: 2, max: 300 }),
        fc.boolean(),
        (net, width, samples, uniform) => {
          const t = Array.from(
            { length: samples },
            (_, j) => width * (uniform ? j / (samples - 1) : (j / (samples - 1)) ** 2),
          );
          const p = t.map(() => 250);
          const { trace } = waveformRise(t, p, net, { trace: true });
          expectRelative(trace![samples - 1], rectRise(net, 250, width), 1e-12);
        },
      ),
    );
  });

  // Derived: a zero step changes nothing, so appending one moves a uniform axis onto the per-step path without
  // changing the answer; both paths are exact and must agree to rounding.
  // Our choice: the uniform-step fast path is an optimisation and must agree with §4's per-step update.
  it("the uniform fast path and the per-step path agree", () => {
    fc.assert(
      fc.property(
        network,
        fc.double({ min: -8, max: -2, noNaN: true }).map((e) => 10 ** e),
        fc.array(fc.double({ min: 0, max: 1000, noNaN: true }), { minLength: 2, maxLength: 400 }),
        (net, h, p) => {
          const t = p.map((_, j) => j * h);
          const fast = waveformRise(t, p, net, { trace: true });
          const general = waveformRise([...t, t[t.length - 1]], [...p, p[p.length - 1]], net, {
            trace: true,
          });
          expect(traceDifference(general.trace!.subarray(0, p.length), fast.trace!)).toBeLessThan(1e-12);
          expect(general.trace![p.length]).toBe(general.trace![p.length - 1]);
          expectRelative(general.peak, fast.peak, 1e-12);
        },
      ),
    );
  });

  // Derived: the rise is linear in the network, so nine terms are the sum of three three-term networks.
  // Derived from §4: Z_th and each θ_i are a sum over independent terms.
  it("more than four terms give the sum of their parts, with or without a trace", () => {
    const net = Array.from({ length: 9 }, (_, i) => ({ r: 0.01 * (i + 1), tau: 10 ** (-6 + i / 2) }));
    const t = Array.from({ length: 5000 }, (_, j) => j * 2e-6);
    const p = t.map((time) => 400 * Math.exp(-time / 3e-3) * (1 + Math.sin(time * 4e3)));
    const parts = [0, 3, 6].map((i) => waveformRise(t, p, net.slice(i, i + 3), { trace: true }).trace!);
    const sum = parts[0].map((value, j) => value + parts[1][j] + parts[2][j]);
    const whole = waveformRise(t, p, net, { trace: true });
    expect(traceDifference(whole.trace!, sum)).toBeLessThan(1e-14);
    const withoutTrace = waveformRise(t, p, net);
    expect(withoutTrace).toEqual({
      peak: whole.peak,
      peakIndex: whole.peakIndex,
      maxRise: whole.maxRise,
      maxTime: whole.maxTime,
    });
    expect(whole.peak).toBe(Math.max(...whole.trace!));
  });

  // Our choice: the earliest sample on ties, as §6 takes the earliest binding sample.
  it("reports the first sample of the peak, t_0 included: a waveform that only cools peaks at 0 at index 0", () => {
    expect(waveformRise([0, 1, 2], [5, 5, 5], [{ r: 1, tau: 0.1 }]).peakIndex).toBe(2);
    expect(waveformRise([0, 1, 2, 3], [-5, -5, -5, -5], ONE_TERM)).toMatchObject({ peak: 0, peakIndex: 0 });
  });

  // Derived from §6 (at least two samples make a waveform); our choice: fewer give a rest state.
  it("handles a 2-sample waveform, a single sample and an empty one", () => {
    expect(waveformRise([0, 2], [10, 10], ONE_TERM, { trace: true }).trace).toEqual(
      Float64Array.from([0, -10 * Math.expm1(-2)]),
    );
    expect(waveformRise([5], [10], ONE_TERM, { trace: true })).toMatchObject({
      peak: 0,
      peakIndex: 0,
      maxRise: 0,
      trace: Float64Array.from([0]),
    });
    expect(waveformRise([], [], ONE_TERM)).toMatchObject({ peak: 0, peakIndex: -1, maxRise: 0 });
    expect(waveformRise([], [], ONE_TERM, { trace: true }).trace).toHaveLength(0);
  });

  // Derived from §4: an empty sum is 0.
  it("gives 0 everywhere for an empty network, on both paths", () => {
    expect(waveformRise([0, 1, 2], [1, 2, 3], [], { trace: true }).trace).toEqual(new Float64Array(3));
    expect(waveformRise([0, 1, 3], [1, 2, 3], [])).toMatchObject({ peak: 0, peakIndex: 0, maxRise: 0 });
  });

  // Our choice: no time passes, so nothing heats.
  it("treats a time axis with all samples at one instant as holding the rest state", () => {
    expect(waveformRise([1, 1, 1], [1, 2, 3], ONE_TERM)).toMatchObject({ peak: 0, peakIndex: 0, maxRise: 0 });
  });

  // Derived from §6: t strictly increasing; our choice: a RangeError, as for any programming error.
  it("rejects differing lengths and a decreasing or NaN time axis with a RangeError", () => {
    expect(() => waveformRise([0, 1], [1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRise([0, 2, 1], [1, 1, 1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRise([1, 0], [1, 1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRise([0, Number.NaN, 2], [1, 1, 1], ONE_TERM)).toThrow(RangeError);
  });

  // Our choice: a NaN peak at index −1 rather than a number that looks real.
  it("gives a NaN peak at index −1 for NaN or infinite power", () => {
    expect(waveformRise([0, 1, 2], [1, Number.NaN, 1], ONE_TERM)).toMatchObject({
      peak: Number.NaN,
      peakIndex: -1,
      maxRise: Number.NaN,
    });
    expect(waveformRise([0, 1, 3], [1, 1, Number.POSITIVE_INFINITY], ONE_TERM)).toMatchObject({
      peak: Number.NaN,
      peakIndex: -1,
    });
  });
});

/** Asserts that two results are the same bit for bit: peak, peakIndex and every trace value (−0 ≠ 0). */
function expectSameBits(actual: WaveformRise, expected: WaveformRise): void {
  expect(Object.is(actual.peak, expected.peak)).toBe(true);
  expect(Object.is(actual.maxRise, expected.maxRise)).toBe(true);
  expect(actual.peakIndex).toBe(expected.peakIndex);
  expect(actual.trace === undefined).toBe(expected.trace === undefined);
  if (actual.trace !== undefined && expected.trace !== undefined) {
    expect(new BigUint64Array(actual.trace.buffer)).toEqual(new BigUint64Array(expected.trace.buffer));
  }
}

describe("waveformRiseVI", () => {
  const channel = fc.double({ min: -1000, max: 1000, noNaN: true });

  // Derived: p = v·i formed inside the pass is the same product powerFromVI stores, fed to the same update, so
  // the fused and split routes must agree bit for bit on either path, with or without a trace, for any term count.
  // Our choice: the fused path is an optimisation and must agree bit for bit with the two-step path.
  it("gives waveformRise(t, powerFromVI(v, i)) bit for bit, on uniform and non-uniform axes", () => {
    fc.assert(
      fc.property(
        network,
        fc.array(fc.tuple(channel, channel, fc.double({ min: 0, max: 1, noNaN: true })), {
          minLength: 0,
          maxLength: 300,
        }),
        fc.double({ min: -8, max: -2, noNaN: true }).map((e) => 10 ** e),
        fc.boolean(),
        fc.boolean(),
        (net, samples, h, uniform, trace) => {
          const v = samples.map(([vj]) => vj);
          const i = samples.map(([, ij]) => ij);
          // Non-uniform: random steps up to 2h, zero steps included (about one in ten).
          let time = 0;
          const t = samples.map(([, , u], j) => {
            if (j > 0) time += u < 0.1 ? 0 : 2 * h * u;
            return uniform ? j * h : time;
          });
          const options = { trace };
          expectSameBits(
            waveformRiseVI(t, v, i, net, options),
            waveformRise(t, powerFromVI(v, i), net, options),
          );
          const typed = [t, v, i].map((x) => Float64Array.from(x));
          expectSameBits(
            waveformRiseVI(typed[0], typed[1], typed[2], net, options),
            waveformRise(typed[0], powerFromVI(typed[1], typed[2]), net, options),
          );
        },
      ),
    );
  });

  it("handles an empty capture and a 2-sample one", () => {
    expect(waveformRiseVI([], [], [], ONE_TERM)).toMatchObject({ peak: 0, peakIndex: -1 });
    expect(waveformRiseVI([], [], [], ONE_TERM, { trace: true }).trace).toHaveLength(0);
    // 48 V × 2 A = 96 W, then 24 V × 0.5 A = 12 W: a 96 → 12 W ramp over one τ, by the update of METHODS.md §4.
    const x = 1;
    const expected = 96 * -Math.expm1(-x) + (12 - 96) * (1 + Math.expm1(-x) / x);
    const uniform = waveformRiseVI([0, x], [48, 24], [2, 0.5], ONE_TERM, { trace: true });
    expectRelative(uniform.trace![1], expected, 1e-15);
    expectSameBits(uniform, waveformRise([0, x], [96, 12], ONE_TERM, { trace: true }));
  });

  // Derived from §4 (an empty sum is 0); our choice: NaN at index −1 for bad power.
  it("gives 0 everywhere for an empty network, and a NaN peak at index −1 for NaN or infinite power", () => {
    expect(waveformRiseVI([0, 1, 3], [1, 2, 3], [1, 1, 1], [], { trace: true }).trace).toEqual(
      new Float64Array(3),
    );
    expect(waveformRiseVI([0, 1, 2], [1, Number.POSITIVE_INFINITY, 1], [1, 0, 1], ONE_TERM)).toMatchObject({
      peak: Number.NaN,
      peakIndex: -1,
    });
    expect(waveformRiseVI([0, 1, 3], [1, 1, Number.NaN], [1, 1, 1], ONE_TERM)).toMatchObject({
      peak: Number.NaN,
      peakIndex: -1,
    });
  });

  // Derived from §6: t strictly increasing; our choice: the same RangeError as waveformRise.
  it("rejects differing lengths and a decreasing time axis with a RangeError, as waveformRise does", () => {
    expect(() => waveformRiseVI([0, 1], [1], [1, 1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRiseVI([0, 1], [1, 1], [1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRiseVI([0], [1, 1], [1, 1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRiseVI([], [1], [1], ONE_TERM)).toThrow(RangeError);
    expect(() => waveformRiseVI([0, 2, 1], [1, 1, 1], [1, 1, 1], ONE_TERM)).toThrow(RangeError);
  });
});

describe("rampFactor", () => {
  // Derived: φ(x) = 1 − (1 − e^(−x))/x; its closed form is accurate to a few 1e-15 above x = 0.05.
  // Derived from §4: the ramp factor 1 − (1 − a)/x; our choice: a series below x = 1/4 for precision.
  it("matches the closed form on both sides of the switch to the series at x = 1/4", () => {
    for (const x of [0.05, 0.1, 0.2, 0.25 - 1e-12, 0.25, 0.3, 1, 30]) {
      expectRelative(rampFactor(x), 1 + Math.expm1(-x) / x, 1e-13);
    }
  });

  // Derived from §4: 1 − (1 − e^(−x))/x → 0 as x → 0 and → 1 as x → ∞.
  it("is 0 at x = 0 and tends to 1 as x grows", () => {
    expect(rampFactor(0)).toBe(0);
    expect(rampFactor(Number.POSITIVE_INFINITY)).toBe(1);
  });
});

describe("powerFromVI", () => {
  // Common practice, no source: instantaneous power is p = v·i at each sample; unequal series are an error.
  it("multiplies sample by sample and rejects differing lengths", () => {
    expect(powerFromVI([48, 24, 0], [2, 0.5, 7])).toEqual(Float64Array.from([96, 12, 0]));
    expect(() => powerFromVI([1, 2], [1])).toThrow(RangeError);
  });
});

/** The same record with every segment cut into `parts` pieces (power linear inside, so the update stays exact). */
function subdivide(t: number[], p: number[], parts: number): { t: number[]; p: number[] } {
  const out = { t: [t[0]], p: [p[0]] };
  for (let j = 0; j + 1 < t.length; j++) {
    for (let k = 1; k <= parts; k++) {
      out.t.push(t[j] + ((t[j + 1] - t[j]) * k) / parts);
      out.p.push(p[j] + ((p[j + 1] - p[j]) * k) / parts);
    }
  }
  return out;
}

describe("waveformRise between samples (METHODS.md §4, v2)", () => {
  const THREE = [
    { r: 0.7, tau: 30e-6 },
    { r: 0.7, tau: 100e-6 },
    { r: 1.0, tau: 2.3e-3 },
  ];

  // Worked value, METHODS.md §10 (derived from the Foster formula): the rate is negative at both ends of the
  // 1.1–20 ms segment, yet the rise peaks inside it.
  it("finds 129.372 K at about 10.14 ms inside a segment whose rate is negative at both ends", () => {
    const rise = waveformRise([0, 1.1e-3, 20e-3], [81, 55, 53], THREE);
    expect(rise.maxRise).toBeCloseTo(129.372, 3);
    expect(rise.maxTime).toBeCloseTo(10.14e-3, 5);
    expect(rise.peak).toBeLessThan(128);
  });

  // Derived: the exact update over many small pieces samples the true rise; its largest sample approaches the true
  // maximum from below, to second order in the piece length.
  it("agrees with a finely subdivided record and is never below it", () => {
    fc.assert(
      fc.property(
        network,
        fc.array(fc.double({ min: 0, max: 500, noNaN: true }), { minLength: 2, maxLength: 6 }),
        fc.double({ min: -1, max: 2, noNaN: true }),
        (net, p, decades) => {
          const tauMin = Math.min(...net.map((term) => term.tau));
          const h = tauMin * 10 ** decades;
          const t = p.map((_, j) => h * (j + 0.37 * Math.floor(j / 2)));
          // Pieces far shorter than both the fastest term and the segment itself.
          const fine = subdivide(t, p, Math.ceil((1.37 * h) / (Math.min(tauMin, h) / 1000)));
          const dense = waveformRise(fine.t, fine.p, net);
          const sparse = waveformRise(t, p, net);
          expect(sparse.maxRise).toBeGreaterThanOrEqual(dense.peak * (1 - 1e-12));
          expect(sparse.maxRise - dense.peak).toBeLessThanOrEqual(1e-5 * dense.peak + 1e-12);
        },
      ),
      { numRuns: 60 },
    );
  });

  // Issue 10, request 6: a falling ramp from rest given as two samples peaks where the triangle does.
  it("a two-sample falling ramp from rest peaks where the closed-form triangle does", () => {
    const rise = waveformRise([0, 2e-3], [400, 0], THREE);
    expectRelative(rise.maxRise, trianglePeakRise(THREE, 400, 2e-3), 1e-9);
  });

  it("starts settled at the first sample's power with `steady`: θ_i = R_i·p_0", () => {
    const settled = waveformRise([0, 1e-3], [100, 100], THREE, { steady: true, trace: true });
    expectRelative(settled.trace![0], 100 * 2.4, 1e-15);
    expectRelative(settled.trace![1], 100 * 2.4, 1e-12);
    expect(settled.maxRise).toBeCloseTo(240, 9);
  });

  it("takes negative power as zero: power flowing back never cools the junction", () => {
    const clamped = waveformRise([0, 1e-3, 2e-3], [100, -500, 0], THREE, { trace: true });
    const zeroed = waveformRise([0, 1e-3, 2e-3], [100, 0, 0], THREE, { trace: true });
    expect(clamped.trace).toEqual(zeroed.trace);
  });
});
