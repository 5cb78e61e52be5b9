import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { WORKED_TRANSFER } from "@/test/transfer-data";
import { largestCoefficient, prepareTransfer, stabilityVerdict, temperatureCoefficient } from "./stability";

// METHODS.md §10 "v2 instability": transfer at 25 °C (3 V, 1 A), (4 V, 20 A); at 125 °C (3 V, 3 A), (4 V, 25 A).
const worked = prepareTransfer(WORKED_TRANSFER);

describe("temperatureCoefficient (METHODS.md §12)", () => {
  // Worked value, METHODS.md §10 (derived): g = 3 + ln 5/ln 20 = 3.537244 V; I_b = 3·(25/3)^(g − 3) = 9.371847 A;
  // α = (I_b − 5)/100 = 0.0437185 A/K; S = 40 V·α·0.1380605 K/W = 0.241432.
  it("gives α = 0.0437185 A/K at 5 A and S = 0.241432 at 40 V with Z = 0.1380605 K/W", () => {
    const alpha = temperatureCoefficient(worked, 5) as number;
    expect(alpha).toBeCloseTo(0.0437185, 7);
    expect(40 * alpha * 0.1380605).toBeCloseTo(0.241432, 6);
  });

  it("has no value outside the cooler curve's currents, or where the hotter curve has no gate voltage", () => {
    expect(temperatureCoefficient(worked, 0.5)).toBeNull();
    expect(temperatureCoefficient(worked, 21)).toBeNull();
    const narrow = prepareTransfer({
      temps: [25, 125],
      curves: [
        [
          [3, 1],
          [4, 20],
        ],
        [
          [3.5, 8],
          [4, 25],
        ],
      ],
    });
    expect(temperatureCoefficient(narrow, 2)).toBeNull();
    expect(temperatureCoefficient(narrow, 10)).not.toBeNull();
  });
});

describe("largestCoefficient (METHODS.md §12)", () => {
  // Worked value, METHODS.md §10 "v2 instability, triangle" (derived): on the one piece, q = ln(25/3)/ln 20 and
  // α·(Tb − Ta) = C·I^q − I is largest at I* = (C·q)^(1/(1 − q)) = 13.1515 A, α = 0.0543034 A/K.
  it("finds the largest α inside the range, not at a point current: 0.0543034 A/K at 13.1515 A", () => {
    const best = largestCoefficient(worked, 20);
    expect(best?.alpha).toBeCloseTo(0.0543034, 7);
    expect(best?.current).toBeCloseTo(13.1515, 4);
  });

  it("is at least α at every current of the range (property, against a dense scan)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 20, noNaN: true }), (peak) => {
        const best = largestCoefficient(worked, peak);
        if (best === null) throw new Error("expected a value");
        for (let k = 0; k <= 200; k++) {
          const current = 1 + ((peak - 1) * k) / 200;
          expect(temperatureCoefficient(worked, current) as number).toBeLessThanOrEqual(best.alpha + 1e-12);
        }
      }),
    );
  });

  it("has no value when the range leaves the data", () => {
    expect(largestCoefficient(worked, 0.5)).toBeNull();
    expect(largestCoefficient(worked, 25)).toBeNull();
  });
});

describe("stabilityVerdict (METHODS.md §12)", () => {
  it("passes up to u_max, is marginal below 1 and fails at 1 and above", () => {
    expect(stabilityVerdict(0.8, 0.8)).toBe("pass");
    expect(stabilityVerdict(0.99, 0.8)).toBe("marginal");
    expect(stabilityVerdict(1, 0.8)).toBe("fail");
    expect(stabilityVerdict(-2, 0.8)).toBe("pass");
  });
});
