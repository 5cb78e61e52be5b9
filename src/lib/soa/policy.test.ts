import { describe, expect, it } from "vitest";
import { DEFAULT_POLICY, resolvePolicy } from "./policy";

describe("resolvePolicy", () => {
  it("fills in u_max 0.8, guard 25 K and log-log reading by default (METHODS.md §3, §8)", () => {
    expect(resolvePolicy()).toEqual({ utilisationLimit: 0.8, tjGuard: 25, betweenCurves: "loglog" });
    expect(resolvePolicy({})).toEqual(DEFAULT_POLICY);
  });

  it("keeps every field given, zero included", () => {
    expect(resolvePolicy({ utilisationLimit: 1, tjGuard: 0, betweenCurves: "next-longer" })).toEqual({
      utilisationLimit: 1,
      tjGuard: 0,
      betweenCurves: "next-longer",
    });
  });
});
