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
  const noCurves: ImpedanceSource = { zth: () => null, rth: null };

  // METHODS.md §10 worked value "v2 finite train, one term" (derived from the Foster formula): R = 1, t_p/τ = 0.1,
  // T/τ = 1: N = 1 → 1; N = 3 → 0.665241; continuous → 0.632121.
  it("takes the exact train peak with a Foster network: 1, 0.665241 and 0.632121", () => {
    const network = [{ r: 1, tau: 1 }];
    const scale = (count?: number) =>
      repetitionScale({ network, curves: noCurves, tEq: 0.1, period: 1, count }).scale as number;
    expect(scale(1)).toBe(1);
    expect(scale(3)).toBeCloseTo(0.665241, 6);
    expect(scale()).toBeCloseTo(0.632121, 6);
  });

  // Derived from §7 (N ≥ 1; one pulse is no train), issue 10, request 3: one pulse with `count: 1` is the single pulse, whatever the data.
  it("gives exactly 1 for one pulse, even without any thermal data", () => {
    expect(repetitionScale({ network: null, curves: noCurves, tEq: 0.1, period: 1, count: 1 })).toEqual({
      scale: 1,
      flag: null,
    });
  });

  // Derived from §7: superposition when (N − 1)·T + t_eq is within the data, else the duty-cycle impedance.
  it("without a network: superposition when the curves reach (N − 1)·T + t_eq, else the duty-cycle form", () => {
    // Z_th(t) = √t, read off curves from 1e-4 s to 1 s (within), R_th = 2 K/W. Superposition of 3 pulses of
    // 0.01 s every 0.1 s (derived): √0.01 + (√0.11 − √0.1) + (√0.21 − √0.2).
    const root: ImpedanceSource = { zth: (t) => (t >= 1e-4 && t <= 1 ? Math.sqrt(t) : null), rth: 2 };
    const three = repetitionScale({ network: null, curves: root, tEq: 0.01, period: 0.1, count: 3 });
    const superposed = 0.1 + (Math.sqrt(0.11) - Math.sqrt(0.1)) + (Math.sqrt(0.21) - Math.sqrt(0.2));
    expect(three.scale).toBeCloseTo(0.1 / superposed, 14);
    // Continuous: D·R + (1 − D)·Z(t + T) − Z(T) + Z(t) with D = 0.1.
    const train = repetitionScale({ network: null, curves: root, tEq: 0.01, period: 0.1 });
    const duty = 0.1 * 2 + 0.9 * Math.sqrt(0.11) - Math.sqrt(0.1) + 0.1;
    expect(train.scale).toBeCloseTo(0.1 / duty, 14);
    // 20 pulses reach 1.91 s, beyond the curves: the duty-cycle form.
    const twenty = repetitionScale({ network: null, curves: root, tEq: 0.01, period: 0.1, count: 20 });
    expect(twenty.scale).toBeCloseTo(0.1 / duty, 14);
  });

  // Derived from §7: s = min(1, Z_th(t_eq)/Z_rep); no-data with flag repetition-outside-data.
  it("caps at 1 and flags missing or inconsistent data", () => {
    const upRating: ImpedanceSource = { zth: (t) => (t < 0.5 ? 1 : 0.1), rth: 0.1 };
    expect(repetitionScale({ network: null, curves: upRating, tEq: 0.1, period: 1 })).toEqual({
      scale: 1,
      flag: null,
    });
    expect(repetitionScale({ network: null, curves: noCurves, tEq: 0.1, period: 1 })).toEqual({
      scale: null,
      flag: "repetition-outside-data",
    });
    const negative: ImpedanceSource = { zth: (t) => (t >= 1 ? 5 : 0.1), rth: 0.1 };
    expect(repetitionScale({ network: null, curves: negative, tEq: 0.1, period: 1 })).toEqual({
      scale: null,
      flag: "repetition-outside-data",
    });
  });
});
