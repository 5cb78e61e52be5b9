import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { allowedCurrent } from "./allowed-current";
import { checkPulse, prepareCheck, runCheck } from "./check";
import { prepareCurveSet } from "./curve-set";
import { waveformEquivalent } from "./equivalent-rectangle";
import type { FosterTerm } from "./foster";
import { repetitionScale } from "./repetition";
import { impedanceFromFoster } from "./thermal-impedance";
import { rectRise, trainRise } from "./thermal-rect";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRise } from "./thermal-waveform";
import type {
  CheckRequest,
  Curve,
  PartLimits,
  Policy,
  Pulse,
  PulseResult,
  RectPulse,
  TrianglePulse,
  WaveformPulse,
} from "./types";

/** A pulse without its id. */
type Shape = Omit<RectPulse, "id"> | Omit<TrianglePulse, "id"> | Omit<WaveformPulse, "id">;

/**
 * METHODS.md §10 "across widths": 40 A at 1 ms, 16 A at 10 ms, flat over 1–100 V. Tj,max 175 °C, T_ref 25 °C.
 */
const utilisationPart: PartLimits = {
  vdsMax: 100,
  tjMax: 175,
  soa: {
    refCaseTemp: 25,
    curves: [
      {
        duration: 1e-3,
        points: [
          [1, 40],
          [100, 40],
        ],
      },
      {
        duration: 1e-2,
        points: [
          [1, 16],
          [100, 16],
        ],
      },
    ],
  },
};

/** METHODS.md §10 "two terms": R 0.1, 0.4 K/W; τ 1 ms, 100 ms. */
const twoTerms: FosterTerm[] = [
  { r: 0.1, tau: 1e-3 },
  { r: 0.4, tau: 0.1 },
];

/** A fuller part: thermal limit from the two-term network at 150 W of headroom, package limit, DC curve. */
function thermalCurve(duration: number | "DC"): Curve {
  const z =
    duration === "DC" ? 0.5 : twoTerms.reduce((s, { r, tau }) => s - r * Math.expm1(-duration / tau), 0);
  const power = 150 / z;
  return {
    duration,
    points: [2, 5, 10, 20, 40, 60].map((v) => [v, Math.min(300, power / v)] as [number, number]),
  };
}

const fullPart: PartLimits = {
  vdsMax: 60,
  tjMax: 175,
  idPulseMax: 400,
  rdsOn: 2e-3,
  foster: twoTerms,
  soa: { curves: [1e-5, 1e-4, 1e-3, 1e-2, "DC" as const].map(thermalCurve) },
};

function check(part: PartLimits, pulses: Pulse[], caseTemp = 25, policy?: Policy): PulseResult[] {
  return runCheck({ part, caseTemp, policy, pulses }).results;
}

function one(part: PartLimits, pulse: Shape, caseTemp = 25, policy?: Policy): PulseResult {
  return check(part, [{ id: "p", ...pulse } as Pulse], caseTemp, policy)[0];
}

describe("runCheck, worked values", () => {
  it("20 V, 12 A, 2 ms at Tc 100 °C: log-log limit 15.18 A, u = 0.791; strict limit 8 A, u = 1.50", () => {
    // METHODS.md §10 worked values "utilisation" (derived; asserted to the digits shown).
    const pulse = { kind: "rect" as const, v: 20, i: 12, duration: 2e-3 };
    const loglog = one(utilisationPart, pulse, 100);
    expect(loglog.derating).toBeCloseTo(0.5, 12);
    expect(loglog.allowedCurrent).toBeCloseTo(15.18, 2);
    expect(loglog.utilisation).toBeCloseTo(0.791, 3);
    expect(loglog).toMatchObject({ tjPeak: null, verdict: "pass", flags: ["interpolated"] });
    const strict = one(utilisationPart, pulse, 100, { betweenCurves: "next-longer" });
    expect(strict.allowedCurrent).toBeCloseTo(8, 12);
    expect(strict.utilisation).toBeCloseTo(1.5, 12);
    expect(strict).toMatchObject({ verdict: "fail", flags: ["next-longer-curve"] });
  });

  it("500 W for 10 ms from 25 °C on the two-term network reaches Tj 94.03 °C", () => {
    // METHODS.md §10 worked value "two terms" (derived): 25 + 500·Z_th(10 ms), Z_th(10 ms) = 0.138060 K/W.
    const result = one(fullPart, { kind: "rect", v: 50, i: 10, duration: 1e-2 });
    expect(result.tjPeak).toBeCloseTo(94.03, 2);
    expect(result.tjPeak).toBeCloseTo(25 + 500 * 0.13806049279264, 9);
  });
});

