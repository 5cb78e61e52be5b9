import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { zth } from "@/lib/soa/foster";
import { DEMO_WIDTHS, modelCurve, modelCurveSet, type SoaModel, thermalPower } from "./soa-model";

const BASE: SoaModel = {
  vdsMax: 100,
  tjMax: 175,
  rdsOnHot: 0.01,
  idContinuous: 50,
  idPulseMax: 100,
  foster: [{ r: 1, tau: 1e-3 }],
};

function expectPoints(actual: [number, number][], expected: [number, number][]): void {
  expect(actual).toHaveLength(expected.length);
  actual.forEach(([v, i], k) => {
    expect(v).toBeCloseTo(expected[k][0], 10);
    expect(i).toBeCloseTo(expected[k][1], 10);
  });
}

describe("modelCurve", () => {
  test("DC: R_DS(on) line, package limit I_D, constant power R_th, cut at V_DSS", () => {
    // derived: P = (175 − 25)/1 = 150 W; 50 A at 0.5 V on 10 mΩ; 150 W/50 A = 3 V; 150 W/100 V = 1.5 A
    expectPoints(modelCurve(BASE, "DC").points, [
      [0.1, 10],
      [0.5, 50],
      [3, 50],
      [100, 1.5],
    ]);
  });

  test("a pulse: I_DM and the power from Z_th(t_p)", () => {
    const power = 150 / zth(BASE.foster, 1e-3);
    expect(thermalPower(BASE, 1e-3)).toBeCloseTo(power, 9);
    // derived: 100 A at 1 V on 10 mΩ; P/100 A; P/100 V at V_DSS
    expectPoints(modelCurve(BASE, 1e-3).points, [
      [0.1, 10],
      [1, 100],
      [power / 100, 100],
      [100, power / 100],
    ]);
  });

  test("where the power line cuts the R_DS(on) line below the package limit, the flat part disappears", () => {
    const small = { ...BASE, idContinuous: 500 };
    // derived: V/0.01 = 150/V at V = √1.5 V
    expectPoints(modelCurve(small, "DC").points, [
      [0.1, 10],
      [Math.sqrt(1.5), Math.sqrt(1.5) / 0.01],
      [100, 1.5],
    ]);
  });

  test("thermal instability: I falls as V^-n above the knee", () => {
    const model = {
      ...BASE,
      instability: { exponent: 2, knees: [{ duration: "DC" as const, voltage: 20 }] },
    };
    // derived: 150 W/20 V = 7.5 A at the knee; 7.5 A · (20/100)² = 0.3 A at 100 V
    expectPoints(modelCurve(model, "DC").points, [
      [0.1, 10],
      [0.5, 50],
      [3, 50],
      [20, 7.5],
      [100, 0.3],
    ]);
    expect(modelCurve(model, 1e-3).points).toHaveLength(4);
  });

  test("every corner lies on the lowest limit, and the curve set has the demo widths", () => {
    const model = fc.record({
      rdsOnHot: fc.double({ min: 1e-3, max: 0.05, noNaN: true }),
      idContinuous: fc.double({ min: 10, max: 300, noNaN: true }),
      r: fc.double({ min: 0.1, max: 2, noNaN: true }),
      tau: fc.double({ min: 1e-5, max: 1e-1, noNaN: true }),
      knee: fc.double({ min: 2, max: 90, noNaN: true }),
    });
    fc.assert(
      fc.property(model, ({ rdsOnHot, idContinuous, r, tau, knee }) => {
        const m: SoaModel = {
          ...BASE,
          rdsOnHot,
          idContinuous,
          idPulseMax: 4 * idContinuous,
          foster: [{ r, tau }],
          instability: { exponent: 2, knees: [{ duration: "DC", voltage: knee }] },
        };
        const curves = modelCurveSet(m);
        expect(curves.map((c) => c.duration)).toEqual(DEMO_WIDTHS);
        for (const curve of curves) {
          const power = thermalPower(m, curve.duration);
          const pkg = curve.duration === "DC" ? idContinuous : 4 * idContinuous;
          for (const [v, i] of curve.points) {
            const unstable =
              curve.duration === "DC" ? (power / knee) * (knee / v) ** 2 : Number.POSITIVE_INFINITY;
            const lowest = Math.min(v / rdsOnHot, pkg, power / v, unstable);
            expect(Math.abs(i / lowest - 1)).toBeLessThan(1e-9);
          }
          expect(curve.points[0][0]).toBeCloseTo(0.1, 12);
          expect(curve.points.at(-1)?.[0]).toBeCloseTo(100, 9);
        }
      }),
    );
  });
});
