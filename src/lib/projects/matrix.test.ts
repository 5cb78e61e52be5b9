import { describe, expect, it } from "vitest";
import { matrixCandidate as candidate, cellResult as result } from "@/test/matrix-data";
import { rankCandidates } from "./matrix";

describe("rankCandidates", () => {
  it("puts parts that pass everything first, by worst-case utilisation, then by cost", () => {
    const rows = rankCandidates(
      [
        candidate("cheap-fail", 0.5),
        candidate("pricey-pass", 4),
        candidate("cheap-pass", 1),
        candidate("tight-pass", 0.2),
      ],
      ["a", "b"],
      {
        "cheap-fail": { a: result("fail", 1.4), b: result("pass", 0.1) },
        "pricey-pass": { a: result("pass", 0.3), b: result("pass", 0.5) },
        "cheap-pass": { a: result("pass", 0.5), b: result("pass", 0.2) },
        "tight-pass": { a: result("pass", 0.79), b: result("pass", 0.1) },
      },
    );
    expect(rows.map((r) => r.partId)).toEqual(["cheap-pass", "pricey-pass", "tight-pass", "cheap-fail"]);
    expect(rows.map((r) => r.worstUtilisation)).toEqual([0.5, 0.5, 0.79, 1.4]);
    expect(rows[3]).toMatchObject({ worstVerdict: "fail", passesAll: false, rank: 4 });
  });

  it("ranks marginal before no data before fail, and a fail without utilisation last among fails", () => {
    const rows = rankCandidates(
      [candidate("hot"), candidate("fail"), candidate("nodata"), candidate("marginal")],
      ["a"],
      {
        hot: { a: result("fail", null) },
        fail: { a: result("fail", 2) },
        nodata: { a: result("no-data", null) },
        marginal: { a: result("marginal", 0.9) },
      },
    );
    expect(rows.map((r) => r.partId)).toEqual(["marginal", "nodata", "fail", "hot"]);
  });

  it("judges a candidate without curves, or a project without pulses, as no data", () => {
    const rows = rankCandidates([{ ...candidate("bare"), hasCurves: false }], [], {});
    expect(rows[0]).toMatchObject({ worstVerdict: "no-data", passesAll: false, worstUtilisation: null });
  });
});
