import { describe, expect, it } from "vitest";
import { WORKED_TRANSFER } from "@/test/transfer-data";
import { prepareTransfer } from "./stability";
import { transferCrossings } from "./zero-tc";

// Hand-made data (derived): ln I is linear in V_GS on each curve, 25 °C from 1 A at 3 V to 25 A at 4 V, 150 °C from
// √5 A to 5√5 A. The logs are equal where ln 1 + x·ln 25 = ln √5 + x·ln 5, x = 1/2: V_GS 3.5 V, I_D 5 A.
const crossing = {
  temps: [25, 150] as [number, number],
  curves: [
    [
      [3, 1],
      [4, 25],
    ],
    [
      [3, Math.sqrt(5)],
      [4, 5 * Math.sqrt(5)],
    ],
  ] as [[number, number][], [number, number][]],
};

describe("transferCrossings(transfer)", () => {
  // Derived from §12: where the two transfer curves cross, α = 0 (worked by hand above).
  it("finds the zero-temperature-coefficient point at 3.5 V, 5 A (derived above)", () => {
    const result = transferCrossings(prepareTransfer(crossing))!;
    expect(result.crossings).toHaveLength(1);
    expect(result.crossings[0].gate).toBeCloseTo(3.5, 12);
    expect(result.crossings[0].current).toBeCloseTo(5, 12);
    expect(result.crossings[0].falling).toBe(true);
    expect(result.first).toBe(1);
    expect(result.last).toBe(-1);
  });

  it("reports no crossing, hotter curve above at both ends, for the METHODS.md §10 instability data", () => {
    const result = transferCrossings(prepareTransfer(WORKED_TRANSFER))!;
    expect(result.crossings).toEqual([]);
    expect(result.first).toBe(1);
    expect(result.last).toBe(1);
  });

  // Derived from §12: outside a curve's points it has no value.
  it("is null when the curves share no gate voltage range", () => {
    expect(
      transferCrossings(
        prepareTransfer({
          temps: [25, 125],
          curves: [
            [
              [1, 1],
              [2, 2],
            ],
            [
              [3, 1],
              [4, 2],
            ],
          ],
        }),
      ),
    ).toBeNull();
  });
});
