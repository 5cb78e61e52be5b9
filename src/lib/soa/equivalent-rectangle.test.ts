import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { triangleEquivalent, WINDOW_THRESHOLD, waveformEquivalent } from "./equivalent-rectangle";
import { type FosterTerm, zth } from "./foster";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRise } from "./thermal-waveform";

const networkArb = fc.array(
  fc.record({
    r: fc.double({ min: 1e-3, max: 2, noNaN: true }),
    tau: fc.double({ min: 1e-6, max: 1, noNaN: true }),
  }),
  { minLength: 1, maxLength: 4 },
) as fc.Arbitrary<FosterTerm[]>;

describe("triangleEquivalent", () => {
  it("holds energy P·t/2 and lasts t/2 at peak power", () => {
    // Common practice, no source: P = V·I, and a triangle of peak power P and width t holds energy P·t/2.
    expect(triangleEquivalent(64, 50, 3.125e-6)).toEqual({
      duration: 1.5625e-6,
      energy: 5e-3,
      peakPower: 3200,
    });
    expect(Number.isNaN(triangleEquivalent(Number.NaN, 1, 1).energy)).toBe(true);
  });

  it("never underestimates the exact Foster peak of the triangle", () => {
    // METHODS.md §6 (derived): the true peak never exceeds p_peak·Z_th(E/p_peak) for Z_th concave in t.
    fc.assert(
      fc.property(
        networkArb,
        fc.double({ min: 1e-6, max: 10, noNaN: true }),
        fc.double({ min: 1, max: 1e4, noNaN: true }),
        (network, width, power) => {
          const rect = triangleEquivalent(power, 1, width);
          const exact = trianglePeakRise(network, power, width);
          expect(exact).toBeLessThanOrEqual(rect.peakPower * zth(network, rect.duration) * (1 + 1e-9));
        },
      ),
    );
  });
});

describe("waveformEquivalent", () => {
  it("integrates the window around the peak where p ≥ 5 % of the peak (trapezoid)", () => {
    // The power dips below 5 W after the peak; the second 100 W sample beyond the dip is outside the window.
    const t = [0, 1, 2, 3, 4, 5, 6];
    const p = [0, 1, 10, 100, 40, 4, 100];
    const rect = waveformEquivalent(t, p);
    expect(WINDOW_THRESHOLD).toBe(0.05);
    expect(rect).toEqual({
      ok: true,
      peakIndex: 3,
      peakPower: 100,
      window: [2, 4],
      energy: (10 + 100) / 2 + (100 + 40) / 2,
      duration: 1.25,
    });
  });

  it("takes the first sample of peak power and includes samples at exactly 5 %", () => {
    const rect = waveformEquivalent([0, 1, 2, 3], [5, 100, 100, 5]);
    expect(rect.ok && [rect.peakIndex, ...rect.window]).toEqual([1, 0, 3]);
  });

  it("has no width when the window is a single sample", () => {
    expect(waveformEquivalent([0, 1, 2], [0, 10, 0])).toEqual({ ok: false, flag: "pulse-too-short" });
    expect(waveformEquivalent([0], [10])).toEqual({ ok: false, flag: "pulse-too-short" });
  });

  it("has no rectangle without positive power: empty, all ≤ 0 or NaN", () => {
    expect(waveformEquivalent([], [])).toEqual({ ok: false, flag: "no-power" });
    expect(waveformEquivalent([0, 1], [0, -3])).toEqual({ ok: false, flag: "no-power" });
    expect(waveformEquivalent([0, 1], [Number.NaN, Number.NaN])).toEqual({ ok: false, flag: "no-power" });
  });

  it("keeps full precision over a million samples (compensated sum)", () => {
    // Derived: a constant 3 W over 1 s holds 3 J; the steps 1e-6 s are not exact in binary.
    const n = 1_000_001;
    const t = Float64Array.from({ length: n }, (_, k) => k * 1e-6);
    const p = new Float64Array(n).fill(3);
    const rect = waveformEquivalent(t, p);
    expect(rect.ok && Math.abs(rect.energy / 3 - 1)).toBeLessThan(1e-12);
  });

  it("never underestimates the exact Foster peak of a capture", () => {
    // METHODS.md §6 (derived): for 0 ≤ p ≤ p_peak from equilibrium and positive Foster terms,
    // peak rise ≤ p_peak·Z_th(E/p_peak). Samples stay ≥ 5 % of the peak, so the window is the whole capture.
    fc.assert(
      fc.property(
        networkArb,
        fc.array(fc.double({ min: 0.05, max: 1, noNaN: true }), { minLength: 2, maxLength: 60 }),
        fc.array(fc.double({ min: 1e-7, max: 1e-1, noNaN: true }), { minLength: 59, maxLength: 59 }),
        (network, shape, steps) => {
          const p = shape.map((x) => x * 500);
          const t = [0];
          for (let k = 1; k < p.length; k++) t.push(t[k - 1] + steps[k - 1]);
          const rect = waveformEquivalent(t, p);
          if (!rect.ok) throw new Error("expected a rectangle");
          expect(rect.window).toEqual([0, p.length - 1]);
          const exact = waveformRise(t, p, network).peak;
          expect(exact).toBeLessThanOrEqual(rect.peakPower * zth(network, rect.duration) * (1 + 1e-9));
        },
      ),
    );
  });
});