describe("runCheck, pulse shapes", () => {
  it("checks a single rectangle on the curves and with rectRise", () => {
    const result = one(fullPart, { kind: "rect", v: 20, i: 30, duration: 1e-3 }, 60);
    const k = (175 - 60) / 150;
    const read = allowedCurrent(prepareCurveSet(fullPart.soa), 20, 1e-3).current as number;
    expect(result.derating).toBeCloseTo(k, 15);
    expect(result.allowedCurrent).toBeCloseTo(k * read, 12);
    expect(result.utilisation).toBeCloseTo(30 / (k * read), 12);
    expect(result.tjPeak).toBeCloseTo(60 + rectRise(twoTerms, 600, 1e-3), 12);
    expect(result.flags).toEqual([]);
  });

  it("reads a triangle as its equal-energy rectangle (t_p/2) and takes Tj at its true peak", () => {
    const result = one(fullPart, { kind: "triangle", v: 20, i: 30, duration: 2e-3 }, 60);
    const k = (175 - 60) / 150;
    expect(result.allowedCurrent).toBeCloseTo(
      k * (allowedCurrent(prepareCurveSet(fullPart.soa), 20, 1e-3).current as number),
      12,
    );
    expect(result.tjPeak).toBeCloseTo(60 + trianglePeakRise(twoTerms, 600, 2e-3), 12);
    expect(result.flags).toEqual(["equivalent-rectangle"]);
  });

  it("scales a repeated rectangle by the duty-cycle impedance and takes Tj from the train", () => {
    const repeat = { period: 5e-3, count: 4 };
    const single = one(fullPart, { kind: "rect", v: 20, i: 30, duration: 1e-3 });
    const repeated = one(fullPart, { kind: "rect", v: 20, i: 30, duration: 1e-3, repeat });
    const scale = repetitionScale(impedanceFromFoster(twoTerms), 1e-3, 5e-3).scale as number;
    expect(scale).toBeLessThan(1);
    expect(repeated.allowedCurrent).toBeCloseTo((single.allowedCurrent as number) * scale, 12);
    expect(repeated.tjPeak).toBeCloseTo(25 + trainRise(twoTerms, 600, 1e-3, 5e-3, 4), 12);
    const continuous = one(fullPart, {
      kind: "rect",
      v: 20,
      i: 30,
      duration: 1e-3,
      repeat: { period: 5e-3 },
    });
    expect(continuous.tjPeak).toBeCloseTo(25 + trainRise(twoTerms, 600, 1e-3, 5e-3), 12);
    expect(continuous.allowedCurrent).toBe(repeated.allowedCurrent);
  });

  it("repeats a triangle with D = (w/2)/T and Tj over the last triangle of the train", () => {
    const repeat = { period: 1e-2, count: 3 };
    const result = one(fullPart, { kind: "triangle", v: 20, i: 30, duration: 2e-3, repeat });
    const single = one(fullPart, { kind: "triangle", v: 20, i: 30, duration: 2e-3 });
    const scale = repetitionScale(impedanceFromFoster(twoTerms), 1e-3, 1e-2).scale as number;
    expect(result.allowedCurrent).toBeCloseTo((single.allowedCurrent as number) * scale, 12);
    expect(result.tjPeak).toBeCloseTo(25 + trianglePeakRise(twoTerms, 600, 2e-3, repeat), 12);
    expect(result.flags).toEqual(["equivalent-rectangle"]);
  });

  it("reads a capture at its peak-power sample with width E/p_peak, and Tj over the whole capture", () => {
    const t = [0, 1e-4, 2e-4, 3e-4, 4e-4, 5e-4];
    const v = [30, 28, 25, 20, 10, 0];
    const i = [0, 20, 40, 30, 10, 5];
    const result = check(fullPart, [{ id: "cap", kind: "waveform", t, v, i }], 40)[0];
    const p = t.map((_, n) => v[n] * i[n]);
    const rect = waveformEquivalent(t, p);
    if (!rect.ok) throw new Error("expected a rectangle");
    expect(rect.peakIndex).toBe(2);
    const k = (175 - 40) / 150;
    const read = allowedCurrent(prepareCurveSet(fullPart.soa), 25, rect.duration).current as number;
    expect(result.allowedCurrent).toBeCloseTo(k * read, 12);
    expect(result.utilisation).toBeCloseTo(40 / (k * read), 12);
    expect(result.tjPeak).toBeCloseTo(40 + waveformRise(t, p, twoTerms).peak, 12);
    // Derived: window samples 1–4 (560, 1000, 600, 100 W), E = (780 + 800 + 350 W)·100 µs = 0.193 J.
    expect(rect.duration).toBeCloseTo(1.93e-4, 15);
    expect(result.flags).toEqual(["interpolated", "equivalent-rectangle"]);
  });

  it("reads a capture with both probes reversed as the normal one", () => {
    const t = [0, 1e-3, 2e-3, 3e-3];
    const normal = one(fullPart, { kind: "waveform", t, v: [0, 20, 20, 0], i: [0, 10, 10, 0] });
    const reversed = one(fullPart, { kind: "waveform", t, v: [0, -20, -20, 0], i: [0, -10, -10, 0] });
    expect(reversed).toEqual(normal);
  });

  it("has no Tj and no thermal verdict without a Foster network", () => {
    const { foster: _, ...bare } = fullPart;
    for (const pulse of [
      { kind: "rect" as const, v: 20, i: 1, duration: 1e-3 },
      { kind: "triangle" as const, v: 20, i: 1, duration: 1e-3, repeat: { period: 1e-2 } },
      { kind: "waveform" as const, t: [0, 1e-3, 2e-3], v: [20, 20, 20], i: [1, 1, 1] },
    ]) {
      expect(one({ ...bare, foster: [] }, pulse).tjPeak).toBeNull();
      expect(one(bare, pulse).tjPeak).toBeNull();
    }
  });

  it("answers every pulse in request order, and nothing for no pulses", () => {
    const pulses: Pulse[] = ["c", "a", "b"].map((id) => ({ id, kind: "rect", v: 10, i: 1, duration: 1e-3 }));
    expect(check(fullPart, pulses).map((r) => r.id)).toEqual(["c", "a", "b"]);
    expect(check(fullPart, [])).toEqual([]);
  });
});

