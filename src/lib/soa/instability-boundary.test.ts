import { describe, expect, it } from "vitest";
import { WORKED_TRANSFER } from "@/test/transfer-data";
import { instabilityBoundary } from "./instability-boundary";
import { prepareTransfer, temperatureCoefficient } from "./stability";

// Transfer data of METHODS.md §10 ("v2 instability"): at 25 °C (3 V, 1 A), (4 V, 20 A); at 125 °C (3 V, 3 A),
// (4 V, 25 A). The curves do not cross inside the data, so α > 0 at every current of the cooler curve.
const transfer = prepareTransfer(WORKED_TRANSFER);

describe("instabilityBoundary(transfer, z)", () => {
  it("gives V_max = 40 V / S at 5 A, S = 0.241432 with Z = 0.1380605 K/W (METHODS.md §10 worked value)", () => {
    const z = 0.1380605;
    const alpha = temperatureCoefficient(transfer, 5)!;
    expect(alpha).toBeCloseTo(0.0437185, 6);
    const boundary = instabilityBoundary(transfer, z);
    // V_max(I) = 1/(α·Z) (METHODS.md §12) is 40 V / S at the worked point: S = 40·α·Z.
    const at = (i: number) => {
      const k = boundary.findIndex(([, c]) => c >= i);
      const [v0, i0] = boundary[k - 1];
      const [v1, i1] = boundary[k];
      return v0 * (v1 / v0) ** (Math.log(i / i0) / Math.log(i1 / i0));
    };
    expect(1 / (alpha * z)).toBeCloseTo(40 / 0.241432, 2);
    expect(at(5)).toBeCloseTo(40 / 0.241432, -0.5);
  });

  // Derived from §12: V_max(I) = 1/(α(I)·Z_th) over the currents where α > 0, read on the Ta curve.
  it("spans the cooler curve's currents, ascending, with every point where α > 0", () => {
    const boundary = instabilityBoundary(transfer, 0.1);
    expect(boundary[0][1]).toBeCloseTo(1, 12);
    expect(boundary[boundary.length - 1][1]).toBeCloseTo(20, 12);
    for (let k = 1; k < boundary.length; k++) expect(boundary[k][1]).toBeGreaterThan(boundary[k - 1][1]);
    for (const [v] of boundary) expect(v).toBeGreaterThan(0);
  });

  // Derived from §12: V_max = 1/(α·Z) has no meaning for Z ≤ 0.
  it("is empty for a thermal impedance that is not positive", () => {
    expect(instabilityBoundary(transfer, 0)).toEqual([]);
    expect(instabilityBoundary(transfer, Number.NaN)).toEqual([]);
  });

  // Derived from §12: the boundary is drawn only where α > 0.
  it("stops at the zero-temperature-coefficient point, where α turns negative", () => {
    // Hand-made data (derived): the hotter curve starts above and ends below, crossing at 5 A.
    const crossing = prepareTransfer({
      temps: [25, 150],
      curves: [
        [
          [3, 1],
          [4, 25],
        ],
        [
          [3, Math.sqrt(5)],
          [4, 5 * Math.sqrt(5)],
        ],
      ],
    });
    const boundary = instabilityBoundary(crossing, 0.2);
    expect(boundary.length).toBeGreaterThan(10);
    for (const [, i] of boundary) expect(i).toBeLessThan(5 + 1e-9);
  });
});
