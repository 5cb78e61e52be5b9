import fc from "fast-check";
import { describe, expect, test } from "vitest";
import type { Curve } from "@/lib/soa/types";
import { parseCurveSetCsv } from "./curve-set";
import { curvesToLongCsv, formatWidth } from "./curve-set-export";

describe("formatWidth", () => {
  test.each([
    [1e-5, "10us"],
    [1e-4, "100us"],
    [1e-3, "1ms"],
    [1.5e-3, "1.5ms"],
    [1e-2, "10ms"],
    [1, "1s"],
    [2.5e-7, "250ns"],
    [5e-10, "5e-10"],
    [5000, "5000"],
    ["DC", "DC"],
  ] as const)("writes %s s as %s", (seconds, label) => {
    // derived: SI prefixes (common practice, no source)
    expect(formatWidth(seconds)).toBe(label);
  });
});

describe("curvesToLongCsv", () => {
  test("writes the header, one row per point and a final newline", () => {
    const curves: Curve[] = [
      {
        duration: 1e-4,
        points: [
          [1, 100],
          [10, 50],
        ],
      },
      { duration: "DC", points: [[1, 1 / 3]] },
    ];
    expect(curvesToLongCsv(curves)).toBe(
      "pulse width,V_DS [V],I_D [A]\n100us,1,100\n100us,10,50\nDC,1,0.3333333333333333\n",
    );
    expect(curvesToLongCsv(curves, { digits: 3 })).toContain("DC,1,0.333\n");
  });

  test("reads back exactly through parseCurveSetCsv", () => {
    const width = fc.oneof(
      fc.constant<"DC">("DC"),
      fc.double({ min: 1e-9, max: 100, noNaN: true }).filter((d) => d > 0),
    );
    const point = fc.tuple(
      fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
      fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
    );
    const curve = fc.record({
      duration: width,
      points: fc.uniqueArray(point, { minLength: 2, maxLength: 8, selector: (p) => p[0] }),
    });
    const curveSet = fc.uniqueArray(curve, {
      minLength: 1,
      maxLength: 5,
      // Widths within the parser's 1e-9 relative tolerance are one width; keep them apart.
      selector: (c) => (c.duration === "DC" ? "DC" : c.duration.toPrecision(8)),
    });
    fc.assert(
      fc.property(curveSet, (curves) => {
        const result = parseCurveSetCsv(curvesToLongCsv(curves));
        if (!result.ok) throw new Error(result.errors[0].message);
        result.curves.forEach((parsed, k) => {
          const sorted = [...curves[k].points].sort((a, b) => a[0] - b[0]);
          expect(parsed.points).toEqual(sorted);
          expect(parsed.duration).toBe(curves[k].duration);
        });
      }),
      { numRuns: 200 },
    );
  });
});