describe("runCheck, flags and verdicts", () => {
  const rect = (v: number, i: number, duration: number, extra: Partial<Pulse> = {}) =>
    ({ kind: "rect", v, i, duration, ...extra }) as Shape;

  it("over-voltage: V above V_DSS fails whatever the curves say", () => {
    const result = one({ ...fullPart, vdsMax: 50 }, rect(55, 0.1, 1e-3));
    expect(result).toMatchObject({ verdict: "fail", flags: ["over-voltage"] });
    expect(result.utilisation).toBeLessThan(0.8);
  });

  it("over-voltage on a capture uses its largest sample of v, not the peak-power sample", () => {
    const t = [0, 1e-3, 2e-3, 3e-3];
    const result = one(fullPart, { kind: "waveform", t, v: [61, 20, 20, 5], i: [0, 10, 10, 0] });
    expect(result.flags).toContain("over-voltage");
    expect(result.verdict).toBe("fail");
  });

  it("over-current: I above I_DM fails; a capture uses its largest |i|", () => {
    expect(one(fullPart, rect(1, 401, 1e-5))).toMatchObject({
      verdict: "fail",
      flags: ["over-current", "below-curve-range"],
    });
    const t = [0, 1e-3, 2e-3];
    const result = one(fullPart, { kind: "waveform", t, v: [1, 1, 1], i: [5, 5, -450] });
    expect(result.flags).toContain("over-current");
    expect(one({ ...fullPart, idPulseMax: undefined }, rect(1, 401, 1e-5)).flags).not.toContain(
      "over-current",
    );
  });

  it("case at or above Tj,max: nothing allowed, utilisation null, fail", () => {
    const result = one(utilisationPart, rect(20, 1, 1e-3), 175);
    expect(result).toEqual({
      id: "p",
      allowedCurrent: 0,
      utilisation: null,
      tjPeak: null,
      derating: 0,
      verdict: "fail",
      flags: ["case-at-or-above-tj-max"],
    });
    expect(one(utilisationPart, rect(200, 1, 1e-3), 180)).toMatchObject({
      allowedCurrent: null,
      verdict: "fail",
    });
  });

  it("shorter-than-shortest-curve, dc-curve-used and longer-than-longest-curve", () => {
    expect(one(fullPart, rect(20, 1, 1e-7)).flags).toEqual(["shorter-than-shortest-curve"]);
    expect(one(fullPart, rect(20, 1, 10)).flags).toEqual(["dc-curve-used"]);
    const noDc = { ...utilisationPart };
    expect(one(noDc, rect(20, 1, 1))).toMatchObject({
      allowedCurrent: null,
      utilisation: null,
      verdict: "no-data",
      flags: ["longer-than-longest-curve"],
    });
  });

  it("below-curve-range keeps the first current; above-curve-range has no data", () => {
    expect(one(fullPart, rect(1, 1, 1e-3))).toMatchObject({
      allowedCurrent: 300,
      flags: ["below-curve-range"],
    });
    expect(one({ ...fullPart, vdsMax: 80 }, rect(70, 1, 1e-3))).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
      flags: ["above-curve-range"],
    });
  });

  it("pulse-too-short and no-power leave a capture without a point on the curves", () => {
    const t = [0, 1e-3, 2e-3];
    expect(one(utilisationPart, { kind: "waveform", t, v: [0, 20, 0], i: [0, 5, 0] })).toMatchObject({
      allowedCurrent: null,
      utilisation: null,
      verdict: "no-data",
      flags: ["pulse-too-short"],
    });
    expect(one(fullPart, { kind: "waveform", t, v: [0, 20, 0], i: [0, 0, 0] })).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
      flags: ["no-power"],
    });
  });

  it("repetition-outside-data without a Foster network when the curves do not reach the period", () => {
    const result = one(utilisationPart, rect(20, 1, 1e-3, { repeat: { period: 5e-2 } }));
    expect(result).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
      flags: ["repetition-outside-data"],
    });
  });

  it("reads repetition from the curves when they span t_eq, T and t_eq + T and R_th is known", () => {
    // Z_k from the curves (METHODS.md §7): 1 ms and 10 ms curves, R_th from the part.
    const part: PartLimits = { ...utilisationPart, rthJc: 2 };
    const result = one(part, rect(20, 1, 1e-3, { repeat: { period: 5e-3 } }));
    expect(result.flags).toEqual([]);
    const set = prepareCurveSet(part.soa);
    const zk = (p: number) => 150 / p;
    const z = (t: number) => zk(40 * 100) * (t / 1e-3) ** (Math.log(zk(1600) / zk(4000)) / Math.log(10));
    const duty = 0.2;
    const zRepeat = duty * 2 + (1 - duty) * z(6e-3) - z(5e-3) + z(1e-3);
    expect(result.allowedCurrent).toBeCloseTo(
      ((allowedCurrent(set, 20, 1e-3).current as number) * z(1e-3)) / zRepeat,
      9,
    );
  });

  it("takes the worse of the curve and thermal verdicts", () => {
    // METHODS.md §8: both views are needed, since a Foster network knows nothing of the thermal-instability
    // region at high voltage that the curves show (Spirito et al., MIEL 2002). A part whose curves allow far
    // more than its Foster network: curve pass, thermal fail.
    const generous: PartLimits = {
      ...utilisationPart,
      foster: [{ r: 20, tau: 1e-3 }],
    };
    const hot = one(generous, rect(20, 1, 1e-3));
    expect(hot.utilisation).toBeLessThan(0.8);
    expect(hot.tjPeak).toBeGreaterThan(175);
    expect(hot.verdict).toBe("fail");
    const warm = one({ ...generous, foster: [{ r: 11, tau: 1e-3 }] }, rect(20, 1, 1e-3));
    expect(warm.tjPeak).toBeGreaterThan(150);
    expect(warm.tjPeak).toBeLessThan(175);
    expect(warm.verdict).toBe("marginal");
    const guarded = one({ ...generous, foster: [{ r: 11, tau: 1e-3 }] }, rect(20, 1, 1e-3), 25, {
      tjGuard: 0,
    });
    expect(guarded.verdict).toBe("pass");
    // No data on the curves, thermal pass: no-data wins.
    expect(one({ ...fullPart, vdsMax: 80 }, rect(70, 0.01, 1e-3)).verdict).toBe("no-data");
  });

  it("applies the policy's utilisation limit", () => {
    const pulse = rect(20, 12, 2e-3);
    expect(one(utilisationPart, pulse, 100).verdict).toBe("pass");
    expect(one(utilisationPart, pulse, 100, { utilisationLimit: 0.7 }).verdict).toBe("marginal");
  });

  it("lists flags in one fixed order", () => {
    const result = one(
      { ...fullPart, vdsMax: 10, idPulseMax: 1 },
      { kind: "triangle", v: 70, i: 2, duration: 1e-7 },
    );
    expect(result.flags).toEqual([
      "over-voltage",
      "over-current",
      "shorter-than-shortest-curve",
      "above-curve-range",
      "equivalent-rectangle",
    ]);
  });
});

