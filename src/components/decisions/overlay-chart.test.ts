import { describe, expect, it } from "vitest";
import { overlayLegend } from "./overlay-chart";
import type { OverlayLine, OverlayMarker } from "./overlay-model";

const line = (key: string, label: string): OverlayLine => ({
  key,
  partId: key,
  name: label,
  label,
  points: [
    [1, 10],
    [10, 1],
  ],
  stroke: "#000",
  text: "#000",
});
const marker = (id: string, verdict: OverlayMarker["verdict"]): OverlayMarker => ({
  id,
  v: 1,
  i: 1,
  verdict,
  name: id,
  byCandidate: [],
});

// Our choice: the legend names the heading, then each candidate's line, then each worst verdict present, in the
// order pass, marginal, fail, no data (the order of every verdict list in the product).
describe("overlayLegend", () => {
  it("lists the heading, the lines and the verdicts present in their fixed order", () => {
    const rows = overlayLegend(
      "Derated, T_C = 85 °C",
      [line("a", "QM 24 ms"), line("b", "BFL 24 ms")],
      [marker("p1", "fail"), marker("p2", "pass"), marker("p3", "fail")],
    );
    expect(rows.map((r) => [r.key, r.text, r.swatch.kind])).toEqual([
      ["h", "Derated, T_C = 85 °C", "heading"],
      ["a", "QM 24 ms", "line"],
      ["b", "BFL 24 ms", "line"],
      ["pass", "Pulse, worst: pass", "verdict"],
      ["fail", "Pulse, worst: fail", "verdict"],
    ]);
  });
});
