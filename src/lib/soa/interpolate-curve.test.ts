import { scaleLog } from "d3-scale";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { type CurvePoint, interpolateCurve } from "./interpolate-curve";

/** Independent log-log reading with d3-scale's scaleLog (general-purpose library): V → fraction → I. */
function d3Reading(points: readonly CurvePoint[], v: number): number {
  let j = 0;
  while (j + 2 < points.length && points[j + 1][0] <= v) j++;
  const [[v0, i0], [v1, i1]] = [points[j], points[j + 1]];
  const fraction = scaleLog().domain([v0, v1]).range([0, 1])(v);
  return scaleLog().domain([i0, i1]).range([0, 1]).invert(fraction);
}

/**
 * Curves of 2–10 points, V strictly rising (neighbours at least 0.1 % apart, as a digitiser gives them: closer
 * points make ln(V_(j+1)/V_j) tiny and amplify rounding in any implementation), every V and I > 0.
 */
const curveArb = fc
  .array(
    fc.tuple(
      fc.double({ min: 0.1, max: 1000, noNaN: true }),
      fc.double({ min: 0.01, max: 1e4, noNaN: true }),
    ),
    {
      minLength: 2,
      maxLength: 10,
    },
  )
  .map((pts) =>
    pts.sort((a, b) => a[0] - b[0]).filter((p, k, all) => k === 0 || p[0] > all[k - 1][0] * (1 + 1e-3)),
  )
  .filter((pts) => pts.length >= 2) as fc.Arbitrary<CurvePoint[]>;

describe("interpolateCurve", () => {
  it("reads 44.7214 A at 20 V between (10 V, 100 A) and (40 V, 20 A)", () => {
    // METHODS.md §10 worked value "along a curve" (derived): 100·2^(ln 0.2/ln 4) = 44.7214 A.
    const { current, flag } = interpolateCurve(
      [
        [10, 100],
        [40, 20],
      ],
      20,
    );
    expect(current).toBeCloseTo(44.7214, 4);
    expect(Math.abs((current as number) / 44.7214 - 1)).toBeLessThan(1e-6);
    expect(flag).toBeNull();
  });

  it("agrees with an independent log-log reading through d3-scale's scaleLog", () => {
    // Reference: d3-scale scaleLog (general-purpose library), one log scale per axis.
    fc.assert(
      fc.property(curveArb, fc.double({ min: 0, max: 1, noNaN: true }), (points, u) => {
        const [first, last] = [points[0][0], points[points.length - 1][0]];
        // Clamped: first·(last/first)^1 can round one ulp above the last point, outside the curve.
        const v = Math.min(last, first * (last / first) ** u);
        const expected = d3Reading(points, v);
        const { current } = interpolateCurve(points, v);
        // Two correct implementations agree to 1e-9 relative (METHODS.md); rounding alone stays far below that.
        expect(Math.abs((current as number) / expected - 1)).toBeLessThan(1e-10);
      }),
    );
  });

  // Derived from §2: exact at every digitised point.
  it("is exact at every digitised point", () => {
    fc.assert(
      fc.property(curveArb, (points) => {
        for (const [v, i] of points) expect(interpolateCurve(points, v)).toEqual({ current: i, flag: null });
      }),
    );
  });

  // Derived from §2: I(V) = I_j·(V/V_j)^s, a straight line on log-log axes.
  it("is a straight line on log-log axes within a segment (constant slope)", () => {
    // Derived: a power law I = I_j·(V/V_j)^s has the same log-log slope everywhere between V_j and V_(j+1).
    const points: CurvePoint[] = [
      [2, 50],
      [20, 8],
    ];
    const at = (v: number) => Math.log(interpolateCurve(points, v).current as number);
    const slope1 = (at(4) - at(3)) / (Math.log(4) - Math.log(3));
    const slope2 = (at(15) - at(9)) / (Math.log(15) - Math.log(9));
    expect(slope1).toBeCloseTo(Math.log(8 / 50) / Math.log(10), 12);
    expect(slope2).toBeCloseTo(slope1, 12);
  });

  // Derived from §2: below V_1 the first current, flag below-curve-range; above V_n no value.
  it("holds the first current below the curve's range and gives nothing above it", () => {
    const points: CurvePoint[] = [
      [1, 100],
      [10, 30],
    ];
    expect(interpolateCurve(points, 0.5)).toEqual({ current: 100, flag: "below-curve-range" });
    expect(interpolateCurve(points, 0)).toEqual({ current: 100, flag: "below-curve-range" });
    expect(interpolateCurve(points, -3)).toEqual({ current: 100, flag: "below-curve-range" });
    expect(interpolateCurve(points, 10.0001)).toEqual({ current: null, flag: "above-curve-range" });
    expect(interpolateCurve(points, Number.POSITIVE_INFINITY)).toEqual({
      current: null,
      flag: "above-curve-range",
    });
  });

  // Our choice: nothing to read gives no value, and no flag that would explain a reading.
  it("gives no value and no flag for an empty curve or a NaN voltage", () => {
    expect(interpolateCurve([], 5)).toEqual({ current: null, flag: null });
    expect(interpolateCurve([[1, 2]], Number.NaN)).toEqual({ current: null, flag: null });
  });

  // Derived from §2: a one-point curve has V_1 = V_n; below it the first current, above it nothing.
  it("reads a one-point curve at its voltage only", () => {
    expect(interpolateCurve([[5, 7]], 5)).toEqual({ current: 7, flag: null });
    expect(interpolateCurve([[5, 7]], 4)).toEqual({ current: 7, flag: "below-curve-range" });
    expect(interpolateCurve([[5, 7]], 6)).toEqual({ current: null, flag: "above-curve-range" });
  });
});
