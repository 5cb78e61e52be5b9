import { describe, expect, it } from "vitest";
import { curveVerdict, thermalVerdict, utilisation, worseVerdict } from "./verdict";

describe("worseVerdict", () => {
  it("orders fail > no-data > marginal > pass (METHODS.md §8)", () => {
    expect(worseVerdict("pass", "marginal")).toBe("marginal");
    expect(worseVerdict("marginal", "no-data")).toBe("no-data");
    expect(worseVerdict("no-data", "fail")).toBe("fail");
    expect(worseVerdict("fail", "pass")).toBe("fail");
    expect(worseVerdict()).toBe("pass");
  });
});

describe("curveVerdict", () => {
  const base = { current: 8, allowed: 10, utilisationLimit: 0.8, hardFail: false };
  // Derived from §8: pass if u ≤ u_max, marginal if u ≤ 1, fail beyond.
  it("passes up to the utilisation limit, is marginal up to 1, fails beyond", () => {
    expect(curveVerdict(base)).toBe("pass");
    expect(curveVerdict({ ...base, current: 9 })).toBe("marginal");
    expect(curveVerdict({ ...base, current: 10 })).toBe("marginal");
    expect(curveVerdict({ ...base, current: 10.0001 })).toBe("fail");
  });

  // Derived from §2 and §8.
  it("fails on a hard limit whatever the curves say, and has no data without an allowed current", () => {
    expect(curveVerdict({ ...base, hardFail: true })).toBe("fail");
    expect(curveVerdict({ ...base, allowed: null, hardFail: true })).toBe("fail");
    expect(curveVerdict({ ...base, allowed: null })).toBe("no-data");
  });

  // Derived from §8: I_allowed = 0 is a fail; our choice: a NaN current fails rather than passes.
  it("fails when nothing is allowed, and on a NaN current", () => {
    expect(curveVerdict({ ...base, allowed: 0 })).toBe("fail");
    expect(curveVerdict({ ...base, current: Number.NaN })).toBe("fail");
  });
});

describe("utilisation", () => {
  // Derived from §8: u = I/I_allowed, null at I_allowed = 0 (JSON has no infinity).
  it("is I/I_allowed, and null when the allowed current is null or 0 (JSON has no infinity)", () => {
    expect(utilisation(12, 15)).toBeCloseTo(0.8, 15);
    expect(utilisation(12, null)).toBeNull();
    expect(utilisation(12, 0)).toBeNull();
  });
});

describe("thermalVerdict", () => {
  it("passes up to Tj,max − guard, is marginal up to Tj,max, fails beyond (METHODS.md §8)", () => {
    expect(thermalVerdict(150, 175, 25)).toBe("pass");
    expect(thermalVerdict(150.1, 175, 25)).toBe("marginal");
    expect(thermalVerdict(175, 175, 25)).toBe("marginal");
    expect(thermalVerdict(175.1, 175, 25)).toBe("fail");
    expect(thermalVerdict(Number.NaN, 175, 25)).toBe("fail");
  });
});
