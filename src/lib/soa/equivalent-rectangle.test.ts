import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { triangleEquivalent, waveformEquivalent } from "./equivalent-rectangle";
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
  // METHODS.md §6 (v2): the energy of the whole record, not of a window around the peak; power below zero counts as
  // zero. Trapezoid rule by hand: (0+1)/2 + (1+10)/2 + (10+100)/2 + (100+40)/2 + (40+4)/2 + (4+100)/2 = 205.
  it("integrates max(p, 0) over the whole record by the trapezoid rule", () => {
    const t = [0, 1, 2, 3, 4, 5, 6];
    const p = [0, 1, 10, 100, 40, 4, 100];
    expect(waveformEquivalent(t, p)).toEqual({
      ok: true,
      peakIndex: 3,
      peakPower: 100,
      energy: 205,
      duration: 2.05,
    });
    // A sample of −50 W counts as 0 W: (10 + 0)/2 + (0 + 10)/2 = 10.
    expect(waveformEquivalent([0, 1, 2], [10, -50, 10])).toMatchObject({ energy: 10, peakIndex: 0 });
  });

  // Derived from §6 (the rectangle keeps all of E = ∫p dt), issue 10, request 2: a long pre-heat far below the
  // peak must not be dropped. 12 V × 9.75 A for 1 s, then a
  // 100 µs spike of 199 A: the energy is dominated by the pre-heat (117 J against 0.24 J).
  it("keeps a long pre-heat far below the peak in the energy", () => {
    const rect = waveformEquivalent([0, 1, 1 + 1e-9, 1 + 1e-4, 1 + 1e-4 + 1e-9], [117, 117, 2388, 2388, 0]);
    expect(rect.ok && rect.energy).toBeGreaterThan(117);
  });

  // Derived from §6: p_peak = 0 has no equivalent width (no-power).
  it("has no rectangle without positive power: empty, all ≤ 0 or NaN", () => {
    expect(waveformEquivalent([], [])).toEqual({ ok: false, flag: "no-power" });
    expect(waveformEquivalent([0, 1], [0, -3])).toEqual({ ok: false, flag: "no-power" });
    expect(waveformEquivalent([0, 1], [Number.NaN, Number.NaN])).toEqual({ ok: false, flag: "no-power" });
  });

  // Our choice: a compensated (Kahan–Neumaier) sum, so long captures lose no digits of E.
  it("keeps full precision over a million samples (compensated sum)", () => {
    // Derived: a constant 3 W over 1 s holds 3 J; the steps 1e-6 s are not exact in binary.
    const n = 1_000_001;
    const t = Float64Array.from({ length: n }, (_, k) => k * 1e-6);
    const p = new Float64Array(n).fill(3);
    const rect = waveformEquivalent(t, p);
    expect(rect.ok && Math.abs(rect.energy / 3 - 1)).toBeLessThan(1e-12);
  });

  it("never underestimates the exact Foster peak of a record that starts from rest", () => {
    // METHODS.md §6 (derived): for 0 ≤ p ≤ p_peak from rest and positive Foster terms,
    // peak rise ≤ p_peak·Z_th(E/p_peak) with E over the whole record; the peak between samples included.
    fc.assert(
      fc.property(
        networkArb,
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 2, maxLength: 60 }),
        fc.array(fc.double({ min: 1e-7, max: 1e-1, noNaN: true }), { minLength: 59, maxLength: 59 }),
        (network, shape, steps) => {
          // Subnormal powers would test rounding, not the bound: they count as zero here.
          const p = shape.map((x) => (x < 1e-9 ? 0 : x * 500));
          const t = [0];
          for (let k = 1; k < p.length; k++) t.push(t[k - 1] + steps[k - 1]);
          const rect = waveformEquivalent(t, p);
          if (!rect.ok) return;
          const exact = waveformRise(t, p, network).maxRise;
          expect(exact).toBeLessThanOrEqual(rect.peakPower * zth(network, rect.duration) * (1 + 1e-9));
        },
      ),
    );
  });
});
