import { describe, expect, it } from "vitest";
import * as soa from "./index";

describe("the engine's barrel", () => {
  it("exposes the check, the contract and every unit, the thermal ones included", () => {
    for (const name of [
      "runCheck",
      "checkPulse",
      "prepareCheck",
      "handleCheckRequest",
      "handleCheckText",
      "validateCheckRequest",
      "interpolateCurve",
      "allowedCurrent",
      "derate",
      "triangleEquivalent",
      "waveformEquivalent",
      "dutyCycleImpedance",
      "repetitionScale",
      "findCurveSetIssues",
      "inrushPulses",
      "currentLimitFault",
      "tripWindow",
      "clampTurnOff",
      "explainFlag",
      "parseQuantity",
      "formatQuantity",
      "zth",
      "rth",
      "rectRise",
      "trainRise",
      "trianglePeakRise",
      "waveformRise",
      "fitFoster",
    ]) {
      expect(typeof (soa as Record<string, unknown>)[name], name).toBe("function");
    }
    expect(typeof soa.checkRequestSchema.safeParse).toBe("function");
    expect(soa.FLAGS).toContain("repetition-outside-data");
    expect(soa.DEFAULT_POLICY.utilisationLimit).toBe(0.8);
  });
});
