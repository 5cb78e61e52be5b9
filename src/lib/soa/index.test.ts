import { describe, expect, it } from "vitest";
import * as check from "./check";
import * as contract from "./contract";
import * as foster from "./foster";
import * as soa from "./index";
import * as units from "./units";

describe("the engine's barrel", () => {
  // Our choice: callers import the engine from one place; the barrel must hand out the modules' own functions.
  it("re-exports each module's own functions, not copies or stand-ins", () => {
    expect(soa.runCheck).toBe(check.runCheck);
    expect(soa.checkPulse).toBe(check.checkPulse);
    expect(soa.prepareCheck).toBe(check.prepareCheck);
    expect(soa.handleCheckRequest).toBe(contract.handleCheckRequest);
    expect(soa.handleCheckText).toBe(contract.handleCheckText);
    expect(soa.zth).toBe(foster.zth);
    expect(soa.rth).toBe(foster.rth);
    expect(soa.parseQuantity).toBe(units.parseQuantity);
    expect(soa.formatQuantity).toBe(units.formatQuantity);
  });

  it("answers METHODS.md §10 worked values through the barrel", () => {
    // §10 "derating": Tj,max 175 °C, Tc 100 °C → 0.5; Tj,max 150 °C, Tc 85 °C → (150 − 85)/125 = 0.52.
    expect(soa.derate(175, 100)).toBeCloseTo(0.5, 12);
    expect(soa.derate(150, 85)).toBeCloseTo(0.52, 12);
    // §10 "one Foster term": Z(τ)/R = 1 − e^(−1) = 0.632121.
    expect(soa.zth([{ r: 1, tau: 1e-3 }], 1e-3)).toBeCloseTo(0.632121, 6);
    // §10 "along a curve": (10 V, 100 A), (40 V, 20 A) at 20 V: 100·2^(ln 0.2/ln 4) = 44.7214 A.
    expect(
      soa.interpolateCurve(
        [
          [10, 100],
          [40, 20],
        ],
        20,
      ).current,
    ).toBeCloseTo(44.7214, 4);
    // Units: engineering prefixes are parsed to SI (METHODS.md, introduction).
    expect(soa.parseQuantity("150us", "s")).toMatchObject({ ok: true, value: 1.5e-4 });
  });

  it("carries the contract's schema, the flag list and the default policy", () => {
    // METHODS.md §9: a request without pulses is refused with the path named.
    const refused = soa.checkRequestSchema.safeParse({ part: {}, caseTemp: 25 });
    expect(refused.success).toBe(false);
    // METHODS.md §7 (v2) names the flag; §8 the default utilisation limit of 0.8.
    expect(soa.FLAGS).toContain("repetition-outside-data");
    expect(soa.DEFAULT_POLICY.utilisationLimit).toBe(0.8);
    expect(soa.DEFAULT_POLICY.betweenCurves).toBe("loglog");
  });
});
