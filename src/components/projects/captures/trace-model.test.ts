import { describe, expect, it } from "vitest";
import { envelopePaths, panelDomain, type TraceSeries, visibleRange } from "./trace-model";

const series = (y: [number | null, number | null][], t = y.map((_, k) => k)): TraceSeries => ({
  key: "s",
  label: "s",
  t,
  y,
  stroke: "#000",
});

// Our choice: a window keeps one sample either side, so the drawn line reaches the plot's edges.
describe("visibleRange", () => {
  it("keeps the samples inside the window and one neighbour on each side", () => {
    const t = [0, 1, 2, 3, 4, 5];
    expect(visibleRange(t, 1.5, 3.5)).toEqual([1, 4]);
    expect(visibleRange(t, 0, 5)).toEqual([0, 5]);
    expect(visibleRange(t, 2, 2)).toEqual([1, 3]);
  });
});

// Our choice: 6 % room either side of the lowest and highest sample in the window; temperatures held within
// TEMPERATURE_DISPLAY_RANGE (−100 °C to 2000 °C) so a runaway result does not flatten the trace.
describe("panelDomain", () => {
  it("spans the window's lowest to highest sample with 6 % room", () => {
    const s = series([
      [0, 10],
      [20, 40],
      [100, 500],
    ]);
    // Window [0, 0.5] holds samples 0 and 1: 0 to 40, room 2.4.
    expect(panelDomain([s], [0, 0.5], "V")).toEqual([-2.4, 42.4].map((v) => expect.closeTo(v, 12)));
  });

  it("holds a runaway temperature at 2000 °C and gives a flat or empty trace a range", () => {
    const hot = series([
      [25, 25],
      [25, 1e9],
    ]);
    expect(panelDomain([hot], [0, 1], "°C")).toEqual(
      [25 - 118.5, 2000 + 118.5].map((v) => expect.closeTo(v, 9)),
    );
    expect(panelDomain([series([[5, 5]])], [0, 1], "A")).toEqual(
      [4 - 0.12, 6 + 0.12].map((v) => expect.closeTo(v, 12)),
    );
    expect(panelDomain([series([[null, null]])], [0, 1], "W")).toEqual(
      [-0.06, 1.06].map((v) => expect.closeTo(v, 12)),
    );
  });
});

// Common practice, no source: a min/max envelope (upper edge forward, lower edge back) keeps every spike of the
// samples a drawn step stands for; a gap in the data breaks the band.
describe("envelopePaths", () => {
  const unit = (v: number) => v;
  it("closes the band over each run of finite samples and breaks at a gap", () => {
    const s = series([
      [1, 2],
      [0, 3],
      [null, null],
      [4, 4],
    ]);
    expect(envelopePaths(s, [0, 3], unit, unit)).toEqual([
      "M0.0,2.0L1.0,3.0L1.0,0.0L0.0,1.0Z",
      "M3.0,4.0L3.0,4.0Z",
    ]);
  });
});
