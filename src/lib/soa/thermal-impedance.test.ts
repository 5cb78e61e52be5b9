import { describe, expect, it } from "vitest";
import { prepareCurveSet } from "./curve-set";
import { zth } from "./foster";
import { curvePowerLevel, impedanceFromCurves, impedanceFromFoster } from "./thermal-impedance";

// Power levels: 1 ms → max(10·40, 40·15) = 600 W; 10 ms → 300 W; DC → 100 W. Tj,max 175 °C, T_ref 25 °C.
const set = prepareCurveSet({
  curves: [
    {
      duration: 1e-3,
      points: [
        [10, 40],
        [40, 15],
      ],
    },
    {
      duration: 1e-2,
      points: [
        [10, 30],
        [40, 5],
      ],
    },
    { duration: "DC", points: [[50, 2]] },
  ],
});

describe("curvePowerLevel", () => {
  it("is the largest V·I on the curve, 0 when empty (P = V·I: common practice, no source)", () => {
    expect(curvePowerLevel(set.finite[0])).toBe(600);
    expect(curvePowerLevel({ points: [] })).toBe(0);
  });
});

describe("impedanceFromCurves", () => {
  it("reads Z_k = (Tj,max − T_ref)/P_k at the digitised widths and log-log between them", () => {
    // METHODS.md §7; Z_θ per JEDEC JESD24-3. 150 K / 600 W = 0.25 K/W, 150 K / 300 W = 0.5 K/W.
    const source = impedanceFromCurves(set, 175);
    expect(source.zth(1e-3)).toBeCloseTo(0.25, 15);
    expect(source.zth(1e-2)).toBeCloseTo(0.5, 15);
    // Derived: halfway in ln t is the geometric mean.
    expect(source.zth(Math.sqrt(10) * 1e-3)).toBeCloseTo(Math.sqrt(0.25 * 0.5), 12);
    expect(source.rth).toBeCloseTo(1.5, 15);
  });

  // Derived from §7: R_th from the part, else from the DC curve.
  it("prefers the part's R_th(j-c) to the DC curve", () => {
    expect(impedanceFromCurves(set, 175, 1.2).rth).toBe(1.2);
  });

  // Derived from §7: a Z_th value outside what the data gives is no data; §3: width tolerance 1e-9.
  it("says nothing outside the digitised widths (1e-9 relative), for NaN, without DC curve or R_th", () => {
    const source = impedanceFromCurves(set, 175);
    expect(source.zth(0.99e-3)).toBeNull();
    expect(source.zth(1.01e-2)).toBeNull();
    expect(source.zth(1e-2 * (1 + 5e-10))).toBeCloseTo(0.5, 12);
    expect(source.zth(1e-3 * (1 - 5e-10))).toBeCloseTo(0.25, 12);
    expect(source.zth(Number.NaN)).toBeNull();
    const noDc = impedanceFromCurves(
      prepareCurveSet({ curves: [{ duration: 1e-3, points: [[1, 1]] }] }),
      175,
    );
    expect(noDc.rth).toBeNull();
    expect(noDc.zth(1e-3)).toBeCloseTo(150, 12);
    expect(impedanceFromCurves(prepareCurveSet({ curves: [] }), 175).zth(1)).toBeNull();
  });

  // Derived from §7: Z_k = (Tj,max − T_ref)/P_k needs Tj,max > T_ref.
  it("derives nothing when Tj,max ≤ T_ref", () => {
    const source = impedanceFromCurves(set, 25);
    expect(source.zth(1e-3)).toBeNull();
    expect(source.rth).toBeNull();
  });
});

describe("impedanceFromFoster", () => {
  it("uses Z_th of the network and R_th = Σ R_i (METHODS.md §4)", () => {
    const network = [
      { r: 0.1, tau: 1e-3 },
      { r: 0.4, tau: 0.1 },
    ];
    const source = impedanceFromFoster(network);
    expect(source.zth(1e-2)).toBe(zth(network, 1e-2));
    expect(source.rth).toBeCloseTo(0.5, 15);
  });
});
