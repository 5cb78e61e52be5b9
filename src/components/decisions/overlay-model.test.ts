import { describe, expect, it } from "vitest";
import { checkedPulse as pulse } from "@/test/matrix-data";
import { lineGroups } from "./overlay-model";

describe("overlay lines", () => {
  it("lineGroups(pulses) reads a triangle at half its width and merges pulses read alike", () => {
    const groups = lineGroups([
      pulse("t", "fault-case", { kind: "triangle", duration: 0.048 }),
      pulse("r", "measured", { duration: 0.024 }),
      pulse("x", "measured", { duration: null }),
      pulse("h", "fault-case", { duration: 0.024, caseTemp: 100 }),
    ]);
    expect(groups.map((g) => [g.width, g.caseTemp])).toEqual([
      [0.024, 85],
      [0.024, 100],
    ]);
  });
});
