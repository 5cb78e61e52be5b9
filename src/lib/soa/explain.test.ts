import { describe, expect, it } from "vitest";
import {
  CAUTION,
  curvesRead,
  decidingViews,
  explainFlag,
  explainFlags,
  FLAG_EXPLANATIONS,
  VERDICT_EXPLANATIONS,
} from "./explain";
import { FLAGS } from "./types";

describe("explain", () => {
  it("has plain words for every flag and every verdict", () => {
    for (const flag of FLAGS) expect(explainFlag(flag).length).toBeGreaterThan(40);
    expect(Object.keys(FLAG_EXPLANATIONS).sort()).toEqual([...FLAGS].sort());
    expect(Object.keys(VERDICT_EXPLANATIONS).sort()).toEqual(["fail", "marginal", "no-data", "pass"]);
  });

  it("says where an interpolated value can be optimistic (METHODS.md §3)", () => {
    expect(explainFlag("interpolated")).toContain("27 %");
  });

  it("explains a result's flags in order, and carries the caution (PRODUCT.md)", () => {
    expect(explainFlags(["over-voltage", "interpolated"])).toEqual([
      FLAG_EXPLANATIONS["over-voltage"],
      FLAG_EXPLANATIONS.interpolated,
    ]);
    expect(CAUTION).toContain("25 °C");
  });

  // Issue 10: no explanation promises more than its rule gives. The equal-energy rectangle bounds the heating only
  // for a record that starts from rest and a thermal model with positive terms (METHODS.md §6); revision 1's text
  // said it "never understates the heating" without either condition.
  it("states what the equal-energy rectangle assumes instead of promising it never understates", () => {
    const text = explainFlag("equivalent-rectangle");
    expect(text).toContain("starts from rest");
    expect(text).toContain("positive");
    expect(text).not.toMatch(/never understates the heating\.$/);
  });

  it("says which views decided a result", () => {
    const base = { curveVerdict: "pass", thermalVerdict: "pass", stabilityVerdict: null, flags: [] } as const;
    expect(decidingViews({ ...base, verdict: "pass" })).toEqual(["curves", "thermal"]);
    expect(decidingViews({ ...base, thermalVerdict: "fail", verdict: "fail" })).toEqual(["thermal"]);
    expect(
      decidingViews({ ...base, curveVerdict: "fail", verdict: "fail", flags: ["over-voltage"] }),
    ).toEqual(["hard-limit"]);
    expect(decidingViews({ ...base, verdict: "marginal", flags: ["ends-mid-pulse"] })).toEqual(["record"]);
  });
});

describe("curvesRead (METHODS.md §3)", () => {
  const widths = [1e-3, 10e-3, "DC" as const];
  it("names the curves a width is read from under each policy", () => {
    expect(curvesRead(widths, 1e-3, "loglog", false)).toBe("the 1\u2009ms curve");
    expect(curvesRead(widths, 2e-3, "loglog", false)).toBe("the 1\u2009ms and 10\u2009ms curves, log-log");
    expect(curvesRead(widths, 2e-3, "next-longer", false)).toBe("the 10\u2009ms curve");
    expect(curvesRead(widths, 2e-3, "thermal", true)).toBe("the 1\u2009ms curve scaled by the thermal model");
    expect(curvesRead(widths, 2e-3, "thermal", false)).toBe("the 10\u2009ms curve");
    expect(curvesRead(widths, 1, "loglog", false)).toBe("the DC curve");
    expect(curvesRead(widths, 1e-6, "loglog", false)).toBe("the 1\u2009ms curve, unchanged");
    expect(curvesRead([1e-3], 1, "loglog", false)).toBeNull();
    expect(curvesRead(widths, null, "loglog", false)).toBe("the DC curve");
  });
});
