import { describe, expect, it } from "vitest";
import { waveformEquivalent } from "@/lib/soa/equivalent-rectangle";
import { powerFromVI, waveformRise } from "@/lib/soa/thermal-waveform";
import {
  captureTrace,
  caseTrace,
  decimateMinMax,
  junctionTrace,
  processCapture,
  summariseCapture,
  TRACE_BUCKETS,
} from "./process";
import { decodeSamples, decodeSamplesStream, encodeSamples, encodeSamplesParts } from "./samples-binary";

const f64 = (values: number[]) => Float64Array.from(values);

/**
 * A turn-off triangle: V constant, I falling linearly from iPeak to 0 over `width`, with as long a rest before
 * and after. `samples` − 1 must be a multiple of 3, so that both kinks fall on samples.
 */
function triangleCapture(samples: number, v = 40, iPeak = 25, width = 1e-3) {
  const third = (samples - 1) / 3;
  const h = width / third;
  const t = Float64Array.from({ length: samples }, (_, k) => (k - third) * h);
  const i = Float64Array.from({ length: samples }, (_, k) =>
    k >= third && k <= 2 * third ? iPeak * (1 - (k - third) / third) : 0,
  );
  return { t, v: new Float64Array(samples).fill(v), i };
}

describe("decimateMinMax", () => {
  it("splits samples into runs of equal count, each at its first sample's time with its min and max", () => {
    const t = f64([0, 1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const y = f64([5, -1, 2, 0, 9, 3, 4, 4, -7, 1]);
    expect(decimateMinMax(t, y, 3)).toEqual({
      t: [0, 3, 6],
      y: [
        [-1, 5],
        [0, 9],
        [-7, 4],
      ],
    });
  });

  it("keeps every sample when there are fewer samples than buckets, and gives nothing for nothing", () => {
    expect(decimateMinMax(f64([0, 1]), f64([2, 3]), 10)).toEqual({
      t: [0, 1],
      y: [
        [2, 2],
        [3, 3],
      ],
    });
    expect(decimateMinMax(f64([]), f64([]), 10)).toEqual({ t: [], y: [] });
    expect(decimateMinMax(f64([0, 1, 2]), f64([1, 2, 3]), 0).t).toEqual([0]);
  });

  it("never loses a one-sample spike, whatever bucket it falls in", () => {
    const n = 100_003;
    const t = Float64Array.from({ length: n }, (_, k) => k * 1e-7);
    const y = new Float64Array(n);
    y[77_777] = 1000;
    y[12_345] = -50;
    const trace = decimateMinMax(t, y, TRACE_BUCKETS);
    expect(trace.t).toHaveLength(TRACE_BUCKETS);
    expect(Math.max(...trace.y.map(([, max]) => max))).toBe(1000);
    expect(Math.min(...trace.y.map(([min]) => min))).toBe(-50);
  });

  it("leaves NaN samples out of min and max; a run of only NaN gives [NaN, NaN]", () => {
    const trace = decimateMinMax(f64([0, 1, 2, 3]), f64([Number.NaN, 2, Number.NaN, Number.NaN]), 2);
    expect(trace.y).toEqual([
      [2, 2],
      [Number.NaN, Number.NaN],
    ]);
  });
});

describe("summariseCapture", () => {
  it("gives the triangle's energy V·I_pk·t_p/2, its peak and the engine's equal-energy rectangle", () => {
    const { t, v, i } = triangleCapture(30_001);
    const p = powerFromVI(v, i);
    const summary = summariseCapture(t, v, i, p);
    expect(summary).toMatchObject({ samples: 30_001, uniform: true, tStart: -1e-3, vMax: 40, iMaxAbs: 25 });
    expect(summary.tEnd).toBeCloseTo(2e-3, 15);
    expect(summary.pPeak).toBe(1000);
    expect(summary.tPeak).toBeCloseTo(0, 15);
    // Trapezoids are exact for power linear between samples: the triangle, plus the step of its sampled edge.
    const h = 1e-3 / 10_000;
    expect(summary.energy).toBeCloseTo((40 * 25 * 1e-3) / 2 + (40 * 25 * h) / 2, 12);
    const rect = waveformEquivalent(t, p);
    if (!rect.ok || !summary.equivalent.ok) throw new Error("expected a rectangle");
    expect(summary.equivalent).toEqual({ ok: true, v: 40, i: 25, duration: rect.duration });
  });

  it("reads the rectangle's point as magnitudes when both probes are reversed", () => {
    const { t, v, i } = triangleCapture(1000);
    const [nv, ni] = [v.map((x) => -x), i.map((x) => -x)];
    const summary = summariseCapture(t, nv, ni, powerFromVI(nv, ni));
    expect(summary.equivalent).toMatchObject({ ok: true, v: 40, i: 25 });
    expect(summary.iMaxAbs).toBe(25);
    expect(summary.vMax).toBe(-40);
  });

  // METHODS.md §6 (v2): the whole record's energy, by the trapezoid rule (worked by hand here).
  it("integrates energy over the whole capture and draws the rectangle at E/p_peak", () => {
    const t = f64([0, 1, 2, 3, 4]);
    const v = f64([10, 10, 10, 10, 10]);
    const i = f64([0.2, 0.2, 10, 0.2, 0.2]);
    const summary = summariseCapture(t, v, i, powerFromVI(v, i));
    expect(summary.energy).toBeCloseTo(2 + 2 * 51 + 2, 12);
    expect(summary.equivalent).toEqual({ ok: true, v: 10, i: 10, duration: 1.06 });
  });

  it("flags a capture without positive power as no-power", () => {
    const t = f64([0, 1e-6, 2e-6]);
    const zero = f64([0, 0, 0]);
    expect(summariseCapture(t, zero, zero, zero).equivalent).toEqual({ ok: false, flag: "no-power" });
  });

  it("counts time stamps printed to a few digits as uniform, and a missing sample as not", () => {
    // 8 digits of 0.0123… resolve 0.1 ns: each 33.3 ns step jitters by up to 0.3 %.
    const printed = Float64Array.from({ length: 1000 }, (_, k) =>
      Number((0.0123 + (k * 1e-7) / 3).toPrecision(8)),
    );
    const steps = printed.subarray(1).map((time, k) => time - printed[k]);
    expect(Math.max(...steps) / Math.min(...steps)).toBeGreaterThan(1.002);
    const ones = new Float64Array(1000).fill(1);
    expect(summariseCapture(printed, ones, ones, ones).uniform).toBe(true);
    const gap = Float64Array.from({ length: 1000 }, (_, k) => (k < 500 ? k : k + 1) * 5e-8);
    expect(summariseCapture(gap, ones, ones, ones).uniform).toBe(false);
  });

  it("summarises a single sample, and refuses none or mismatched lengths", () => {
    const one = f64([2]);
    expect(summariseCapture(f64([0.5]), one, one, f64([4]))).toMatchObject({
      samples: 1,
      uniform: true,
      energy: 0,
      tPeak: 0.5,
      equivalent: { ok: false, flag: "too-few-samples" },
    });
    expect(() => summariseCapture(f64([]), f64([]), f64([]), f64([]))).toThrow(RangeError);
    expect(() => summariseCapture(f64([0, 1]), f64([1]), f64([1, 2]), f64([1, 2]))).toThrow(RangeError);
  });
});

describe("processCapture and captureTrace", () => {
  it("computes p = v·i and draws V, I and P on the same buckets", () => {
    const samples = triangleCapture(10_000);
    const { p, summary, trace } = processCapture(samples, 500);
    expect(p[4000]).toBe(samples.v[4000] * samples.i[4000]);
    expect(summary.samples).toBe(10_000);
    expect(trace.t).toHaveLength(500);
    expect([trace.v.length, trace.i.length, trace.p.length]).toEqual([500, 500, 500]);
    expect(trace).toEqual(captureTrace(samples.t, samples.v, samples.i, p, 500));
    expect(Math.max(...trace.p.map(([, max]) => max))).toBe(1000);
  });
});

describe("junctionTrace", () => {
  it("is the engine's rise on the case temperature, with its instant and a trace on the capture's buckets", () => {
    const { t, v, i } = triangleCapture(19_999);
    const p = powerFromVI(v, i);
    const network = [
      { r: 0.05, tau: 2e-5 },
      { r: 0.2, tau: 5e-4 },
      { r: 0.4, tau: 8e-3 },
      { r: 0.3, tau: 6e-2 },
    ];
    const rise = waveformRise(t, p, network);
    const junction = junctionTrace(t, p, network, 60, { buckets: 400 });
    expect(junction.start).toBe("rest");
    expect(junction.tjPeak).toBe(60 + rise.maxRise);
    expect(junction.tPeak).toBe(rise.maxTime);
    expect(junction.trace.t).toEqual(decimateMinMax(t, p, 400).t);
    expect(junction.trace.y[0]).toEqual([60, expect.any(Number)]);
    // The drawn trace holds the samples; the peak between them is at least as high.
    expect(Math.max(...junction.trace.y.map(([, max]) => max))).toBeLessThanOrEqual(junction.tjPeak);
  });

  it("heats the case through a case path: T_C is the Foster step response, T_j adds it", () => {
    // 100 W for 50 ms on a one-term case path R = 0.5 K/W, τ = 20 ms: T_C(50 ms) = 25 + 100·0.5·(1 − e^(−2.5))
    // = 70.895 °C (Foster step response, JEDEC JESD24-3's single-pulse Z_θ of one RC term; by hand).
    const n = 5001;
    const t = Float64Array.from({ length: n }, (_, k) => (k / (n - 1)) * 0.05);
    const p = new Float64Array(n).fill(100);
    const casePath = [{ r: 0.5, tau: 0.02 }];
    const heated = caseTrace(t, p, casePath, 25, { start: "rest" });
    expect(heated.tjPeak).toBeCloseTo(25 + 50 * (1 - Math.exp(-2.5)), 9);
    const network = [{ r: 0.2, tau: 1e-3 }];
    const junction = junctionTrace(t, p, network, 25, { start: "rest", caseNetwork: casePath });
    // Both networks driven by the same power (METHODS.md §14): the rises add, 100·0.2·(1 − e^(−50)) = 20 K more.
    expect(junction.tjPeak).toBeCloseTo(heated.tjPeak + 20, 9);
    expect(junctionTrace(t, p, network, 25, { start: "rest" }).tjPeak).toBeCloseTo(45, 9);
  });
});

describe("encodeSamples / decodeSamples", () => {
  it("round-trips every bit, signed zeros and non-finite values included", () => {
    const samples = {
      t: f64([-1e-3, 0, 5e-8, Number.MIN_VALUE]),
      v: f64([-0, 48.000000000000014, Number.NaN, Number.POSITIVE_INFINITY]),
      i: f64([1e300, -1e-300, 0.1 + 0.2, -0]),
    };
    const bytes = encodeSamples(samples);
    expect(bytes.byteLength).toBe(16 + 24 * 4);
    const back = decodeSamples(bytes);
    for (const key of ["t", "v", "i"] as const) {
      expect(Buffer.from(back[key].buffer, back[key].byteOffset, back[key].byteLength)).toEqual(
        Buffer.from(samples[key].buffer),
      );
    }
  });

  it("decodes bytes that sit at an odd offset in a larger buffer (as a download may)", () => {
    const samples = triangleCapture(1000);
    const bytes = encodeSamples(samples);
    const host = new Uint8Array(bytes.byteLength + 3);
    host.set(bytes, 3);
    const back = decodeSamples(host.subarray(3));
    expect(Array.from(back.i)).toEqual(Array.from(samples.i));
  });

  it("gives the same bytes in four pieces that share the samples' memory", () => {
    const samples = triangleCapture(100);
    const parts = encodeSamplesParts(samples);
    expect(parts.map((p) => p.byteLength)).toEqual([16, 800, 800, 800]);
    expect(parts[1].buffer).toBe(samples.t.buffer);
    expect(Buffer.concat(parts)).toEqual(Buffer.from(encodeSamples(samples)));
  });

  it("reads a samples object from chunks of any size", async () => {
    const samples = triangleCapture(1000);
    const bytes = encodeSamples(samples);
    for (const size of [1, 7, 16, 17, 4096, bytes.length]) {
      async function* chunks() {
        for (let k = 0; k < bytes.length; k += size) yield bytes.slice(k, k + size);
      }
      const back = await decodeSamplesStream(chunks());
      expect(Array.from(back.v)).toEqual(Array.from(samples.v));
      expect(Array.from(back.t)).toEqual(Array.from(samples.t));
    }
    async function* cut() {
      yield bytes.subarray(0, 100);
    }
    await expect(decodeSamplesStream(cut())).rejects.toThrow(/does not hold 1000 samples/);
    async function* longer() {
      yield bytes;
      yield bytes.subarray(0, 8);
    }
    await expect(decodeSamplesStream(longer())).rejects.toThrow(/longer than its header/);
    async function* foreign() {
      yield new TextEncoder().encode("time,v,i\n0,1,2\n1,2,3\n");
    }
    await expect(decodeSamplesStream(foreign())).rejects.toThrow(/not a capture samples object/);
  });

  it("refuses anything that is not a whole samples object", () => {
    const bytes = encodeSamples(triangleCapture(10));
    expect(() => decodeSamples(bytes.subarray(0, 10))).toThrow(RangeError);
    expect(() => decodeSamples(bytes.subarray(0, bytes.length - 8))).toThrow(/does not hold 10 samples/);
    const wrong = bytes.slice();
    wrong[0] = 0x41;
    expect(() => decodeSamples(wrong)).toThrow(/not a capture samples object/);
    expect(() => encodeSamples({ t: f64([0, 1]), v: f64([1]), i: f64([1, 2]) })).toThrow(RangeError);
  });
});
