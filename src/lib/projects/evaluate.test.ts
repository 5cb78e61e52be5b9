import { describe, expect, it } from "vitest";
import { evaluate, type ProjectPulse } from "./evaluate";

// A part with the two-term Foster network of METHODS.md §10 ("two terms") and one DC-wide curve set; a 1 s pulse
// at 10 W is long against the case path's 0.5 s time constant, so the case rises with it (METHODS.md §14).
const limits = {
  vdsMax: 100,
  tjMax: 175,
  foster: [
    { r: 0.1, tau: 1e-3 },
    { r: 0.4, tau: 0.1 },
  ],
  soa: {
    curves: [
      {
        duration: 10,
        points: [
          [1, 100],
          [100, 1],
        ] as [number, number][],
      },
    ],
  },
};

const pulse: ProjectPulse = {
  id: "p",
  source: "fault-case",
  name: "stall",
  caseTemp: 25,
  v: 10,
  i: 1,
  duration: 1,
  kind: "rect",
  pulse: { id: "p", kind: "rect", v: 10, i: 1, duration: 1 },
};

describe("evaluate(candidates, pulses, policy, caseNetwork)", () => {
  it("heats the case through the project's case path when one is given, and flags it", async () => {
    const held = await evaluate([{ partId: "a", limits }], [pulse], {});
    const heated = await evaluate([{ partId: "a", limits }], [pulse], {}, [{ r: 2, tau: 0.5 }]);
    expect(held.results.a.p.flags).not.toContain("case-heating");
    expect(heated.results.a.p.flags).toContain("case-heating");
    // ΔT_ca = 10 W · 2 K/W · (1 − e^−2) = 17.293 K (METHODS.md §4 one-term step response, §14 sum).
    expect(heated.results.a.p.tjPeak! - held.results.a.p.tjPeak!).toBeCloseTo(20 * (1 - Math.exp(-2)), 3);
  });
});
