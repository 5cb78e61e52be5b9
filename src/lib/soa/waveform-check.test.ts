import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CurveReader, flagsOf } from "./curve-reader";
import { prepareCurveSet } from "./curve-set";
import type { CurveSet, WaveformPulse } from "./types";
import { readWaveform, recordCaseRise, recordFigures, recordStart } from "./waveform-check";

/** A curve set falling with width at every voltage (ordered), with a steeper segment at high voltage. */
const ordered: CurveSet = {
  curves: [1e-4, 1e-3, 1e-2, "DC" as const].map((duration, k) => {
    const level = [2000, 600, 200, 60][k];
    return {
      duration,
      points: [
        [0.5, 300],
        [level / 300, 300],
        [40, level / 40],
        [100, level / 300],
      ] as [number, number][],
    };
  }),
};

/** Every read sample evaluated one by one (METHODS.md §6 as written): the largest ratio, earliest on ties. */
function exhaustive(set: CurveSet, pulse: WaveformPulse, derating: number) {
  const reader = new CurveReader(prepareCurveSet(set));
  const { t, v, i } = pulse;
  const n = t.length;
  let peak = 0;
  let iMax = 0;
  let energy = 0;
  for (let k = 0; k < n; k++) {
    peak = Math.max(peak, v[k] * i[k]);
    iMax = Math.max(iMax, Math.abs(i[k]));
    if (k > 0)
      energy += ((Math.max(v[k - 1] * i[k - 1], 0) + Math.max(v[k] * i[k], 0)) / 2) * (t[k] - t[k - 1]);
  }
  let best = { index: -1, ratio: Number.NEGATIVE_INFINITY };
  let noValue = false;
  for (let k = 0; k < n; k++) {
    if (!(v[k] > 0 && i[k] > 0.001 * iMax)) continue;
    const width = Math.min(energy / (v[k] * i[k]), t[n - 1] - t[0]);
    const ln = reader.read(v[k], width);
    if (Number.isNaN(ln)) {
      noValue = true;
      continue;
    }
    const ratio = i[k] / (derating * Math.exp(ln));
    // Ratios equal to 1e-12 are a tie, and the earliest sample wins (METHODS.md §6).
    if (ratio > best.ratio * (1 + 1e-12)) best = { index: k, ratio };
  }
  return { best, noValue, flags: flagsOf(reader.flags) };
}

const magnitude = (max: number) => fc.double({ min: 0, max, noNaN: true }).map((x) => (x < 1e-3 ? 0 : x));

describe("readWaveform (METHODS.md §6)", () => {
  // Derived: the lower-bound table only skips samples that cannot bind, so a long record reads exactly as every
  // sample evaluated one by one.
  it("finds the same binding sample, flags and missing values as reading every sample", () => {
    fc.assert(
      fc.property(
        // Corners of 0 or of 1 mV/1 mA and more: subnormal magnitudes would test rounding, not the rule.
        fc.array(fc.tuple(magnitude(120), magnitude(400)), { minLength: 4, maxLength: 12 }),
        fc.double({ min: 0.2, max: 1, noNaN: true }),
        (corners, derating) => {
          // A long record through the corners, linear between them (5000 samples: the table is used).
          const n = 5000;
          const t: number[] = [];
          const v: number[] = [];
          const i: number[] = [];
          for (let k = 0; k < n; k++) {
            const x = (k / (n - 1)) * (corners.length - 1);
            const j = Math.min(Math.floor(x), corners.length - 2);
            const f = x - j;
            t.push(k * 1e-6);
            v.push(corners[j][0] * (1 - f) + corners[j + 1][0] * f);
            i.push(corners[j][1] * (1 - f) + corners[j + 1][1] * f);
          }
          const pulse: WaveformPulse = { id: "w", kind: "waveform", t, v, i, start: "rest" };
          const reader = new CurveReader(prepareCurveSet(ordered));
          const reading = readWaveform(reader, pulse, derating);
          const reference = exhaustive(ordered, pulse, derating);
          expect(reading.binding?.index ?? -1).toBe(reference.best.index);
          expect(reading.anyNoValue).toBe(reference.noValue);
          for (const flag of reference.flags) expect(flagsOf(reading.flags)).toContain(flag);
        },
      ),
      { numRuns: 40 },
    );
  });

  it("decides the start from the data unless it is given (METHODS.md §6)", () => {
    expect(recordStart(0.5, 100)).toEqual({ start: "rest", decided: false, startsMidPulse: false });
    expect(recordStart(1, 100)).toEqual({ start: "steady", decided: true, startsMidPulse: true });
    expect(recordStart(50, 100, "rest")).toEqual({ start: "rest", decided: false, startsMidPulse: true });
    expect(recordStart(0, 0)).toEqual({ start: "rest", decided: false, startsMidPulse: false });
  });
});

// METHODS.md §6: p_n = v_n·i_n, E the trapezoid integral of max(p, 0), T_rec = t_last − t_0; worked by hand.
describe("recordFigures (METHODS.md §6)", () => {
  const record: WaveformPulse = {
    id: "r",
    kind: "waveform",
    t: [0, 1e-3, 2e-3],
    v: [10, 10, 10],
    i: [0, 2, -0.5],
  };

  it("sums a record by hand: p = 0, 20, −5 W → p_peak 20 W, E = 10 + 10 mJ, power flowing back", () => {
    expect(recordFigures(record)).toEqual({
      vMax: 10,
      iMaxAbs: 2,
      peakPower: 20,
      // −5 W < −0.01 × 20 W
      negativePower: true,
      energy: expect.closeTo(0.02, 15),
      recordLength: 2e-3,
    });
  });

  it("sums each record once, whatever number of parts reads it", () => {
    expect(recordFigures(record)).toBe(recordFigures(record));
    expect(recordFigures({ ...record })).not.toBe(recordFigures(record));
  });

  // METHODS.md §4: one term R(1 − e^(−t/τ)), R = 0.5 K/W, τ = 1 ms, under 20 W for 1 ms, then p falls linearly to
  // 0 over the next ms. The rise at 1 ms is 20·0.5·(1 − e^(−1)) = 6.32 K; it grows on while R·p exceeds it, but
  // stays below 20 W held for 2 ms: 20·0.5·(1 − e^(−2)) = 8.65 K.
  it("gives the case path's rise once per network, the same for every part", () => {
    const pulse: WaveformPulse = {
      id: "c",
      kind: "waveform",
      t: [0, 0, 1e-3, 2e-3],
      v: [0, 10, 10, 0],
      i: [0, 2, 2, 0],
    };
    const network = [{ r: 0.5, tau: 1e-3 }];
    const rise = recordCaseRise(pulse, network, false);
    expect(rise).toBeGreaterThanOrEqual(20 * 0.5 * (1 - Math.exp(-1)) - 1e-9);
    expect(rise).toBeLessThan(20 * 0.5 * (1 - Math.exp(-2)));
    expect(recordCaseRise(pulse, [{ r: 0.5, tau: 1e-3 }], false)).toBe(rise);
    expect(recordCaseRise(pulse, [{ r: 1, tau: 1e-3 }], false)).toBeCloseTo(2 * rise, 9);
  });
});
