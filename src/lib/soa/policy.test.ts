import { describe, expect, it } from "vitest";
import { DEFAULT_POLICY, resolvePolicy } from "./policy";

describe("resolvePolicy", () => {
  it("fills in u_max 0.8, guard 25 K, voltage limit 0.8 and log-log reading by default (METHODS.md §3, §8)", () => {
    expect(resolvePolicy()).toEqual({
      utilisationLimit: 0.8,
      tjGuard: 25,
      voltageLimit: 0.8,
      betweenCurves: "loglog",
    });
    expect(resolvePolicy({})).toEqual(DEFAULT_POLICY);
  });

  // Derived from §8: the margin policy's fields are the project's; our choice: 0 is a value, not a default.
  it("keeps every field given, zero included", () => {
    expect(
      resolvePolicy({ utilisationLimit: 1, tjGuard: 0, voltageLimit: 1, betweenCurves: "thermal" }),
    ).toEqual({
      utilisationLimit: 1,
      tjGuard: 0,
      voltageLimit: 1,
      betweenCurves: "thermal",
    });
  });
});
