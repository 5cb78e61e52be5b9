import { describe, expect, test } from "vitest";
import { digitisedCurveSet, type ParsedCurve, parseCurveSetCsv } from "@/lib/csv/curve-set";
import { reviewTransfer } from "@/lib/library/transfer-findings";
import { inrushPulses } from "@/lib/soa/builders";
import { runCheck } from "@/lib/soa/check";
import { findCurveSetIssues } from "@/lib/soa/findings";
import { rth } from "@/lib/soa/foster";
import type { PulseResult } from "@/lib/soa/types";
import {
  DEMO_PARTS,
  DEMO_SCENARIO,
  type DemoPart,
  demoCurveSetCsv,
  demoCurveSetFileName,
  demoCurves,
} from "./parts";
import { DEMO_WIDTHS } from "./soa-model";

function part(number: string): DemoPart {
  const found = DEMO_PARTS.find((p) => p.partNumber === number);
  if (found === undefined) throw new Error(number);
  return found;
}

const TRENCH = part("QM-80T16");
const GENERAL = part("QM-100G28");
const LINEAR = part("BFL-100L55");

/** The curves as stored for the demo: the generated CSV, parsed by the upload path. */
function uploaded(p: DemoPart): ParsedCurve[] {
  const result = parseCurveSetCsv(demoCurveSetCsv(p));
  if (!result.ok) throw new Error(result.errors.map((e) => e.message).join("\n"));
  return result.curves;
}

function inrush(p: DemoPart, capacitance: number, caseTemp: number): PulseResult {
  const built = inrushPulses({ supply: 48, capacitance, slew: 1000 });
  if (!built.ok) throw new Error(built.reason);
  const limits = {
    vdsMax: p.vdsMax,
    tjMax: p.tjMax,
    rdsOn: p.rdsOn,
    idPulseMax: p.idPulseMax,
    rthJc: p.rthJc,
    foster: p.foster,
    soa: { curves: uploaded(p) },
  };
  return runCheck({ part: limits, caseTemp, pulses: built.pulses }).results[0];
}

function slopes(points: readonly (readonly [number, number])[]): number[] {
  return points.slice(1).map(([v, i], k) => Math.log(i / points[k][1]) / Math.log(v / points[k][0]));
}

describe("the demo parts", () => {
  test("three invented MOSFETs from two invented makers, with distinct part numbers", () => {
    expect(DEMO_PARTS).toHaveLength(3);
    expect(new Set(DEMO_PARTS.map((p) => p.maker)).size).toBe(2);
    expect(new Set(DEMO_PARTS.map((p) => p.partNumber)).size).toBe(3);
    for (const p of DEMO_PARTS) expect(p.notes).toContain("Invented for the Pulsefence demo");
  });

  test("ratings sit in the 80–100 V class with Tj,max 175 °C, and R_th(j-c) is the Foster network's sum", () => {
    for (const p of DEMO_PARTS) {
      expect(p.vdsMax).toBeGreaterThanOrEqual(80);
      expect(p.vdsMax).toBeLessThanOrEqual(100);
      expect(p.tjMax).toBe(175);
      expect(p.foster.length).toBeGreaterThanOrEqual(3);
      expect(p.foster.length).toBeLessThanOrEqual(4);
      // derived: R_th = Σ R_i (METHODS.md §4)
      expect(rth(p.foster)).toBeCloseTo(p.rthJc, 12);
      expect(p.idPulseMax).toBeGreaterThan(p.idContinuous);
      expect(p.unitCost).toBeGreaterThan(0);
    }
  });

  test("the lowest-R_DS(on) part is the trench part; the linear-mode part has higher R_DS(on) and lower R_th", () => {
    const lowest = DEMO_PARTS.reduce((a, b) => (b.rdsOn < a.rdsOn ? b : a));
    expect(lowest).toBe(TRENCH);
    expect(TRENCH.model.instability).toBeDefined();
    expect(LINEAR.model.instability).toBeUndefined();
    expect(LINEAR.rdsOn).toBeGreaterThan(TRENCH.rdsOn);
    expect(LINEAR.rthJc).toBeLessThan(TRENCH.rthJc);
    expect(demoCurveSetFileName(TRENCH)).toBe("QM-80T16-soa.csv");
  });
});

describe("the demo curve sets", () => {
  test.each(DEMO_PARTS.map((p) => [p.partNumber, p] as const))(
    "%s: the generated CSV parses back to the model's curves exactly",
    (_, p) => {
      const result = parseCurveSetCsv(demoCurveSetCsv(p));
      expect(result.ok && result.shape).toBe("long");
      if (!result.ok) return;
      expect(result.warnings).toEqual([]);
      expect(result.curves.map((c) => c.duration)).toEqual(DEMO_WIDTHS);
      expect(result.curves.map((c) => c.points)).toEqual(demoCurves(p).map((c) => c.points));
    },
  );

  test.each(DEMO_PARTS.map((p) => [p.partNumber, p] as const))(
    "%s: the engine finds no quality issue, its thermal-model comparison included",
    (_, p) => {
      // The engine's findings (findings.ts): order, slopes, crossings, and P_k against (Tj,max − 25)/Z_th(t_k).
      const set = digitisedCurveSet(uploaded(p));
      expect(findCurveSetIssues(set, { tjMax: p.tjMax, foster: p.foster })).toEqual([]);
    },
  );

  test("the trench part's long curves fall as V^-2 at high voltage; the linear-mode part's never faster than 1/V", () => {
    const trench = demoCurves(TRENCH);
    const dc = trench.find((c) => c.duration === "DC");
    // derived: the instability law I ∝ V^-2 (soa-model.ts), knee 12 V on DC
    expect(slopes(dc?.points ?? []).at(-1)).toBeCloseTo(-2, 9);
    expect(dc?.points.at(-2)?.[0]).toBeCloseTo(12, 9);
    for (const curve of demoCurves(LINEAR)) {
      for (const s of slopes(curve.points)) expect(s).toBeGreaterThanOrEqual(-1 - 1e-9);
    }
  });
});

