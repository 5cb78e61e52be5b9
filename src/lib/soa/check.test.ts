// Long file: the engine's entry point through each view (curves, thermal, repetition, stability) on shared parts.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ACROSS_WIDTHS } from "@/test/curve-data";
import { checkPulse, prepareCheck, runCheck } from "./check";
import type { FosterTerm } from "./foster";
import type {
  AvalanchePulse,
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
type Shape =
  | Omit<RectPulse, "id">
  | Omit<TrianglePulse, "id">
  | Omit<WaveformPulse, "id">
  | Omit<AvalanchePulse, "id">;

/**
 * METHODS.md §10 "across widths": 40 A at 1 ms, 16 A at 10 ms, flat over 1–100 V. Tj,max 175 °C, T_ref 25 °C.
 */
const utilisationPart: PartLimits = {
  vdsMax: 100,
  tjMax: 175,
  soa: {
    refCaseTemp: 25,
    curves: ACROSS_WIDTHS,
  },
};

/** METHODS.md §10 "two terms": R 0.1, 0.4 K/W; τ 1 ms, 100 ms. */
const twoTerms: FosterTerm[] = [
  { r: 0.1, tau: 1e-3 },
  { r: 0.4, tau: 0.1 },
];

/**
 * Expected values below are written out from METHODS.md's formulas in this file, never read from the engine:
 * Z_th(t) = Σ R_i·(1 − e^(−t/τ_i)) (§4). For the two-term network, by hand:
 * Z(1 ms) = 0.1·(1 − e^(−1)) + 0.4·(1 − e^(−0.01)) = 0.0632121 + 0.0039801 = 0.0671922 K/W (§10 table: 0.067192);
 * Z(10 ms) = 0.1·(1 − e^(−10)) + 0.4·(1 − e^(−0.1)) = 0.0999955 + 0.0380650 = 0.1380605 K/W (§10 table: 0.138060).
 */
const zth = (t: number) => twoTerms.reduce((sum, { r, tau }) => sum + r * (1 - Math.exp(-t / tau)), 0);

/**
 * Rise of the two-term network under a triangle of peak power P falling linearly to 0 over w, at time t ≤ w, from
 * per-term starting rises θ0_i. Solved by hand from §4's dθ_i/dt = (R_i·P(t) − θ_i)/τ_i with P(t) = P·(1 − t/w):
 * θ_i(t) = R_i·P·[1 − t/w + τ_i/w − (1 + τ_i/w)·e^(−t/τ_i)] + θ0_i·e^(−t/τ_i).
 */
function triangleRiseAt(p: number, w: number, t: number, start: number[] = [0, 0]): number {
  return twoTerms.reduce((sum, { r, tau }, k) => {
    const e = Math.exp(-t / tau);
    return sum + r * p * (1 - t / w + tau / w - (1 + tau / w) * e) + start[k] * e;
  }, 0);
}

/** The largest of triangleRiseAt over the pulse, on a grid of 200 001 instants (§6: the true peak, inside it). */
function trianglePeak(p: number, w: number, start?: number[]): number {
  let peak = 0;
  for (let n = 0; n <= 200_000; n++) peak = Math.max(peak, triangleRiseAt(p, w, (w * n) / 200_000, start));
  return peak;
}

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
    // METHODS.md §10 worked value "two terms" (derived from §4): 25 + 500·Z_th(10 ms) = 25 + 500·0.1380605 = 94.030 °C.
    const result = one(fullPart, { kind: "rect", v: 50, i: 10, duration: 1e-2 });
    expect(result.tjPeak).toBeCloseTo(94.03, 2);
    expect(zth(1e-2)).toBeCloseTo(0.13806, 5);
    expect(result.tjPeak).toBeCloseTo(25 + 500 * (0.1 * (1 - Math.exp(-10)) + 0.4 * (1 - Math.exp(-0.1))), 9);
  });
});

