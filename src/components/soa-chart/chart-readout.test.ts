import { describe, expect, it } from "vitest";
import { limitReadout } from "./chart-readout";
import { makeAxis } from "./frame-model";

// METHODS.md §2 for the current read on a limit line (straight between its points on log-log axes); snapping to a
// line within 10 px and P = V·I in the readout are our choice.
describe("limitReadout", () => {
  const x = makeAxis({ kind: "log", domain: [1, 100] }, [0, 200]); // 100 px a decade
  const y = makeAxis({ kind: "log", domain: [1, 1000] }, [300, 0]);
  const lines = [
    {
      name: "1 ms",
      points: [
        [1, 100],
        [100, 1],
      ] as [number, number][],
    },
  ];

  it("reads the limit line under the pointer: 10 V allows 10 A on a line from (1 V, 100 A) to (100 V, 1 A)", () => {
    // Pixel 100 across is 10 V; the line's 10 A sits at row 200; the pointer is 6 px below it.
    const readout = limitReadout(lines, { px: 100, py: 206 }, x, y, true);
    expect(readout.title).toBe("1 ms limit");
    expect(readout.left).toBe(100);
    expect(readout.top).toBeCloseTo(200, 9);
    expect(readout.rows.map((r) => r.value)).toEqual(["10\u2009V", "10\u2009A", "100\u2009W"]);
  });

  it("reads the pointer's own place off the lines, without power when not asked", () => {
    // Row 100 is 100 A, 100 px above the line's 10 A at 10 V.
    const readout = limitReadout(lines, { px: 100, py: 100 }, x, y, false);
    expect(readout.title).toBeUndefined();
    expect(readout.top).toBe(100);
    expect(readout.rows.map((r) => r.value)).toEqual(["10\u2009V", "100\u2009A"]);
  });
});
