import { describe, expect, it } from "vitest";
import { faultCaseSchema } from "@/lib/projects/schema";
import { fosterSchema, partSchema } from "./part-schema";

const issues = (result: {
  success: boolean;
  error?: { issues: { path: PropertyKey[]; message: string }[] };
}) => (result.error?.issues ?? []).map((i) => `${i.path.join(".")}: ${i.message}`);

describe("one input rule set for the part, fault-case and thermal forms", () => {
  it("shows every error at once, each with a unit-correct example or the sanity limit (issue 12)", () => {
    const result = partSchema.safeParse({
      partNumber: "",
      maker: "Ferrolite",
      technology: "si-mosfet",
      package: "TO-220",
      vdsMax: "4.2 mohm",
      idPulseMax: "1e12",
      tjMax: "20 m°C",
      unitCost: "2,5",
    });
    expect(issues(result)).toEqual([
      "partNumber: Required",
      `vdsMax: expected unit 'V', got 'Ω' (e.g. "100 V")`,
      "idPulseMax: 1e12\u2009A is above 1\u2009MA, the most a current can be here: check the prefix and the unit",
      `tjMax: °C takes no prefix (e.g. "175 °C")`,
      "currency: Give the currency of the cost (e.g. EUR)",
    ]);
  });

  it("reads decimal commas and prefixes in every quantity field", () => {
    const result = partSchema.parse({
      partNumber: "FX-1",
      maker: "Ferrolite",
      technology: "si-mosfet",
      package: "TO-220",
      vdsMax: "100",
      rdsOn: "4,2 m",
      tjMax: "175",
      rthJc: "0,45",
      unitCost: "2,35",
      currency: "eur",
    });
    expect([result.rdsOn, result.rthJc, result.unitCost]).toEqual([4.2e-3, 0.45, 2.35]);
    expect(fosterSchema.parse({ terms: [{ r: "0,12", tau: "250 µs" }] }).terms).toEqual([
      { r: 0.12, tau: 250e-6 },
    ]);
  });

  it("refuses issue 12's 1 GV × 2.5 kA fault case with its message, beside the other errors", () => {
    const result = faultCaseSchema.safeParse({
      name: "",
      kind: "rect",
      v: "1 GV",
      i: "2.5 kA",
      duration: "10 ms",
      repeat: { period: "1 ms", frequency: "", count: "" },
    });
    expect(issues(result)).toEqual([
      "name: Name the fault case",
      "v: 1\u2009GV is above 100\u2009kV, the most a voltage can be here: check the prefix and the unit",
      "repeat.period: The period must be longer than the pulse",
    ]);
  });
});