describe("runCheck, pulse shapes", () => {
  // Derived from §2, §4 and §5 by hand. 20 V is a digitised point of the 1 ms curve, where §2 is exact:
  // I = 150 W/(20 V·Z(1 ms)) = 150/(20·0.0671922) = 111.62 A. At Tc 60 °C, k = (175 − 60)/(175 − 25) = 0.766667, so
  // the limit is 85.58 A, u = 30/85.58 = 0.35055, and Tj = 60 + 600 W·Z(1 ms) = 100.315 °C.
  it("checks a single rectangle on the curves and on the thermal model", () => {
    const result = one(fullPart, { kind: "rect", v: 20, i: 30, duration: 1e-3 }, 60);
    const k = 115 / 150;
    const limit = (k * 150) / (20 * zth(1e-3));
    expect(result.derating).toBeCloseTo(0.766667, 6);
    expect(result.allowedCurrent).toBeCloseTo(limit, 9);
    expect(result.allowedCurrent).toBeCloseTo(85.58, 2);
    expect(result.utilisation).toBeCloseTo(30 / limit, 12);
    expect(result.tjPeak).toBeCloseTo(60 + 600 * zth(1e-3), 9);
    expect(result.tjPeak).toBeCloseTo(100.315, 3);
    expect(result.flags).toEqual([]);
  });

  // Derived from §6: a 2 ms triangle is read at 1 ms (the same 85.58 A as above); its Tj is the peak of the
  // closed-form rise written out above (triangleRiseAt), found on a fine grid, not the rise at its end.
  it("reads a triangle as its equal-energy rectangle (t_p/2) and takes Tj at its true peak", () => {
    const result = one(fullPart, { kind: "triangle", v: 20, i: 30, duration: 2e-3 }, 60);
    expect(result.allowedCurrent).toBeCloseTo((115 / 150) * (150 / (20 * zth(1e-3))), 9);
    const peak = trianglePeak(600, 2e-3);
    expect(peak).toBeGreaterThan(triangleRiseAt(600, 2e-3, 2e-3));
    expect(result.tjPeak).toBeCloseTo(60 + peak, 7);
    expect(result.equivalentWidth).toBe(1e-3);
    expect(result.flags).toEqual(["equivalent-rectangle"]);
  });

  // METHODS.md §7 (v2): with a Foster network the scale is Z_th(t_eq)/Z_rep with Z_rep the exact peak of N
  // rectangles, Σ R_i·(1 − a_i)·(1 − b_i^N)/(1 − b_i) (derived from the Foster formula, written out here).
  const zRep = (width: number, period: number, count?: number) =>
    twoTerms.reduce((sum, { r, tau }) => {
      const a = Math.exp(-width / tau);
      const b = Math.exp(-period / tau);
      return sum + (r * (1 - a) * (count === undefined ? 1 : 1 - b ** count)) / (1 - b);
    }, 0);
  const zOne = (width: number) =>
    twoTerms.reduce((sum, { r, tau }) => sum + r * (1 - Math.exp(-width / tau)), 0);

  // At Tc 25 °C (k = 1) the single 1 ms reading at 20 V is 150/(20·Z(1 ms)) = 111.62 A (§2, a digitised point).
  const singleLimit = 150 / (20 * zth(1e-3));

  // Derived from §7: a train's rise is the superposition of its pulses' steps, so the limit scales by Z(t_p)/Z_train.
  it("scales a repeated rectangle by the exact train impedance and takes Tj from the train", () => {
    const single = one(fullPart, { kind: "rect", v: 20, i: 30, duration: 1e-3 });
    expect(single.allowedCurrent).toBeCloseTo(singleLimit, 9);
    for (const count of [4, undefined]) {
      const repeat = { period: 5e-3, count };
      const repeated = one(fullPart, { kind: "rect", v: 20, i: 30, duration: 1e-3, repeat });
      const scale = zOne(1e-3) / zRep(1e-3, 5e-3, count);
      expect(repeated.repetitionScale).toBeCloseTo(scale, 12);
      expect(repeated.allowedCurrent).toBeCloseTo(singleLimit * scale, 9);
      expect(repeated.tjPeak).toBeCloseTo(25 + 600 * zRep(1e-3, 5e-3, count), 10);
      expect(repeated.flags).toEqual(["repetition-applied"]);
    }
    expect(single.repetitionScale).toBeNull();
  });

  // Derived from §7: the N-th triangle starts from g_i·e^(−(T−w)/τ_i)·(1 − b_i^(N−1))/(1 − b_i), g_i the term's rise
  // at the end of one triangle from rest (triangleRiseAt per term at t = w), b_i = e^(−T/τ_i).
  it("repeats a triangle at t_eq = w/2 and takes Tj over the last triangle of the train", () => {
    const repeat = { period: 1e-2, count: 3 };
    const result = one(fullPart, { kind: "triangle", v: 20, i: 30, duration: 2e-3, repeat });
    const scale = zOne(1e-3) / zRep(1e-3, 1e-2, 3);
    expect(result.allowedCurrent).toBeCloseTo(singleLimit * scale, 9);
    const w = 2e-3;
    const start = twoTerms.map(({ r, tau }) => {
      const g = r * 600 * (tau / w - (1 + tau / w) * Math.exp(-w / tau));
      const b = Math.exp(-1e-2 / tau);
      return (g * Math.exp(-(1e-2 - w) / tau) * (1 - b ** 2)) / (1 - b);
    });
    expect(result.tjPeak).toBeCloseTo(25 + trianglePeak(600, w, start), 7);
    expect(result.flags).toEqual(["equivalent-rectangle", "repetition-applied"]);
    expect(result.equivalentWidth).toBe(1e-3);
  });

  // METHODS.md §10 worked value "v2 capture phases" (derived): 80 V for 10 ms, then 20 V × 38 A for 0.2 ms. The
  // 80 V samples are read at min(E/p_n, T_rec) = T_rec ≈ 10.2 ms, not at E/p_peak ≈ 2.8 ms.
  it("reads every capture sample at its own width and reports the binding one", () => {
    const part: PartLimits = {
      vdsMax: 100,
      tjMax: 175,
      soa: {
        curves: [
          {
            duration: 1e-3,
            points: [
              [1, 100],
              [100, 100],
            ],
          },
          {
            duration: 1e-2,
            points: [
              [1, 50],
              [40, 50],
              [100, 1.5],
            ],
          },
          {
            duration: 1e-1,
            points: [
              [1, 20],
              [40, 20],
              [100, 1],
            ],
          },
        ],
      },
    };
    const e = 1e-9;
    const t = [0, e, 10e-3, 10e-3 + e, 10.2e-3, 10.2e-3 + e];
    const result = one(part, {
      kind: "waveform",
      t,
      v: [80, 80, 80, 20, 20, 20],
      i: [0, 2.5, 2.5, 38, 38, 0],
    });
    const tRec = 10.2e-3 + e;
    // By hand (METHODS.md §2, §3): each curve at 80 V on its 40–100 V segment, then log-log between 10 and 100 ms.
    const at80 = (i40: number, i100: number) => i40 * 2 ** (Math.log(i100 / i40) / Math.log(2.5));
    const i10 = at80(50, 1.5);
    const i100 = at80(20, 1);
    const allowed = i10 * (i100 / i10) ** (Math.log(tRec / 1e-2) / Math.log(10));
    expect(result.at).toEqual({ t: e, v: 80, i: 2.5, width: tRec });
    expect(result.allowedCurrent).toBeCloseTo(allowed, 12);
    expect(result.utilisation).toBeCloseTo(2.5 / allowed, 12);
    const energy = 200 * 1e-2 + 760 * 0.2e-3;
    expect(result.equivalentWidth).toBeCloseTo(energy / 760, 8);
    expect(result.flags).toEqual(["interpolated", "equivalent-rectangle"]);
  });

  // METHODS.md §6: only samples with v > 0 and i > 0.001·max|i| are read; both probes reversed read none.
  it("heats the same with both probes reversed, but reads no sample on the curves", () => {
    const t = [0, 1e-3, 2e-3, 3e-3];
    const normal = one(fullPart, { kind: "waveform", t, v: [0, 20, 20, 0], i: [0, 10, 10, 0] });
    const reversed = one(fullPart, { kind: "waveform", t, v: [0, -20, -20, 0], i: [0, -10, -10, 0] });
    expect(reversed.tjPeak).toBe(normal.tjPeak);
    expect(normal.curveVerdict).toBe("pass");
    expect(reversed).toMatchObject({ curveVerdict: "no-data", allowedCurrent: null, at: null });
  });

  // Derived from §8: the thermal verdict exists only with a thermal model.
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

  // Our choice: results in request order, so a caller can pair them by position as well as by id.
  it("answers every pulse in request order, and nothing for no pulses", () => {
    const pulses: Pulse[] = ["c", "a", "b"].map((id) => ({ id, kind: "rect", v: 10, i: 1, duration: 1e-3 }));
    expect(check(fullPart, pulses).map((r) => r.id)).toEqual(["c", "a", "b"]);
    expect(check(fullPart, [])).toEqual([]);
  });
});

