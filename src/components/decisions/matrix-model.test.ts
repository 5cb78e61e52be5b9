import { describe, expect, it } from "vitest";
import {
  matrixCandidate as candidate,
  checkedPulse as pulse,
  cellResult as result,
} from "@/test/matrix-data";
import { bestPassing, filterFrom, pulseCounts, rankAll, visiblePulses } from "./matrix-model";
import type { MatrixData } from "./types";

const data: MatrixData = {
  candidates: [candidate("a", 1), candidate("b", 2)],
  pulses: [pulse("f1", "fault-case"), pulse("m1", "measured"), pulse("c1", "capture")],
  results: {
    a: { f1: result("pass", 0.3), m1: result("fail", 1.4), c1: result("pass", 0.2) },
    b: { f1: result("pass", 0.5), m1: result("pass", 0.6), c1: result("pass", 0.4) },
  },
};

describe("matrix filter", () => {
  it("filterFrom(params) reads ?pulses and ?failures=1, anything else is the default", () => {
    expect(filterFrom(new URLSearchParams(""))).toEqual({ scope: "all", failuresOnly: false });
    expect(filterFrom(new URLSearchParams("pulses=measured&failures=1"))).toEqual({
      scope: "measured",
      failuresOnly: true,
    });
    expect(filterFrom(new URLSearchParams("pulses=nonsense&failures=yes"))).toEqual({
      scope: "all",
      failuresOnly: false,
    });
  });

  it("visiblePulses(data, filter) counts captures as measured and keeps only pulses some candidate fails", () => {
    const ids = (f: Parameters<typeof visiblePulses>[1]) => visiblePulses(data, f).map((p) => p.id);
    expect(ids({ scope: "fault-cases", failuresOnly: false })).toEqual(["f1"]);
    expect(ids({ scope: "measured", failuresOnly: false })).toEqual(["m1", "c1"]);
    expect(ids({ scope: "all", failuresOnly: true })).toEqual(["m1"]);
    expect(ids({ scope: "fault-cases", failuresOnly: true })).toEqual([]);
  });

  it("pulseCounts(pulses) counts each source", () => {
    expect(pulseCounts(data.pulses)).toEqual({ faultCases: 1, measured: 1, captures: 1 });
  });
});

describe("ranking", () => {
  it("rankAll(data) weighs every pulse: a part failing a measured pulse ranks after one that passes all", () => {
    const ranking = rankAll(data);
    expect(ranking.map((r) => r.partId)).toEqual(["b", "a"]);
    expect(bestPassing(ranking)).toBe("b");
  });

  it("bestPassing(ranking) is null when no candidate passes every pulse", () => {
    const failing = {
      ...data,
      results: { ...data.results, b: { ...data.results.b, f1: result("marginal", 0.9) } },
    };
    expect(bestPassing(rankAll(failing))).toBeNull();
  });
});
