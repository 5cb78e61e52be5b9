import { describe, expect, it } from "vitest";
import { parseTransferCsv } from "@/lib/csv/transfer";
import { reviewTransfer } from "./transfer-findings";

function review(text: string) {
  const parsed = parseTransferCsv(text);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => e.message).join("; "));
  return reviewTransfer(parsed.curves);
}

// Hand-made data (derived): 25 °C from 1 A at 3 V to 25 A at 4 V, 150 °C from √5 A to 5√5 A, linear in ln I_D;
// they cross at 3.5 V, 5 A (see src/lib/soa/zero-tc.test.ts).
const crossing = `T_j [°C],V_GS [V],I_D [A]
25,3,1
25,4,25
150,3,${Math.sqrt(5)}
150,4,${5 * Math.sqrt(5)}
`;

describe("parseTransferCsv(text)", () => {
  it("reads one curve per temperature, cooler first, each in the order given, with header units", () => {
    const parsed = parseTransferCsv("Tj;Vgs [V];Id [mA]\n125;3;3000\n125;4;25000\n25;3;1000\n25;4;20000\n");
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.curves.map((c) => c.temp)).toEqual([25, 125]);
    expect(parsed.curves[0].points.map((p) => [p.row, p.vgs, p.id])).toEqual([
      [4, 3, 1],
      [5, 4, 20],
    ]);
  });

  it("names the row and column of every cell it cannot read", () => {
    const parsed = parseTransferCsv("T_j,V_GS,I_D\n25,3,abc\n25,,2\n150,3,-1\n");
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.errors.map((e) => e.message)).toEqual([
      "row 2, column I_D: 'abc' is not a number",
      "row 3, column V_GS: the cell is empty",
      "row 4, column I_D: '-1' must be greater than 0",
    ]);
  });

  it("refuses more than two temperatures", () => {
    const parsed = parseTransferCsv("25,3,1\n25,4,2\n100,3,1\n100,4,2\n150,3,1\n150,4,2\n");
    expect(parsed.ok).toBe(false);
  });
});

describe("reviewTransfer(curves)", () => {
  it("accepts curves that cross the usual way and gives the zero-temperature-coefficient point", () => {
    const result = review(crossing);
    expect(result.findings).toEqual([]);
    expect(result.data?.temps).toEqual([25, 150]);
    expect(result.zeroTc?.gate).toBeCloseTo(3.5, 12);
    expect(result.zeroTc?.current).toBeCloseTo(5, 12);
  });

  it("blocks a curve whose V_GS does not ascend, naming the row", () => {
    const result = review("25,3,1\n25,4,20\n25,3.5,25\n150,3,3\n150,4,25\n");
    expect(result.data).toBeNull();
    expect(result.findings.map((f) => [f.key, f.severity, f.row])).toEqual([
      ["vgs-not-ascending", "error", 3],
    ]);
  });

  it("blocks two curves at one temperature", () => {
    const result = review("25,3,1\n25,4,20\n");
    expect(result.findings.map((f) => f.key)).toEqual(["temperatures-equal"]);
    expect(result.data).toBeNull();
  });

  it("warns when the curves do not cross, hotter above (METHODS.md §10 instability data)", () => {
    const result = review("25,3,1\n25,4,20\n125,3,3\n125,4,25\n");
    expect(result.findings.map((f) => [f.key, f.severity])).toEqual([["no-crossing-hot-above", "warning"]]);
    expect(result.data).not.toBeNull();
  });

  it("warns when the hotter curve lies below everywhere (temperatures swapped)", () => {
    const result = review("25,3,3\n25,4,25\n125,3,1\n125,4,20\n");
    expect(result.findings.map((f) => f.key)).toEqual(["no-crossing-hot-below"]);
  });

  it("warns when the curves cross the wrong way", () => {
    const swapped = `25,3,${Math.sqrt(5)}\n25,4,${5 * Math.sqrt(5)}\n150,3,1\n150,4,25\n`;
    expect(review(swapped).findings.map((f) => f.key)).toEqual(["crosses-wrong-way"]);
  });
});
