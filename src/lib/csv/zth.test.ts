import { describe, expect, it } from "vitest";
import { parseZthCsv } from "./zth";

describe("parseZthCsv", () => {
  it("reads a headed file with the time unit in the header, sorted by t", () => {
    const result = parseZthCsv("t [ms];Zth [K/W]\r\n10;0,40\n0,1;0,02\n1;0,12\n100;0,55\n");
    expect(result).toEqual({
      ok: true,
      points: [
        [1e-4, 0.02],
        [1e-3, 0.12],
        [1e-2, 0.4],
        [1e-1, 0.55],
      ],
    });
  });

  it("reads a file without header in seconds", () => {
    const result = parseZthCsv("1e-5,0.01\n1e-4,0.03\n1e-3,0.1\n1e-2,0.3\n");
    expect(result.ok && result.points[0]).toEqual([1e-5, 0.01]);
  });

  it("names the row and column of a bad value", () => {
    const result = parseZthCsv("t [s],Zth [K/W]\n1e-4,0.02\n1e-3,-1\n1e-2,x\n1e-1,0.5\n");
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.errors.map((e) => e.message)).toEqual([
        "row 3, column Zth [K/W]: '-1' is not a number greater than 0",
        "row 4, column Zth [K/W]: 'x' is not a number greater than 0",
      ]);
    }
  });

  it("asks for at least 4 points and refuses two at the same time", () => {
    expect(parseZthCsv("1e-3,0.1\n1e-2,0.3\n").ok).toBe(false);
    const same = parseZthCsv("1e-3,0.1\n1e-3,0.2\n1e-2,0.3\n1e-1,0.5\n");
    expect(!same.ok && same.errors[0].reason).toMatch(/two points at t/);
  });
});