describe("the demo story: pre-charge inrush, 48 V at 1 V/ms", () => {
  test("the builder gives the triangle of METHODS.md §11 (1000 µF → 1 A for 48 ms)", () => {
    // Reference: METHODS.md §11 worked example (1000 µF, 48 V, 1 V/ms → 1 A for 48 ms).
    const built = inrushPulses({ supply: 48, capacitance: 1e-3, slew: 1000 });
    expect(built.ok && built.pulses[0]).toMatchObject({ kind: "triangle", v: 48, i: 1, duration: 0.048 });
  });

  const cases = [1e-3, 1.5e-3, 2e-3].flatMap((c) => [60, 70, 85].map((tc) => [c * 1e6, tc, c] as const));

  test.each(cases)("%i µF at case %i °C: the lowest-R_DS(on) part fails on its curves", (_, caseTemp, c) => {
    const result = inrush(TRENCH, c, caseTemp);
    expect(result.verdict).toBe("fail");
    expect(result.utilisation).toBeGreaterThan(1);
    // The Foster network alone would have let it pass (METHODS.md §8: both views are needed).
    expect(result.tjPeak).toBeLessThan(TRENCH.tjMax - 25);
  });

  test.each(cases)("%i µF at case %i °C: the linear-mode part passes with margin", (_, caseTemp, c) => {
    const result = inrush(LINEAR, c, caseTemp);
    expect(result.verdict).toBe("pass");
    expect(result.utilisation).toBeLessThan(0.4);
    expect(result.tjPeak).toBeLessThan(LINEAR.tjMax - 50);
  });

  test("at the scenario's own case (1.5 mF, 85 °C) the general-purpose part passes on its curves", () => {
    const { caseTemp, inrush: circuit } = DEMO_SCENARIO;
    expect(inrush(GENERAL, circuit.capacitance, caseTemp).verdict).toBe("pass");
    expect(inrush(TRENCH, circuit.capacitance, caseTemp).verdict).toBe("fail");
    expect(inrush(LINEAR, circuit.capacitance, caseTemp).verdict).toBe("pass");
  });
});

describe("the demo story beyond the curves: thermal instability in the pre-charge (METHODS.md §12)", () => {
  function withTransfer(p: DemoPart): PulseResult {
    const { caseTemp, inrush: circuit } = DEMO_SCENARIO;
    const built = inrushPulses({
      supply: circuit.supply,
      capacitance: circuit.capacitance,
      slew: circuit.slew,
    });
    if (!built.ok) throw new Error(built.reason);
    const limits = {
      vdsMax: p.vdsMax,
      tjMax: p.tjMax,
      foster: p.foster,
      soa: { curves: uploaded(p) },
      transfer: p.transfer,
      avalanche: p.avalanche,
    };
    return runCheck({ part: limits, caseTemp, policy: { utilisationLimit: 0.8 }, pulses: built.pulses })
      .results[0];
  }

  test("every demo part's transfer data pass the upload's findings without an error", () => {
    for (const p of DEMO_PARTS) {
      const review = reviewTransfer(
        p.transfer.curves.map((curve, c) => ({
          temp: p.transfer.temps[c],
          points: curve.map(([vgs, id], k) => ({ row: k + 1, temp: p.transfer.temps[c], vgs, id })),
        })),
      );
      expect(review.findings).toEqual([]);
      expect(review.zeroTc).not.toBeNull();
    }
  });

  test("the general-purpose part passes on its curves and its thermal model but fails the stability check", () => {
    const result = withTransfer(GENERAL);
    expect(result.curveVerdict).toBe("pass");
    expect(result.thermalVerdict).toBe("pass");
    expect(result.stabilityVerdict).toBe("fail");
    // S = V·α·Z_th(t_eq) ≥ 1 (METHODS.md §12); the demo values are chosen for S ≈ 1.25.
    expect(result.stability).toBeGreaterThan(1.1);
    expect(result.flags).toContain("thermal-instability");
    expect(result.verdict).toBe("fail");
  });

  test("the linear-mode part stays far from instability; the trench part fails both ways", () => {
    const linear = withTransfer(LINEAR);
    expect(linear.stabilityVerdict).toBe("pass");
    expect(linear.stability).toBeLessThan(0.1);
    expect(linear.verdict).toBe("pass");
    const trench = withTransfer(TRENCH);
    expect(trench.curveVerdict).toBe("fail");
    expect(trench.stabilityVerdict).toBe("fail");
  });
});
