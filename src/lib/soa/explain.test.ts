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
import { FLAGS, type Flag } from "./types";

/**
 * What each explanation must say: the rule of METHODS.md behind the flag, in the words a reader would look for
 * (derived from the section named beside each). Typed by Flag, so a new flag fails to compile until it is added.
 */
const FLAG_FACTS: Record<Flag, RegExp[]> = {
  "over-voltage": [/maximum drain-source voltage/, /fail whatever/], // §2
  "over-current": [/maximum pulsed drain current/, /fail whatever/], // §2
  "voltage-margin": [/share of the maximum drain-source voltage/, /at best marginal/], // §8 (v2)
  "shorter-than-shortest-curve": [/shortest curve was used unchanged/], // §3
  interpolated: [/log-log/, /27 %/, /overstate/], // §3
  "next-longer-curve": [/next longer curve was read/], // §3
  "thermal-scaled": [/next shorter curve/, /I = I_k·Z_th\(t_k\)\/Z_th\(t\)/], // §3 (v2)
  "thermal-scaling-unavailable": [/no thermal model/, /next longer curve/], // §3 (v2)
  "dc-curve-used": [/DC curve was read/, /capped by every pulse curve/], // §3
  "longer-than-longest-curve": [/no DC curve/], // §3
  "capped-by-shorter-curve": [/shorter pulse width/, /never allowed more/], // §3 (v2)
  "below-curve-range": [/lowest point/, /lowest-voltage current was used/], // §2
  "above-curve-range": [/highest point/, /no allowed current/], // §2
  "equivalent-rectangle": [/energy divided by its peak power/, /its own width/], // §6
  "negative-power-clamped": [/negative power/, /taken as zero/], // §6
  "no-power": [/never dissipates positive power/], // §6
  "starts-mid-pulse": [/1 % of its peak power/, /DC curve/, /at best marginal/], // §6
  "ends-mid-pulse": [/1 % of its peak power/, /at best marginal/], // §6
  "repetition-applied": [/repetition scale/, /duty-cycle/], // §7
  "repetition-outside-data": [/do not reach the times/], // §7
  "thermal-instability": [/S = V·α·Z_th/, /1 or more/], // §12 (v2)
  "stability-outside-data": [/transfer characteristics/, /do not\s+reach/], // §12 (v2)
  avalanche: [/derated linearly to zero at Tj,max/, /V_DSS is used/], // §13 (v2)
  "over-avalanche-current": [/avalanche current rating/, /fail whatever/], // §13 (v2)
  "case-heating": [/hottest case/, /adds the case rise/], // §14 (v2)
};

describe("explain", () => {
  it("says for every flag the rule behind it, and for every verdict what it means (METHODS.md §2–§14, §8)", () => {
    expect(Object.keys(FLAG_EXPLANATIONS).sort()).toEqual([...FLAGS].sort());
    for (const flag of FLAGS)
      for (const fact of FLAG_FACTS[flag]) expect(explainFlag(flag), flag).toMatch(fact);
    expect(Object.keys(VERDICT_EXPLANATIONS).sort()).toEqual(["fail", "marginal", "no-data", "pass"]);
    expect(VERDICT_EXPLANATIONS.fail).toMatch(/hotter than its maximum/);
    expect(VERDICT_EXPLANATIONS.marginal).toMatch(/closer to them than the margin policy asks/);
    expect(VERDICT_EXPLANATIONS["no-data"]).toMatch(/do not cover this pulse/);
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

  // METHODS.md §8: the final verdict is the worst view's, and each result says which view decided.
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
