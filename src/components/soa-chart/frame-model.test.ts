import { describe, expect, it } from "vitest";
import { axisTicks, linePath, makeAxis, plotAxes, SNAP_DISTANCE, snapToLine } from "./frame-model";

// Common practice, no source: a log axis has major ticks and labels at each power of ten, minor ticks at 2…9 of
// it; a linear axis has d3's round ticks (1, 2 or 5 × 10^k apart).
describe("axisTicks", () => {
  it("labels a log axis's decades in engineering notation and keeps the 2…9 minors", () => {
    const ticks = axisTicks({ kind: "log", domain: [1, 1000] });
    expect(ticks.major).toEqual([
      { value: 1, label: "1" },
      { value: 10, label: "10" },
      { value: 100, label: "100" },
      { value: 1000, label: "1k" },
    ]);
    expect(ticks.minor).toHaveLength(3 * 8);
    expect(ticks.minor.slice(0, 3)).toEqual([2, 3, 4]);
  });

  it("writes small decades with a prefix below plainFrom and plainly above it", () => {
    const labels = (plainFrom?: number) =>
      axisTicks({ kind: "log", domain: [1e-5, 1e-3], plainFrom }).major.map((t) => t.label);
    expect(labels()).toEqual(["10µ", "100µ", "1m"]);
    expect(labels(1e-5)).toEqual(["0.00001", "0.0001", "0.001"]);
  });

  it("gives a linear axis round steps, labelled by its format, and no minors", () => {
    // 0 to 50 ms in about 5 ticks: steps of 10 ms (1, 2 or 5 × 10^k).
    const ticks = axisTicks({ kind: "linear", domain: [0, 0.05], count: 5, format: (t) => `${t * 1000} ms` });
    expect(ticks.major.map((t) => t.label)).toEqual(["0 ms", "10 ms", "20 ms", "30 ms", "40 ms", "50 ms"]);
    expect(ticks.minor).toEqual([]);
  });
});

// Our choice: x runs left to right across the plot, y bottom to top; a nice linear domain ends on round ticks.
describe("plotAxes and makeAxis", () => {
  const plot = { left: 50, top: 10, width: 200, height: 100 };

  it("puts a log axis's decades evenly across the plot box", () => {
    const { x, y } = plotAxes(plot, { kind: "log", domain: [0.1, 100] }, { kind: "log", domain: [1, 100] });
    // Three decades over 200 px: one every 66.7 px; two decades up 100 px: one every 50 px.
    expect([0.1, 1, 10, 100].map((v) => x.scale(v))).toEqual(
      [50, 50 + 200 / 3, 50 + 400 / 3, 250].map((p) => expect.closeTo(p)),
    );
    expect([1, 10, 100].map((i) => y.scale(i))).toEqual([110, 60, 10].map((p) => expect.closeTo(p)));
    expect(x.scale.invert(150)).toBeCloseTo(10 ** 0.5, 9);
  });

  it("widens a nice linear domain to round values and clamps where asked", () => {
    expect(makeAxis({ kind: "linear", domain: [0.3, 9.6], nice: true }, [0, 100]).domain).toEqual([0, 10]);
    const clamped = makeAxis({ kind: "log", domain: [1, 100], clamp: true }, [100, 0]);
    expect(clamped.scale(1e6)).toBe(0);
  });
});

describe("linePath", () => {
  // Our choice: a tenth of a pixel is finer than any screen or PNG export at twice the size.
  it("moves to the first point and draws to the others, to a tenth of a pixel", () => {
    const x = makeAxis({ kind: "linear", domain: [0, 10] }, [0, 100]).scale;
    const y = makeAxis({ kind: "linear", domain: [0, 10] }, [100, 0]).scale;
    expect(
      linePath(
        [
          [0, 0],
          [5, 2.5],
          [10, 10 / 3],
        ],
        x,
        y,
      ),
    ).toBe("M0.0,100.0L50.0,75.0L100.0,66.7");
  });
});

// METHODS.md §2 for the value read on a line (straight between points on log-log axes); the snap distance is our
// choice.
describe("snapToLine", () => {
  const y = makeAxis({ kind: "log", domain: [1, 1000] }, [300, 0]).scale; // 100 px a decade
  const lines = [
    {
      name: "a",
      points: [
        [1, 100],
        [100, 1],
      ] as [number, number][],
    },
    {
      name: "b",
      points: [
        [1, 1000],
        [10, 100],
      ] as [number, number][],
    },
  ];

  it("reads the nearest line's current at the pointer's voltage when within the snap distance", () => {
    // At 10 V line a allows 10 A (half way along its log-log segment), at pixel row 200; line b allows 100 A.
    const hit = snapToLine(lines, 10, 200 + SNAP_DISTANCE - 1, y);
    expect(hit?.line.name).toBe("a");
    expect(hit?.current).toBeCloseTo(10, 9);
    expect(snapToLine(lines, 10, 104, y)?.line.name).toBe("b");
  });

  it("reads nothing beyond the snap distance or past a line's last point", () => {
    expect(snapToLine(lines, 10, 200 + SNAP_DISTANCE + 1, y)).toBeNull();
    // At 50 V only line a is defined (b ends at 10 V): 2 A, at row 300 − 100·log10(2).
    expect(snapToLine(lines, 50, 300 - 100 * Math.log10(2), y)?.line.name).toBe("a");
    expect(snapToLine([lines[1]], 50, 300 - 100 * Math.log10(2), y)).toBeNull();
  });
});
