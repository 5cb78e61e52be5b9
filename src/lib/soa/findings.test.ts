import { describe, expect, it } from "vitest";
import {
  CROSSING_TOLERANCE,
  findCurveSetIssues,
  RATING_MISMATCH_LIMIT,
  RESISTOR_SLOPE_LIMIT,
  THERMAL_MISMATCH_LIMIT,
} from "./findings";
import { zth } from "./foster";
import type { CurveSet } from "./types";

describe("findCurveSetIssues", () => {
  // Our choice (findings.ts header): a clean set has no findings.
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

  // Derived from §1: two points with the same V are an input error; findings.ts reports them in digitised order.
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

  // Derived from §1: every V and I finite and > 0.
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
    expect(findings.map((f) => [f.kind, f.curve?.index, f.location])).toEqual([
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

  // Derived from §3 (v2): a longer pulse never carries more current than a shorter one.
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
    expect(crossings.map((f) => [f.curve?.index, f.location, f.size])).toEqual([
      [1, { v: 20 }, "+50 %"],
      [2, { v: 40 }, "+29 %"],
    ]);
    expect(crossings[0].message).toContain("10\u2009ms curve lies above the 1\u2009ms curve at 20\u2009V");
  });

  // Our choice: curves within 5 % of each other are digitising noise, not a crossing (after issue 12's report).
  it("leaves digitising noise on a shared R_DS(on) line or package limit alone, within 5 %", () => {
    expect(CROSSING_TOLERANCE).toBe(0.05);
    // Issue 12's report: a 100 µs curve at 31.7 A against a 10 µs curve at 31.1 A at 187 mV (+1.9 %), where both
    // were digitised from the same R_DS(on) line; then the same pair with the longer curve 6 % above.
    const set = (excess: number): CurveSet => ({
      curves: [
        {
          duration: 1e-5,
          points: [
            [0.1, 16.6],
            [0.187, 31.1],
            [2, 300],
            [100, 60],
          ],
        },
        {
          duration: 1e-4,
          points: [
            [0.187, 31.1 * excess],
            [2, 290],
            [100, 20],
          ],
        },
      ],
    });
    expect(findCurveSetIssues(set(31.7 / 31.1))).toEqual([]);
    expect(findCurveSetIssues(set(1.04))).toEqual([]);
    const found = findCurveSetIssues(set(1.06));
    expect(found.map((f) => [f.kind, f.size])).toEqual([["longer-above-shorter", "+6 %"]]);
  });

  // Our choice: stable keys, so a verifier's acceptance survives a re-upload of the same data.
  it("keys a finding by what it is, so the same finding found again has the same key", () => {
    const set: CurveSet = {
      curves: [
        {
          duration: 1e-3,
          points: [
            [1, 100],
            [40, 10],
          ],
        },
        {
          duration: 1e-2,
          points: [
            [1, 100],
            [40, 30],
          ],
        },
      ],
    };
    const [first] = findCurveSetIssues(set);
    expect(first.key).toBe("longer-above-shorter|0.01000|1\u2009ms");
    expect(findCurveSetIssues(structuredClone(set))[0].key).toBe(first.key);
  });

  // Our choice (findings.ts header): curves are compared on their common V range only.
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

  // Our choice: a 20 % tolerance between the curves' power level and §4's Z_th (digitising noise is 1–4 %).
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
    expect(findings.map((f) => [f.kind, f.curve?.index, f.location])).toEqual([
      ["thermal-mismatch", 1, { v: 10 }],
      ["thermal-mismatch", 2, { v: 10 }],
    ]);
    expect(findings[0].message).toContain("by 30 %");
    expect(findings[1].message).toContain("by -30 %");
    expect(findCurveSetIssues(set, { tjMax: 175 })).toEqual([]);
    expect(findCurveSetIssues(set, { tjMax: 20, foster })).toEqual([]);
  });

  // Our choice: a 10 % tolerance between §4's R_th = Σ R_i and the rated R_th(j-c).
  it("finds a thermal model whose ΣR_i disagrees with the rated R_th(j-c) by more than 10 %", () => {
    expect(RATING_MISMATCH_LIMIT).toBe(0.1);
    const foster = [
      { r: 0.3, tau: 1e-3 },
      { r: 0.3, tau: 1e-2 },
    ];
    // Derived: ΣR_i = 0.6 K/W; against 0.5 K/W that is +20 %, against 0.56 K/W +7 %.
    const found = findCurveSetIssues({ curves: [] }, { tjMax: 175, foster, rthJc: 0.5 });
    expect(found.map((f) => [f.kind, f.size, f.curve, f.key])).toEqual([
      ["rating-mismatch", "+20 %", undefined, "rating-mismatch|part|"],
    ]);
    expect(found[0].message).toContain("R_th(j-c)");
    expect(findCurveSetIssues({ curves: [] }, { tjMax: 175, foster, rthJc: 0.56 })).toEqual([]);
    expect(findCurveSetIssues({ curves: [] }, { tjMax: 175, foster, rthJc: null })).toEqual([]);
    expect(findCurveSetIssues({ curves: [] }, { tjMax: 175, rthJc: 0.5 })).toEqual([]);
  });
});
