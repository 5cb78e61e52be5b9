import { describe, expect, it } from "vitest";
import type { FosterTerm } from "./foster";
import { dutyCycleImpedance, repetitionScale } from "./repetition";
import { type ImpedanceSource, impedanceFromFoster } from "./thermal-impedance";

/** Exact peak of a continuous train per watt: Σ R_i·(1 − a_i)/(1 − b_i) (METHODS.md §4, derived). */
function exactPeriodicPeak(network: FosterTerm[], width: number, period: number): number {
  return network.reduce(
    (sum, { r, tau }) => sum + (r * Math.expm1(-width / tau)) / Math.expm1(-period / tau),
    0,
  );
}

// Z_th is the transient thermal impedance Z_θ as defined by JEDEC JESD24-3.
describe("dutyCycleImpedance", () => {
  it("gives 0.163458 for one term, t_p/τ = 0.1, T/τ = 1, above the exact 0.150545", () => {
    // METHODS.md §10 worked values "periodic, one term" (derived): duty-cycle form 0.163458 ≥ exact 0.150545.
    const network = [{ r: 1, tau: 1 }];
    const z = dutyCycleImpedance(impedanceFromFoster(network), 0.1, 1) as number;
    expect(Math.abs(z / 0.163458 - 1)).toBeLessThan(1e-6);
    const exact = exactPeriodicPeak(network, 0.1, 1);
    expect(Math.abs(exact / 0.150545 - 1)).toBeLessThan(1e-6);
    expect(z).toBeGreaterThanOrEqual(exact);
  });

  it("is never below the exact periodic peak for positive Foster terms (grid of t_p/τ and D)", () => {
    // Derived (METHODS.md §7, §10): checked on a grid, for one term and for a spread two-term network.
    const networks: FosterTerm[][] = [
      [{ r: 1, tau: 1 }],
      [
        { r: 0.2, tau: 1e-3 },
        { r: 0.8, tau: 1 },
      ],
    ];
    for (const network of networks) {
      const source = impedanceFromFoster(network);
      for (const ratio of [1e-4, 1e-3, 1e-2, 0.1, 0.3, 1, 3, 10, 100]) {
        for (const duty of [0.001, 0.01, 0.05, 0.1, 0.2, 0.5, 0.8, 0.95, 0.99]) {
          const width = ratio;
          const period = width / duty;
          const z = dutyCycleImpedance(source, width, period) as number;
          expect(z).toBeGreaterThanOrEqual(exactPeriodicPeak(network, width, period) * (1 - 1e-12));
        }
      }
    }
  });

  it("has no value when a Z_th value or R_th is missing", () => {
    const missing: ImpedanceSource = { zth: (t) => (t < 1 ? t : null), rth: 1 };
    expect(dutyCycleImpedance(missing, 0.1, 2)).toBeNull();
    expect(dutyCycleImpedance({ zth: (t) => t, rth: null }, 0.1, 2)).toBeNull();
  });
});

describe("repetitionScale", () => {
  it("scales by Z_th(t_eq)/Z(t_eq, D), capped at 1", () => {
    const source = impedanceFromFoster([{ r: 1, tau: 1 }]);
    const scale = repetitionScale(source, 0.1, 1);
    expect(scale.flag).toBeNull();
    // Derived: Z = D·R + (1 − D)·Z_th(1.1) − Z_th(1) + Z_th(0.1) with R = τ = 1 and D = 0.1.
    const z = 0.1 - 0.9 * Math.expm1(-1.1) + Math.expm1(-1) - Math.expm1(-0.1);
    expect(scale.scale).toBeCloseTo(-Math.expm1(-0.1) / z, 14);
    // Inconsistent data that would up-rate the repeated pulse: capped (a repeat is never allowed more).
    const upRating: ImpedanceSource = { zth: (t) => (t < 0.5 ? 1 : 0.1), rth: 0.1 };
    expect(repetitionScale(upRating, 0.1, 1)).toEqual({ scale: 1, flag: null });
  });

  it("flags missing data and data so inconsistent that Z is not positive", () => {
    expect(repetitionScale({ zth: () => null, rth: 1 }, 0.1, 1)).toEqual({
      scale: null,
      flag: "repetition-outside-data",
    });
    const negative: ImpedanceSource = { zth: (t) => (t >= 1 ? 5 : 0.1), rth: 0.1 };
    expect(repetitionScale(negative, 0.1, 1)).toEqual({ scale: null, flag: "repetition-outside-data" });
  });
});
