import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ACROSS_WIDTHS } from "@/test/curve-data";
import { allowedCurrent } from "./allowed-current";
import { prepareCurveSet } from "./curve-set";
import type { Curve } from "./types";

/** METHODS.md §10 "across widths": 40 A at 1 ms and 16 A at 10 ms at the same voltage (flat over 1–100 V). */
const acrossWidths = prepareCurveSet({
  curves: ACROSS_WIDTHS,
});

const withDc = prepareCurveSet({
  curves: [
    {
      duration: 1e-4,
      points: [
        [1, 100],
        [50, 30],
      ],
    },
    {
      duration: 1e-3,
      points: [
        [1, 80],
        [30, 10],
      ],
    },
    {
      duration: "DC",
      points: [
        [1, 20],
        [60, 1],
      ],
    },
  ],
});

// SOA curves as rated per IEC 60747-8: one limit line per pulse width, single pulse, reference case
// temperature.
describe("allowedCurrent", () => {
  it("interpolates log-log between widths: 30.358 A at 2 ms and 25.298 A at √10 ms", () => {
    // METHODS.md §10 worked values "across widths" (derived); 3.162 ms in the table is √10 ms = 3.16228 ms.
    const at2 = allowedCurrent(acrossWidths, 20, 2e-3);
    expect(at2.current).toBeCloseTo(30.358, 3);
    expect(at2.flags).toEqual(["interpolated"]);
    expect(allowedCurrent(acrossWidths, 20, Math.sqrt(10) * 1e-3).current).toBeCloseTo(25.298, 3);
    // Derived: halfway in ln t is the geometric mean of the two currents.
    expect(allowedCurrent(acrossWidths, 20, Math.sqrt(10) * 1e-3).current).toBeCloseTo(
      Math.sqrt(40 * 16),
      10,
    );
  });

  it("reads the next longer curve under the strict policy: 16 A", () => {
    // METHODS.md §10 worked value "across widths, strict" (derived).
    expect(allowedCurrent(acrossWidths, 20, 2e-3, "next-longer")).toEqual({
      current: expect.closeTo(16, 12),
      flags: ["next-longer-curve"],
    });
  });

  it("uses a curve whose width matches within 1e-9 relative", () => {
    expect(allowedCurrent(acrossWidths, 20, 1e-3 * (1 + 5e-10))).toEqual({
      current: expect.closeTo(40, 12),
      flags: [],
    });
    expect(allowedCurrent(acrossWidths, 20, 1e-2 * (1 - 5e-10), "next-longer")).toEqual({
      current: expect.closeTo(16, 12),
      flags: [],
    });
  });

  it("uses the shortest curve unchanged for shorter pulses", () => {
    expect(allowedCurrent(withDc, 10, 1e-6)).toEqual({
      current: allowedCurrent(withDc, 10, 1e-4).current,
      flags: ["shorter-than-shortest-curve"],
    });
  });

  it("uses the DC curve beyond the longest pulse curve, and nothing without one", () => {
    const dc = allowedCurrent(withDc, 1, 1);
    expect(dc).toEqual({ current: expect.closeTo(20, 12), flags: ["dc-curve-used"] });
    expect(allowedCurrent(withDc, 1, Number.POSITIVE_INFINITY)).toEqual(dc);
    expect(allowedCurrent(acrossWidths, 20, 1)).toEqual({
      current: null,
      flags: ["longer-than-longest-curve"],
    });
  });

  it("treats every width as beyond the finite curves of a DC-only set", () => {
    const dcOnly = prepareCurveSet({ curves: [{ duration: "DC", points: [[10, 3]] }] });
    expect(allowedCurrent(dcOnly, 5, 1e-6)).toEqual({
      current: expect.closeTo(3, 12),
      flags: ["dc-curve-used", "below-curve-range"],
    });
    expect(allowedCurrent(prepareCurveSet({ curves: [] }), 5, 1e-6)).toEqual({
      current: null,
      flags: ["longer-than-longest-curve"],
    });
  });

  it("has no value when a curve used has none at V, and says which end was left", () => {
    // 1 ms curve ends at 30 V, 100 µs curve at 50 V: at 40 V, between them, one side is missing.
    expect(allowedCurrent(withDc, 40, 3e-4)).toEqual({
      current: null,
      flags: ["interpolated", "above-curve-range"],
    });
    expect(allowedCurrent(withDc, 40, 3e-4, "next-longer")).toEqual({
      current: null,
      flags: ["next-longer-curve", "above-curve-range"],
    });
    expect(allowedCurrent(withDc, 0.5, 3e-4).flags).toEqual(["interpolated", "below-curve-range"]);
  });

  it("gives no value for a width that is NaN, zero or negative", () => {
    for (const w of [Number.NaN, 0, -1e-3])
      expect(allowedCurrent(withDc, 10, w)).toEqual({ current: null, flags: [] });
  });

  it("never rises with pulse width for curves that fall with width (both policies)", () => {
    // Property (derived): when every longer curve lies at or below every shorter one, so does any reading
    // between.
    const setArb = fc
      .record({
        vs: fc.uniqueArray(fc.double({ min: 0.5, max: 500, noNaN: true }), { minLength: 2, maxLength: 6 }),
        base: fc.array(fc.double({ min: 1, max: 1000, noNaN: true }), { minLength: 6, maxLength: 6 }),
        factors: fc.array(
          fc.array(fc.double({ min: 0.05, max: 1, noNaN: true }), { minLength: 6, maxLength: 6 }),
          {
            minLength: 1,
            maxLength: 4,
          },
        ),
        widths: fc.uniqueArray(fc.integer({ min: -6, max: 1 }), { minLength: 5, maxLength: 5 }),
        dc: fc.boolean(),
      })
      .map(({ vs, base, factors, widths, dc }) => {
        const sortedVs = [...vs].sort((a, b) => a - b);
        const sortedWidths = widths.map((e) => 10 ** e).sort((a, b) => a - b);
        let level = base.slice(0, sortedVs.length);
        const curves: Curve[] = [
          { duration: sortedWidths[0], points: sortedVs.map((v, k) => [v, level[k]]) },
        ];
        factors.forEach((f, c) => {
          level = level.map((i, k) => i * f[k]);
          const duration = dc && c === factors.length - 1 ? "DC" : sortedWidths[c + 1];
          curves.push({ duration, points: sortedVs.map((v, k) => [v, level[k]]) });
        });
        return { set: prepareCurveSet({ curves }), vMax: sortedVs[sortedVs.length - 1] };
      });
    fc.assert(
      fc.property(
        setArb,
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.array(fc.double({ min: -7, max: 2, noNaN: true }), { minLength: 2, maxLength: 2 }),
        fc.constantFrom("loglog" as const, "next-longer" as const),
        ({ set, vMax }, u, exponents, policy) => {
          const v = 0.3 * (vMax / 0.3) ** u;
          const [short, long] = exponents.map((e) => 10 ** e).sort((a, b) => a - b);
          const a = allowedCurrent(set, v, short, policy).current ?? 0;
          const b = allowedCurrent(set, v, long, policy).current ?? 0;
          expect(b).toBeLessThanOrEqual(a * (1 + 1e-12));
        },
      ),
    );
  });

  // METHODS.md §10 worked value "v2 thermal-scaled" (derived from the Foster formula): 40·Z(1 ms)/Z(2 ms).
  it("scales the next shorter curve by the thermal model under the thermal policy", () => {
    const network = [
      { r: 0.1, tau: 1e-3 },
      { r: 0.4, tau: 0.1 },
    ];
    const at2 = allowedCurrent(acrossWidths, 20, 2e-3, "thermal", network);
    expect(at2.current).toBeCloseTo(28.4752, 4);
    expect(at2.flags).toEqual(["thermal-scaled"]);
    // Beyond the longest curve the same rule replaces the DC curve: 16·Z(10 ms)/Z(20 ms).
    expect(allowedCurrent(acrossWidths, 20, 20e-3, "thermal", network).current).toBeCloseTo(12.805, 4);
    // Without a network it reads as the strict policy and says so.
    expect(allowedCurrent(acrossWidths, 20, 2e-3, "thermal")).toEqual({
      current: expect.closeTo(16, 12),
      flags: ["next-longer-curve", "thermal-scaling-unavailable"],
    });
  });

  // METHODS.md §10 worked value "v2 cap" (derived): curves that cross never let a longer pulse carry more.
  it("caps a reading by every shorter curve: 30 A at 2 ms when the 10 ms curve crosses above", () => {
    const crossing = prepareCurveSet({
      curves: [
        { duration: 1e-3, points: [[20, 30]] },
        { duration: 1e-2, points: [[20, 50]] },
        { duration: "DC", points: [[20, 60]] },
      ],
    });
    expect(allowedCurrent(crossing, 20, 2e-3)).toEqual({
      current: expect.closeTo(30, 12),
      flags: ["interpolated", "capped-by-shorter-curve"],
    });
    expect(allowedCurrent(crossing, 20, 1e-2).flags).toEqual(["capped-by-shorter-curve"]);
    expect(allowedCurrent(crossing, 20, 1).current).toBeCloseTo(30, 12);
    expect(allowedCurrent(crossing, 20, 5e-4).current).toBeCloseTo(30, 12);
  });

  it("never lets a longer pulse carry more than a shorter one, even for crossing curves", () => {
    // Property (METHODS.md §3, v2 cap): any curves, loglog or strict reading.
    const curveArb = fc.array(fc.double({ min: 1, max: 1000, noNaN: true }), { minLength: 3, maxLength: 3 });
    fc.assert(
      fc.property(
        fc.array(curveArb, { minLength: 1, maxLength: 4 }),
        fc.boolean(),
        fc.double({ min: 0.5, max: 60, noNaN: true }),
        fc.array(fc.double({ min: -7, max: 2, noNaN: true }), { minLength: 2, maxLength: 2 }),
        fc.constantFrom("loglog" as const, "next-longer" as const),
        (levels, dc, v, exponents, policy) => {
          const curves: Curve[] = levels.map((level, c) => ({
            duration: dc && c === levels.length - 1 ? "DC" : 10 ** (-5 + c),
            points: [
              [1, level[0]],
              [10, level[1]],
              [50, level[2]],
            ],
          }));
          const set = prepareCurveSet({ curves });
          const [short, long] = exponents.map((e) => 10 ** e).sort((a, b) => a - b);
          const a = allowedCurrent(set, v, short, policy).current;
          const b = allowedCurrent(set, v, long, policy).current;
          if (a !== null && b !== null) expect(b).toBeLessThanOrEqual(a * (1 + 1e-12));
        },
      ),
    );
  });
});