describe("checkPulse", () => {
  it("reuses one prepared part for many pulses with the same results as runCheck", () => {
    const ctx = prepareCheck(fullPart, 70);
    const pulse: Pulse = {
      id: "x",
      kind: "triangle",
      v: 12,
      i: 40,
      duration: 3e-4,
      repeat: { period: 1e-3 },
    };
    expect(checkPulse(ctx, pulse)).toEqual(
      runCheck({ part: fullPart, caseTemp: 70, pulses: [pulse] }).results[0],
    );
  });
});

describe("runCheck, properties", () => {
  const partArb = fc
    .boolean()
    .map(
      (withFoster): PartLimits => (withFoster ? fullPart : { ...fullPart, foster: undefined, rthJc: 0.5 }),
    );
  const pulseArb = fc.record({
    kind: fc.constantFrom("rect" as const, "triangle" as const),
    v: fc.double({ min: 0.5, max: 59, noNaN: true }),
    i: fc.double({ min: 0.1, max: 100, noNaN: true }),
    duration: fc.double({ min: 1e-6, max: 1, noNaN: true }),
    periodFactor: fc.double({ min: 1.0001, max: 1000, noNaN: true }),
    count: fc.option(fc.integer({ min: 1, max: 100 }), { nil: undefined }),
  });

  it("never allows a repeated pulse more current than the same pulse once", () => {
    // METHODS.md §7: the scale factor is capped at 1.
    fc.assert(
      fc.property(partArb, pulseArb, fc.double({ min: -40, max: 170, noNaN: true }), (part, p, caseTemp) => {
        const { periodFactor, count, ...shape } = p;
        const repeat = { period: shape.duration * periodFactor, ...(count === undefined ? {} : { count }) };
        const request: CheckRequest = {
          part,
          caseTemp,
          pulses: [
            { id: "once", ...shape },
            { id: "again", ...shape, repeat },
          ],
        };
        const [once, again] = runCheck(request).results;
        if (again.allowedCurrent !== null) {
          expect(once.allowedCurrent).not.toBeNull();
          expect(again.allowedCurrent).toBeLessThanOrEqual((once.allowedCurrent as number) * (1 + 1e-12));
        }
        if (once.tjPeak !== null) expect(again.tjPeak as number).toBeGreaterThanOrEqual(once.tjPeak - 1e-9);
      }),
    );
  });

  it("never allows more current at a hotter case", () => {
    fc.assert(
      fc.property(
        partArb,
        pulseArb,
        fc.double({ min: -40, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 50, noNaN: true }),
        (part, p, cool, delta) => {
          const pulse = { id: "p", kind: p.kind, v: p.v, i: p.i, duration: p.duration };
          const a = runCheck({ part, caseTemp: cool, pulses: [pulse] }).results[0];
          const b = runCheck({ part, caseTemp: cool + delta, pulses: [pulse] }).results[0];
          expect(b.derating).toBeLessThanOrEqual(a.derating);
          if (a.allowedCurrent !== null)
            expect(b.allowedCurrent as number).toBeLessThanOrEqual(a.allowedCurrent);
        },
      ),
    );
  });
});
