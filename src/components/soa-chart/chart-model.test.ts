import { describe, expect, it } from "vitest";
import { chartDomains, placePulse } from "./chart-model";
import type { ChartCurve, ChartPulse } from "./types";

const curves: ChartCurve[] = [
  {
    duration: 1e-3,
    points: [
      [0.1, 20],
      [2, 300],
      [100, 6],
    ],
  },
];
const pulse = (id: string, v: number, i: number): ChartPulse => ({ id, v, i, verdict: "fail", label: id });

describe("chartDomains", () => {
  it("keeps the axes on the curves' decades and lets a nearby pulse stretch them by one decade", () => {
    expect(chartDomains({ curves, pulses: [] })).toEqual({ x: [0.1, 100], y: [1, 1000] });
    expect(chartDomains({ curves, pulses: [pulse("near", 500, 2)] })).toEqual({
      x: [0.1, 1000],
      y: [1, 1000],
    });
  });

  it("does not stretch eight decades for issue 12's 1 GV × 2.5 kA pulse", () => {
    expect(chartDomains({ curves, pulses: [pulse("absurd", 1e9, 2500)] })).toEqual({
      x: [0.1, 100],
      y: [1, 1000],
    });
  });

  it("without curves, the pulses set the decades", () => {
    expect(chartDomains({ curves: [], pulses: [pulse("a", 48, 12)] })).toEqual({
      x: [10, 1000],
      y: [10, 1000],
    });
  });
});

describe("placePulse", () => {
  it("holds an off-scale pulse at the edge and says on which axis", () => {
    const domains = { x: [0.1, 100] as [number, number], y: [10, 1000] as [number, number] };
    expect(placePulse({ v: 1e9, i: 2500 }, domains)).toEqual({
      v: 100,
      i: 1000,
      off: { v: true, i: true },
      offScale: "1\u2009GV, 2.5\u2009kA",
    });
    expect(placePulse({ v: 48, i: 12 }, domains)).toEqual({
      v: 48,
      i: 12,
      off: { v: false, i: false },
      offScale: "",
    });
    expect(placePulse({ v: 48, i: 1 }, domains)).toEqual({
      v: 48,
      i: 10,
      off: { v: false, i: true },
      offScale: "1\u2009A",
    });
  });
});