describe("runCheck, flags and verdicts", () => {
  const rect = (v: number, i: number, duration: number, extra: Partial<Pulse> = {}) =>
    ({ kind: "rect", v, i, duration, ...extra }) as Shape;

  // Derived from §2: V > V_DSS is a fail with flag over-voltage, whatever the curves say.
  it("over-voltage: V above V_DSS fails whatever the curves say", () => {
    const result = one({ ...fullPart, vdsMax: 50 }, rect(55, 0.1, 1e-3));
    expect(result).toMatchObject({ verdict: "fail", flags: ["over-voltage"] });
    expect(result.utilisation).toBeLessThan(0.8);
  });

  // Derived from §6: hard limits of a waveform use max v_n.
  it("over-voltage on a capture uses its largest sample of v, not the peak-power sample", () => {
    const t = [0, 1e-3, 2e-3, 3e-3];
    const result = one(fullPart, { kind: "waveform", t, v: [61, 20, 20, 5], i: [0, 10, 10, 0] });
    expect(result.flags).toContain("over-voltage");
    expect(result.verdict).toBe("fail");
  });

  // Derived from §2 and §6: I > I_DM fails; a waveform uses max |i_n|.
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
      flags: [],
      curveVerdict: "fail",
      thermalVerdict: null,
      stabilityVerdict: null,
      stability: null,
      equivalentWidth: 1e-3,
      repetitionScale: null,
    });
    // METHODS.md §8: no value on the curves is no data, even at Tj,max (without a thermal model to say more).
    expect(one({ ...utilisationPart, vdsMax: 300 }, rect(200, 1, 1e-3), 180)).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
    });
  });

  // Derived from §3: the three rules outside the curves' widths.
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

  // Derived from §2: below V_1 the first current, above V_n no value.
  it("below-curve-range keeps the first current; above-curve-range has no data", () => {
    expect(one(fullPart, rect(1, 1, 1e-3))).toMatchObject({
      allowedCurrent: expect.closeTo(300, 10),
      flags: ["below-curve-range"],
    });
    expect(one({ ...fullPart, vdsMax: 80 }, rect(70, 1, 1e-3))).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
      flags: ["voltage-margin", "above-curve-range"],
    });
  });

  // Derived from §6: t_eq = E/p_peak; p_peak = 0 is no-data with flag no-power.
  it("reads a one-sample spike at E/p = 1 ms; no power leaves a capture without a point on the curves", () => {
    const t = [0, 1e-3, 2e-3];
    // Derived: p = 0, 100, 0 W, E = 0.1 J by the trapezoid rule, so the spike is read at 1 ms: 40 A.
    expect(one(utilisationPart, { kind: "waveform", t, v: [0, 20, 0], i: [0, 5, 0] })).toMatchObject({
      allowedCurrent: expect.closeTo(40, 10),
      utilisation: expect.closeTo(0.125, 10),
      verdict: "pass",
      flags: ["equivalent-rectangle"],
      at: { t: 1e-3, v: 20, i: 5, width: expect.closeTo(1e-3, 15) },
    });
    expect(one(fullPart, { kind: "waveform", t, v: [0, 20, 0], i: [0, 0, 0] })).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
      flags: ["no-power"],
    });
  });

  // Derived from §7: a Z_th value outside the data gives no-data, flag repetition-outside-data.
  it("repetition-outside-data without a Foster network when the curves do not reach the period", () => {
    const result = one(utilisationPart, rect(20, 1, 1e-3, { repeat: { period: 5e-2 } }));
    expect(result).toMatchObject({
      allowedCurrent: null,
      verdict: "no-data",
      flags: ["repetition-applied", "repetition-outside-data"],
    });
  });

  it("reads repetition from the curves when they span t_eq, T and t_eq + T and R_th is known", () => {
    // Z_k from the curves (METHODS.md §7): 1 ms and 10 ms curves, R_th from the part.
    const part: PartLimits = { ...utilisationPart, rthJc: 2 };
    const result = one(part, rect(20, 1, 1e-3, { repeat: { period: 5e-3 } }));
    expect(result.flags).toEqual(["repetition-applied"]);
    // The 1 ms curve is flat at 40 A (§2: 40 A at 20 V); Z_k = (Tj,max − T_ref)/P_k = 150 K/P_k.
    const zk = (p: number) => 150 / p;
    const z = (t: number) => zk(40 * 100) * (t / 1e-3) ** (Math.log(zk(1600) / zk(4000)) / Math.log(10));
    const duty = 0.2;
    const zRepeat = duty * 2 + (1 - duty) * z(6e-3) - z(5e-3) + z(1e-3);
    expect(result.allowedCurrent).toBeCloseTo((40 * z(1e-3)) / zRepeat, 9);
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

  // Derived from §8: pass up to u_max, marginal up to 1.
  it("applies the policy's utilisation limit", () => {
    const pulse = rect(20, 12, 2e-3);
    expect(one(utilisationPart, pulse, 100).verdict).toBe("pass");
    expect(one(utilisationPart, pulse, 100, { utilisationLimit: 0.7 }).verdict).toBe("marginal");
  });

  // Our choice: one fixed flag order, so results compare and read the same every time.
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
  // Our choice: the prepared path is an optimisation and must answer exactly what runCheck answers.
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

  // Derived from §5: the derating factor only falls as the case gets hotter, so the allowed current cannot rise.
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

// Issue 10: six ways revision 1 could answer pass where the part's own data say otherwise. Each request is the
// regression test of one v2 rule of METHODS.md (the expected answers are the rules applied by hand).
describe("revision 2 regressions", () => {
  // Request 1 (METHODS.md §6): an 80 V phase of a capture, where the 10 ms curve falls steeply, was never read.
  it("1. reads the 80 V phase of a two-phase capture: fail at u ≈ 1.29, not pass at 0.658", () => {
    const request = {
      part: {
        vdsMax: 100,
        tjMax: 175,
        soa: {
          curves: [
            {
              duration: 0.001,
              points: [
                [1, 300],
                [4, 300],
                [40, 30],
                [100, 4.8],
              ],
            },
            {
              duration: 0.01,
              points: [
                [1, 300],
                [1.333, 300],
                [40, 10],
                [100, 1.6],
              ],
            },
          ],
        },
      },
      caseTemp: 25,
      pulses: [
        {
          id: "two-phase",
          kind: "waveform",
          t: [0, 1e-9, 0.001, 0.001000001, 0.002, 0.002000001],
          v: [80, 80, 80, 10, 10, 10],
          i: [0, 7, 7, 57, 57, 0],
        },
      ],
    } as CheckRequest;
    const [result] = runCheck(request).results;
    expect(result.verdict).toBe("fail");
    expect(result.utilisation).toBeCloseTo(1.29, 1);
    expect(result.at).toMatchObject({ v: 80, i: 7 });
  });

  // Request 2 (METHODS.md §6): energy outside a window around the peak counts. 12 V × 9.75 A for 1 s, then 199 A for
  // 100 µs: revision 1 read the spike alone at 100 µs (u = 199/250 = 0.796).
  it("2. keeps a 1 s pre-heat in the width: the spike is not a pass", () => {
    const part: PartLimits = {
      vdsMax: 60,
      tjMax: 175,
      soa: {
        curves: [1e-4, 1e-3, 1e-2, 1e-1, 1].map((duration, k) => ({
          duration,
          points: [
            [1, [250, 100, 40, 16, 8][k]],
            [50, [250, 100, 40, 16, 8][k]],
          ],
        })),
      },
    };
    const e = 1e-9;
    const result = one(part, {
      kind: "waveform",
      t: [0, e, 1, 1 + e, 1 + 1e-4, 1 + 1e-4 + e],
      v: [12, 12, 12, 12, 12, 12],
      i: [0, 9.75, 9.75, 199, 199, 0],
    });
    expect(result.verdict).toBe("fail");
    // The width is the whole record's energy over the peak power: (117 W·1 s + 2388 W·100 µs)/2388 W ≈ 49 ms.
    expect(result.equivalentWidth).toBeCloseTo((117 + 0.2388) / 2388, 6);
  });

  // Request 3 (METHODS.md §7): one pulse with count 1 is the single pulse.
  it("3. a 2 ms pulse with repeat { period: 4 ms, count: 1 } equals the pulse alone", () => {
    const pulse = { kind: "rect" as const, v: 20, i: 9, duration: 2e-3 };
    const alone = one(utilisationPart, pulse, 100);
    const once = one(utilisationPart, { ...pulse, repeat: { period: 4e-3, count: 1 } }, 100);
    expect(once.allowedCurrent).toBe(alone.allowedCurrent);
    expect(once.verdict).toBe(alone.verdict);
    expect(once.repetitionScale).toBe(1);
    expect(once.flags).toEqual([...alone.flags, "repetition-applied"]);
  });

  // Request 4 (METHODS.md §3): crossing curves never let a longer pulse carry more current.
  it("4. with next-longer, a 2 ms pulse fails where the same pulse at 1 ms fails", () => {
    const crossing: PartLimits = {
      vdsMax: 100,
      tjMax: 175,
      soa: {
        curves: [
          { duration: 1e-3, points: [[20, 30]] },
          { duration: 1e-2, points: [[20, 50]] },
        ],
      },
    };
    const policy = { betweenCurves: "next-longer" as const };
    expect(one(crossing, { kind: "rect", v: 20, i: 32, duration: 1e-3 }, 25, policy).verdict).toBe("fail");
    const longer = one(crossing, { kind: "rect", v: 20, i: 32, duration: 2e-3 }, 25, policy);
    expect(longer.verdict).toBe("fail");
    expect(longer.allowedCurrent).toBeCloseTo(30, 12);
    expect(longer.flags).toContain("capped-by-shorter-curve");
  });

  // Request 5 (METHODS.md §9) is in schema.test.ts and scripts/soa.test.ts (exit code 2 naming the path).

  // Request 6 (METHODS.md §4, §6): the peak between samples, and what came before the record.
  it("6. a two-sample falling ramp from rest peaks as the same triangle does", () => {
    const triangle = one(fullPart, { kind: "triangle", v: 40, i: 100, duration: 2e-3 });
    const ramp = one(fullPart, { kind: "waveform", t: [0, 2e-3], v: [40, 40], i: [100, 0], start: "rest" });
    expect(ramp.tjPeak).toBeCloseTo(triangle.tjPeak as number, 9);
    expect(ramp.flags).toContain("starts-mid-pulse");
  });

  it("6. a record that begins mid-pulse starts settled, is read on the DC curve and is at best marginal", () => {
    const t = [0, 1e-3, 2e-3];
    const result = one(fullPart, { kind: "waveform", t, v: [10, 10, 10], i: [1, 1, 0] });
    expect(result.flags).toContain("starts-mid-pulse");
    expect(result.curveVerdict).toBe("pass");
    expect(result.verdict).toBe("marginal");
    // Settled at 10 W: θ_i = R_i·10 W from the start, so Tj starts at 25 °C + 0.5 K/W·10 W.
    expect(result.tjPeak).toBeGreaterThanOrEqual(30);
    // Stated as rest by the user: the heating starts from rest and nothing caps the verdict.
    const rest = one(fullPart, { kind: "waveform", t, v: [10, 10, 10], i: [1, 1, 0], start: "rest" });
    expect(rest.verdict).toBe("pass");
    expect(rest.tjPeak).toBeLessThan(30);
  });
});

describe("revision 2 rules", () => {
  const rect = (v: number, i: number, duration: number) => ({ kind: "rect" as const, v, i, duration });

  // METHODS.md §8 (v2): above f_V·V_DSS (default 0.8) but not above V_DSS, the curve verdict is at least marginal.
  it("voltage-margin: 49 V on a 60 V part is marginal; 47 V is not; 0.9 moves the limit", () => {
    expect(one(fullPart, rect(49, 0.1, 1e-3))).toMatchObject({
      curveVerdict: "marginal",
      flags: ["voltage-margin"],
    });
    expect(one(fullPart, rect(47, 0.1, 1e-3)).curveVerdict).toBe("pass");
    expect(one(fullPart, rect(49, 0.1, 1e-3), 25, { voltageLimit: 0.9 }).curveVerdict).toBe("pass");
  });

  // Derived from §6: ends-mid-pulse caps at marginal; v·i < −0.01·p_peak flags negative-power-clamped.
  it("ends-mid-pulse caps the verdict at marginal; negative power is clamped and flagged", () => {
    const t = [0, 1e-3, 2e-3];
    const ends = one(fullPart, { kind: "waveform", t, v: [10, 10, 10], i: [0, 1, 1] });
    expect(ends.flags).toContain("ends-mid-pulse");
    expect(ends.verdict).toBe("marginal");
    const back = one(fullPart, {
      kind: "waveform",
      t: [0, 1e-3, 2e-3, 3e-3],
      v: [0, 10, -10, 0],
      i: [0, 1, 1, 0],
    });
    expect(back.flags).toContain("negative-power-clamped");
  });

  // METHODS.md §8: each partial verdict is reported; the stability view needs §12's transfer data, absent here.
  it("reports each view's verdict: curves, thermal, and stability (null until section 12 data)", () => {
    const result = one(fullPart, rect(20, 30, 1e-3));
    expect(result).toMatchObject({ curveVerdict: "pass", thermalVerdict: "pass", stabilityVerdict: null });
    expect(result.stability).toBeNull();
  });
});

// METHODS.md §12–§14 (revision 2): limits the datasheet curves do not show.
describe("stability, avalanche and case heating", () => {
  const transfer = {
    temps: [25, 125] as [number, number],
    curves: [
      [
        [3, 1],
        [4, 20],
      ],
      [
        [3, 3],
        [4, 25],
      ],
    ] as [[number, number][], [number, number][]],
  };
  const stable: PartLimits = { ...utilisationPart, foster: twoTerms, transfer };

  // Worked value, METHODS.md §10 "v2 instability": 5 A at 40 V for 10 ms, Z(10 ms) = 0.1380605 K/W → S = 0.241432.
  it("computes S for a rectangle and a triangle, and flags thermal instability at S ≥ 1", () => {
    const rect = one(stable, { kind: "rect", v: 40, i: 5, duration: 1e-2 });
    expect(rect.stability).toBeCloseTo(0.241432, 6);
    expect(rect.stabilityVerdict).toBe("pass");
    // A triangle of 20 A peak over 20 ms reads t_eq = 10 ms and the largest α of 1–20 A: 0.0543034 A/K.
    const tri = one(stable, { kind: "triangle", v: 40, i: 20, duration: 2e-2 });
    expect(tri.stability).toBeCloseTo(40 * 0.0543034 * 0.1380605, 6);
    // 5 A at 100 V for 1 s (Z → 0.5 K/W): S = 100·0.0437185·Z(1 s) > 1.
    const hot = one({ ...stable, vdsMax: 200 }, { kind: "rect", v: 100, i: 5, duration: 1 });
    expect(hot).toMatchObject({ stabilityVerdict: "fail", verdict: "fail" });
    expect(hot.flags).toContain("thermal-instability");
  });

  it("says stability-outside-data where the transfer curves do not reach the current, and null without them", () => {
    const outside = one(stable, { kind: "rect", v: 40, i: 30, duration: 1e-3 });
    expect(outside).toMatchObject({ stability: null, stabilityVerdict: "no-data" });
    expect(outside.flags).toContain("stability-outside-data");
    expect(one(utilisationPart, { kind: "rect", v: 40, i: 5, duration: 1e-3 }).stabilityVerdict).toBeNull();
    const { foster: _, ...noThermal } = stable;
    expect(one(noThermal, { kind: "rect", v: 40, i: 5, duration: 1e-3 }).stabilityVerdict).toBeNull();
  });

  it("takes a capture's S as the largest over its read samples, each at its own width", () => {
    const e = 1e-9;
    const t = [0, e, 10e-3, 10e-3 + e];
    const result = one(stable, { kind: "waveform", t, v: [40, 40, 40, 40], i: [0, 5, 5, 0] });
    // Every sample carries 200 W; E = 2 J, so each is read at min(E/p, T_rec) = 10 ms (+1 ns).
    expect(result.stability).toBeCloseTo(40 * 0.0437185 * 0.1380605, 5);
  });

  // Worked value, METHODS.md §10 "v2 avalanche".
  it("checks an unclamped turn-off against E_AS derated for the starting temperature", () => {
    const part: PartLimits = { ...utilisationPart, avalanche: { energy: 0.05, breakdown: 100, current: 30 } };
    const result = one(part, { kind: "avalanche", inductance: 10e-6, current: 20, supply: 48 }, 100);
    expect(result).toMatchObject({
      allowedCurrent: null,
      equivalentWidth: null,
      derating: 0.5,
      curveVerdict: "pass",
      stabilityVerdict: null,
      flags: ["avalanche"],
    });
    expect(result.utilisation).toBeCloseTo(0.153846, 6);
    const over = one(part, { kind: "avalanche", inductance: 10e-6, current: 35, supply: 48 }, 100);
    expect(over).toMatchObject({ curveVerdict: "fail", flags: ["avalanche", "over-avalanche-current"] });
    expect(
      one(utilisationPart, { kind: "avalanche", inductance: 1e-6, current: 5, supply: 12 }).curveVerdict,
    ).toBe("no-data");
    // With a thermal model the dumped power is a falling triangle of V_BR·I over t_av (METHODS.md §6).
    const hot = one(
      { ...part, foster: twoTerms },
      { kind: "avalanche", inductance: 10e-6, current: 20, supply: 48 },
      100,
    );
    // t_av = L·I/(V_BR − V_DD) = 10 µH·20 A/52 V = 3.84615 µs; peak power V_BR·I = 2000 W (§13, §6).
    expect(hot.tjPeak).toBeCloseTo(100 + trianglePeak(2000, (10e-6 * 20) / 52), 7);
  });

  // Our choice (the contract refuses such a request; a project may still pair the case with a candidate): a supply at
  // or above V_BR cannot be blocked, so t_av = L·I/(V_BR − V_DD) has no meaning and the pulse fails outright.
  it("fails a turn-off whose supply is at or above the breakdown voltage, never a negative energy", () => {
    const part: PartLimits = {
      ...utilisationPart,
      avalanche: { energy: 0.05, breakdown: 100 },
      foster: twoTerms,
    };
    for (const supply of [100, 120]) {
      const result = one(part, { kind: "avalanche", inductance: 10e-6, current: 20, supply }, 25);
      expect(result).toMatchObject({
        verdict: "fail",
        curveVerdict: "fail",
        tjPeak: null,
        flags: ["over-voltage", "avalanche"],
      });
    }
  });

  // METHODS.md §14 (derived by hand): 20 V × 12 A for 2 ms heats a one-term case path R = 0.05 K/W, τ = 1 ms by
  // 240·0.05·(1 − e^(−2)) K; the curves are derated at the heated case and Tj adds the case rise.
  it("derates at the heated case and adds the case rise to Tj with a case network", () => {
    const caseNetwork = [{ r: 0.05, tau: 1e-3 }];
    const pulses: Pulse[] = [{ id: "p", kind: "rect", v: 20, i: 12, duration: 2e-3 }];
    const [result] = runCheck({
      part: { ...utilisationPart, foster: twoTerms },
      caseTemp: 100,
      caseNetwork,
      pulses,
    }).results;
    const caseRise = 240 * 0.05 * (1 - Math.exp(-2));
    expect(result.derating).toBeCloseTo((175 - 100 - caseRise) / 150, 12);
    const junctionRise = twoTerms.reduce((sum, { r, tau }) => sum + 240 * r * (1 - Math.exp(-2e-3 / tau)), 0);
    expect(result.tjPeak).toBeCloseTo(100 + junctionRise + caseRise, 9);
    expect(result.flags).toContain("case-heating");
  });
});
