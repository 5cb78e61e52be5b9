import { describe, expect, it } from "vitest";
import { findCurveSetIssues, RESISTOR_SLOPE_LIMIT, THERMAL_MISMATCH_LIMIT } from "./findings";
import { zth } from "./foster";
import type { CurveSet } from "./types";

describe("findCurveSetIssues", () => {
  it("finds nothing in a clean set, or in an empty one", () => {
    const clean: CurveSet = {
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 100],
            [10, 50],
            [50, 5],
          ],
        },
        {
          duration: "DC",
          points: [
            [1, 100],
            [10, 10],
          ],
        },
      ],
    };
    expect(findCurveSetIssues(clean)).toEqual([]);
    expect(findCurveSetIssues({ curves: [] })).toEqual([]);
  });

  it("finds points not strictly increasing in V, in the order digitised", () => {
    const findings = findCurveSetIssues({
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 100],
            [10, 50],
            [5, 60],
            [5, 60],
          ],
        },
      ],
    });
    expect(findings.map((f) => [f.kind, f.location])).toEqual([
      ["not-increasing", { index: 2 }],
      ["not-increasing", { index: 3 }],
    ]);
    expect(findings[0].curve).toEqual({ index: 0, duration: 1e-3 });
    expect(findings[1].message).toContain("repeats");
  });

  it("finds invalid points and empty curves, and leaves invalid points out of the rest", () => {
    const findings = findCurveSetIssues({
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 100],
            [Number.NaN, 5],
            [0, 1],
            [10, -2],
            [20, 10],
          ],
        },
        { duration: 1e-2, points: [] },
      ],
    });
    expect(findings.map((f) => [f.kind, f.curve.index, f.location])).toEqual([
      ["invalid-point", 0, { index: 1 }],
      ["invalid-point", 0, { index: 2 }],
      ["invalid-point", 0, { index: 3 }],
      ["empty-curve", 1, { index: 0 }],
    ]);
  });

  it("finds segments steeper than a resistor line (log-log slope > +1.05)", () => {
    // Common practice, no source: an R_DS(on) line has slope +1 on log-log axes.
    expect(RESISTOR_SLOPE_LIMIT).toBe(1.05);
    const findings = findCurveSetIssues({
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 10],
            [2, 20.5],
            [4, 50],
            [8, 20],
          ],
        },
      ],
    });
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ kind: "steeper-than-resistor", location: { v: 2 } });
    expect(findings[0].message).toContain("1.29");
  });

  it("finds a longer pulse's curve above a shorter one, at the voltage of the largest excess", () => {
    const findings = findCurveSetIssues({
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 100],
            [10, 40],
            [40, 10],
          ],
        },
        {
          duration: 1e-2,
          points: [
            [2, 90],
            [20, 30],
            [80, 2],
          ],
        },
        {
          duration: "DC",
          points: [
            [1, 100],
            [40, 10],
          ],
        },
      ],
    });
    const crossings = findings.filter((f) => f.kind === "longer-above-shorter");
    // Derived. 10 ms vs 1 ms, compared at 2, 10, 20, 40 V: above at 2, 10 and 20 V, most at 20 V, where
    // the 1 ms curve reads 40·2^(ln 0.25/ln 4) = 20 A and the 10 ms curve 30 A. DC vs 1 ms: below
    // everywhere. DC vs 10 ms, compared at 2, 20, 40 V: above at 40 V only (10 A against
    // 30·2^(ln(1/15)/ln 4) = 7.75 A).
    expect(crossings.map((f) => [f.curve.index, f.location])).toEqual([
      [1, { v: 20 }],
      [2, { v: 40 }],
    ]);
    expect(crossings[0].message).toContain("10\u2009ms curve lies above the 1\u2009ms curve at 20\u2009V");
  });

  it("does not compare curves without a common voltage range, nor report equal curves", () => {
    const findings = findCurveSetIssues({
      curves: [
        { duration: 1e-3, points: [[1, 10]] },
        { duration: 1e-2, points: [[5, 20]] },
        { duration: 1e-1, points: [[1, 10]] },
      ],
    });
    expect(findings).toEqual([]);
  });

  it("finds curves whose power level disagrees with the Foster network by more than 20 %", () => {
    expect(THERMAL_MISMATCH_LIMIT).toBe(0.2);
    const foster = [{ r: 0.5, tau: 1e-2 }];
    const level = (t: number) => 150 / zth(foster, t);
    const set: CurveSet = {
      curves: [
        { duration: 1e-3, points: [[10, level(1e-3) / 10]] },
        { duration: 1e-2, points: [[10, (1.3 * level(1e-2)) / 10]] },
        { duration: "DC", points: [[10, (0.7 * 150) / 0.5 / 10]] },
      ],
    };
    const findings = findCurveSetIssues(set, { tjMax: 175, foster });
    expect(findings.map((f) => [f.kind, f.curve.index, f.location])).toEqual([
      ["thermal-mismatch", 1, { v: 10 }],
      ["thermal-mismatch", 2, { v: 10 }],
    ]);
    expect(findings[0].message).toContain("by 30 %");
    expect(findings[1].message).toContain("by -30 %");
    expect(findCurveSetIssues(set, { tjMax: 175 })).toEqual([]);
    expect(findCurveSetIssues(set, { tjMax: 20, foster })).toEqual([]);
  });
});
