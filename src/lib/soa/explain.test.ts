import { describe, expect, it } from "vitest";
import { CAUTION, explainFlag, explainFlags, FLAG_EXPLANATIONS, VERDICT_EXPLANATIONS } from "./explain";
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
});
