import { describe, expect, it } from "vitest";
import { DEFAULT_REF_CASE_TEMP, prepareCurveSet } from "./curve-set";

describe("prepareCurveSet", () => {
  // Derived from §1 (points sorted by V) and §3 (finite curves by duration, DC last).
  it("sorts points by V and finite curves by width, and keeps the DC curve apart", () => {
    const set = prepareCurveSet({
      refCaseTemp: 30,
      curves: [
        { duration: "DC", points: [[10, 1]] },
        {
          duration: 1e-2,
          points: [
            [40, 2],
            [1, 20],
          ],
        },
        { duration: 1e-4, points: [[5, 50]] },
      ],
    });
    expect(set.refCaseTemp).toBe(30);
    expect(set.finite.map((c) => [c.index, c.duration])).toEqual([
      [2, 1e-4],
      [1, 1e-2],
    ]);
    expect(set.finite[1].points).toEqual([
      [1, 20],
      [40, 2],
    ]);
    expect(set.dc).toEqual({ index: 0, duration: "DC", points: [[10, 1]] });
  });

  it("takes 25 °C as the reference case temperature by default (common practice, no source)", () => {
    expect(DEFAULT_REF_CASE_TEMP).toBe(25);
    expect(prepareCurveSet({ curves: [] })).toEqual({ refCaseTemp: 25, finite: [], dc: null });
  });

  // Our choice: preparation is lenient because validation (§9) has already refused such input.
  it("leaves out invalid points and curves, keeps the first of equal widths (validation rejects all)", () => {
    const set = prepareCurveSet({
      curves: [
        { duration: 1e-3, points: [[1, 2]] },
        { duration: 1e-3, points: [[3, 4]] },
        { duration: -1, points: [[1, 2]] },
        { duration: Number.NaN, points: [[1, 2]] },
        { duration: "DC", points: [[5, 6]] },
        { duration: "DC", points: [[7, 8]] },
        {
          duration: 1,
          points: [
            [Number.NaN, 1],
            [2, -1],
            [0, 3],
            [4, 5],
          ],
        },
      ],
    });
    expect(set.finite.map((c) => c.points)).toEqual([[[1, 2]], [[4, 5]]]);
    expect(set.dc?.points).toEqual([[5, 6]]);
  });
});
