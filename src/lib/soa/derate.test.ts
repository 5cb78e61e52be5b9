import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { derate } from "./derate";

describe("derate", () => {
  it("gives 0.5 at Tc 100 °C for Tj,max 175 °C and 0.52 at Tc 85 °C for Tj,max 150 °C", () => {
    // METHODS.md §10 worked values "derating" (derived from k = (Tj,max − Tc)/(Tj,max − T_ref), T_ref 25 °C).
    expect(derate(175, 100, 25)).toBeCloseTo(0.5, 12);
    expect(derate(150, 85)).toBeCloseTo(0.52, 12);
  });

  it("never up-rates below T_ref and allows nothing at or above Tj,max", () => {
    // METHODS.md §5: clamped to [0, 1].
    expect(derate(175, -40)).toBe(1);
    expect(derate(175, 25)).toBe(1);
    expect(derate(175, 175)).toBe(0);
    expect(derate(175, 200)).toBe(0);
  });

  // Derived from §5 (k clamped to [0, 1]); our choice: NaN inputs claim nothing, k = 0.
  it("gives 0 when nothing can be claimed: Tj,max ≤ T_ref or NaN inputs", () => {
    expect(derate(25, 20, 25)).toBe(0);
    expect(derate(20, 10, 25)).toBe(0);
    expect(derate(Number.NaN, 10)).toBe(0);
    expect(derate(175, Number.NaN)).toBe(0);
    expect(derate(175, 50, Number.NaN)).toBe(0);
  });

  // Derived from §5: k = (Tj,max − Tc)/(Tj,max − T_ref) falls as Tc rises.
  it("never rises with case temperature", () => {
    // Property (derived): k is a clamped decreasing linear function of Tc.
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 250, noNaN: true }),
        fc.double({ min: -60, max: 300, noNaN: true }),
        fc.double({ min: -60, max: 300, noNaN: true }),
        (tjMax, a, b) => {
          const [cool, hot] = a <= b ? [a, b] : [b, a];
          expect(derate(tjMax, hot)).toBeLessThanOrEqual(derate(tjMax, cool));
        },
      ),
    );
  });
});
