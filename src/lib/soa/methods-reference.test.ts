// Long file: METHODS.md §10's reference checks, kept together in the order the section lists them.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { runCheck } from "./check";
import type { BetweenCurves, CheckRequest, Curve, Flag, Pulse, PulseResult, Verdict } from "./types";

// A second, deliberately plain reading of METHODS.md §2, §3, §5, §6 (curve view), §7 (curve view) and §8, written
// from the text in the linear domain with no preparation, no logarithm tables and no skipping, so that the engine's
// prepared, log-domain and skipping paths are checked against the rules as written on random requests (derived from
// METHODS.md; the same author, but no code shared). Junction temperatures are left to the thermal tests.

type Point = [number, number];
const TOL = 1e-9;

function onCurve(points: Point[], v: number, flags: Set<Flag>, raise = true): number | null {
  const sorted = [...points].sort((a, b) => a[0] - b[0]);
  if (v < sorted[0][0]) {
    if (raise) flags.add("below-curve-range");
    return sorted[0][1];
  }
  const last = sorted[sorted.length - 1];
  if (v > last[0]) {
    if (raise) flags.add("above-curve-range");
    return null;
  }
  for (let j = 0; j < sorted.length; j++) {
    if (sorted[j][0] === v) return sorted[j][1];
    if (sorted[j][0] < v && v < sorted[j + 1][0]) {
      const [[v1, i1], [v2, i2]] = [sorted[j], sorted[j + 1]];
      return i1 * (v / v1) ** (Math.log(i2 / i1) / Math.log(v2 / v1));
    }
  }
  return null;
}

const zthOf = (foster: { r: number; tau: number }[], t: number) =>
  foster.reduce((sum, { r, tau }) => sum + r * (1 - Math.exp(-t / tau)), 0);

function allowed(
  curves: Curve[],
  v: number,
  tp: number,
  policy: BetweenCurves,
  foster: { r: number; tau: number }[] | undefined,
  flags: Set<Flag>,
): number | null {
  const finite = curves
    .filter((c) => c.duration !== "DC")
    .sort((a, b) => (a.duration as number) - (b.duration as number));
  const dc = curves.find((c) => c.duration === "DC");
  const t = finite.map((c) => c.duration as number);
  const m = finite.length;
  let value: number | null;
  let capBy: Curve[];
  const exact = t.findIndex((tk) => Math.abs(tp - tk) <= TOL * tk);
  const thermal = policy === "thermal" && foster !== undefined;
  if (exact >= 0) {
    value = onCurve(finite[exact].points, v, flags);
    capBy = finite.filter((c) => (c.duration as number) <= tp * (1 + TOL));
  } else if (m > 0 && tp < t[0]) {
    flags.add("shorter-than-shortest-curve");
    return onCurve(finite[0].points, v, flags);
  } else if (m > 0 && tp < t[m - 1]) {
    const k = t.findIndex((tk, j) => tk < tp && tp < t[j + 1]);
    capBy = finite.slice(0, k + 1);
    if (thermal) {
      flags.add("thermal-scaled");
      const ik = onCurve(finite[k].points, v, flags);
      value = ik === null ? null : (ik * zthOf(foster, t[k])) / zthOf(foster, tp);
    } else {
      if (policy === "thermal") flags.add("thermal-scaling-unavailable");
      if (policy === "loglog") {
        flags.add("interpolated");
        const a = onCurve(finite[k].points, v, flags);
        const b = onCurve(finite[k + 1].points, v, flags);
        const f = (Math.log(tp) - Math.log(t[k])) / (Math.log(t[k + 1]) - Math.log(t[k]));
        value = a === null || b === null ? null : Math.exp(Math.log(a) + f * (Math.log(b) - Math.log(a)));
      } else {
        flags.add("next-longer-curve");
        value = onCurve(finite[k + 1].points, v, flags);
      }
    }
  } else {
    capBy = finite;
    if (thermal && m > 0) {
      flags.add("thermal-scaled");
      const im = onCurve(finite[m - 1].points, v, flags);
      value = im === null ? null : (im * zthOf(foster, t[m - 1])) / zthOf(foster, tp);
    } else {
      if (policy === "thermal" && m > 0) flags.add("thermal-scaling-unavailable");
      if (dc === undefined) {
        flags.add("longer-than-longest-curve");
        return null;
      }
      flags.add("dc-curve-used");
      value = onCurve(dc.points, v, flags);
    }
  }
  if (value === null) return null;
  let cap = Number.POSITIVE_INFINITY;
  for (const c of capBy) {
    const x = onCurve(c.points, v, flags, false);
    if (x !== null) cap = Math.min(cap, x);
  }
  if (cap < value * (1 - 1e-12)) {
    flags.add("capped-by-shorter-curve");
    return cap;
  }
  return Math.min(value, cap);
}

const rank: Record<Verdict, number> = { pass: 0, marginal: 1, "no-data": 2, fail: 3 };
const worst = (...vs: Verdict[]) => vs.reduce((a, b) => (rank[b] > rank[a] ? b : a), "pass" as Verdict);

/** The curve view of one pulse by the rules as written. */
function reference(request: CheckRequest, pulse: Pulse) {
  const { part, caseTemp } = request;
  const policy = request.policy?.betweenCurves ?? "loglog";
  const uMax = request.policy?.utilisationLimit ?? 0.8;
  const fV = request.policy?.voltageLimit ?? 0.8;
  const tRef = part.soa.refCaseTemp ?? 25;
  const k = Math.min(1, Math.max(0, (part.tjMax - caseTemp) / (part.tjMax - tRef)));
  const flags = new Set<Flag>();
  let allowedCurrent: number | null = null;
  let current = 0;
  let vMax: number;
  let iMax: number;
  let noValueElsewhere = false;
  let cap = false;
  let at: { t: number; v: number; i: number; width: number | null } | null | undefined;
  if (pulse.kind === "rect" || pulse.kind === "triangle") {
    const width = pulse.kind === "triangle" ? pulse.duration / 2 : pulse.duration;
    if (pulse.kind === "triangle") flags.add("equivalent-rectangle");
    const a = allowed(part.soa.curves, pulse.v, width, policy, part.foster, flags);
    allowedCurrent = a === null ? null : k * a;
    current = pulse.i;
    vMax = pulse.v;
    iMax = pulse.i;
  } else if (pulse.kind === "waveform") {
    const { t, v, i } = pulse;
    const n = t.length;
    const p = t.map((_, j) => Math.max(v[j] * i[j], 0));
    const pPeak = Math.max(...p);
    vMax = Math.max(...v);
    iMax = Math.max(...i.map(Math.abs));
    if (t.some((_, j) => v[j] * i[j] < -0.01 * pPeak)) flags.add("negative-power-clamped");
    at = null;
    if (pPeak > 0) {
      flags.add("equivalent-rectangle");
      let energy = 0;
      for (let j = 1; j < n; j++) energy += ((p[j - 1] + p[j]) / 2) * (t[j] - t[j - 1]);
      const tRec = t[n - 1] - t[0];
      const startsMid = p[0] >= 0.01 * pPeak;
      if (startsMid) flags.add("starts-mid-pulse");
      const steady = pulse.start === "steady" || (pulse.start === undefined && startsMid);
      cap = (pulse.start === undefined && startsMid) || p[n - 1] >= 0.01 * pPeak;
      if (p[n - 1] >= 0.01 * pPeak) flags.add("ends-mid-pulse");
      let best: { r: number; j: number; width: number | null; a: number } | null = null;
      let missing = false;
      const visit = (j: number, width: number, asDc: boolean) => {
        const a = allowed(part.soa.curves, v[j], width, policy, part.foster, flags);
        if (a === null) {
          missing = true;
          return;
        }
        const r = i[j] / (k * a);
        if (best === null || r > best.r * (1 + 1e-12)) best = { r, j, width: asDc ? null : width, a };
      };
      for (let j = 0; j < n; j++) {
        if (!(v[j] > 0 && i[j] > 0.001 * iMax)) continue;
        visit(j, Math.min(energy / p[j], tRec), false);
      }
      if (steady && v[0] > 0 && i[0] > 0.001 * iMax) visit(0, Number.POSITIVE_INFINITY, true);
      const found = best as { r: number; j: number; width: number | null; a: number } | null;
      if (found !== null) {
        allowedCurrent = k * found.a;
        current = i[found.j];
        noValueElsewhere = missing;
        at = { t: t[found.j], v: v[found.j], i: i[found.j], width: found.width };
      }
    } else flags.add("no-power");
  } else {
    throw new Error("not drawn here");
  }
  let curve: Verdict;
  if (vMax > part.vdsMax) flags.add("over-voltage");
  else if (vMax > fV * part.vdsMax) flags.add("voltage-margin");
  if (part.idPulseMax !== undefined && iMax > part.idPulseMax) flags.add("over-current");
  const u = allowedCurrent !== null && allowedCurrent > 0 ? current / allowedCurrent : null;
  if (flags.has("over-voltage") || flags.has("over-current")) curve = "fail";
  else if (allowedCurrent === null) curve = "no-data";
  else if (!(allowedCurrent > 0)) curve = "fail";
  else curve = (u as number) <= uMax ? "pass" : (u as number) <= 1 ? "marginal" : "fail";
  if (noValueElsewhere && curve !== "fail") curve = "no-data";
  if (flags.has("voltage-margin")) curve = worst(curve, "marginal");
  return { allowedCurrent, utilisation: u, curve, flags, cap, at };
}

const close = (a: number | null | undefined, b: number | null | undefined) =>
  a === b ||
  (typeof a === "number" && typeof b === "number" && Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(b), 1e-300));

const curveArb = (duration: number | "DC") =>
  fc
    .uniqueArray(fc.double({ min: 0.5, max: 80, noNaN: true }), { minLength: 1, maxLength: 4 })
    .chain((vs) =>
      fc
        .array(fc.double({ min: 0.5, max: 500, noNaN: true }), { minLength: vs.length, maxLength: vs.length })
        .map((is): Curve => ({ duration, points: vs.map((v, j) => [v, is[j]] as Point) })),
    );

/** A sample value: 0, or at least 1 mV or 1 mA in size (subnormal products would test rounding, not the rules). */
const sampleArb = (max: number) =>
  fc.double({ min: -5, max, noNaN: true }).map((x) => (Math.abs(x) < 1e-3 ? 0 : x));

const requestArb = fc
  .record({
    widths: fc.uniqueArray(fc.integer({ min: -5, max: 0 }), { minLength: 1, maxLength: 4 }),
    dc: fc.boolean(),
    foster: fc.boolean(),
    policy: fc.constantFrom<BetweenCurves>("loglog", "next-longer", "thermal"),
    caseTemp: fc.double({ min: 0, max: 160, noNaN: true }).map((x) => Math.round(x * 100) / 100),
    seed: fc.integer(),
  })
  .chain(({ widths, dc, foster, policy, caseTemp }) =>
    fc
      .tuple(
        fc.tuple(...widths.map((e) => curveArb(10 ** e))),
        dc ? curveArb("DC").map((c) => [c]) : fc.constant([] as Curve[]),
        fc.array(
          fc.oneof(
            fc.record({
              kind: fc.constantFrom("rect" as const, "triangle" as const),
              v: fc.double({ min: 0.2, max: 90, noNaN: true }),
              i: fc.double({ min: 0.1, max: 600, noNaN: true }),
              duration: fc.double({ min: -6, max: 1, noNaN: true }).map((e) => 10 ** e),
            }),
            fc
              .array(fc.tuple(sampleArb(90), sampleArb(400)), { minLength: 2, maxLength: 8 })
              .chain((samples) =>
                fc.record({
                  kind: fc.constant("waveform" as const),
                  t: fc.constant(samples.map((_, j) => j * 1e-4)),
                  v: fc.constant(samples.map(([v]) => v)),
                  i: fc.constant(samples.map(([, i]) => i)),
                  start: fc.constantFrom(undefined, "rest" as const, "steady" as const),
                }),
              ),
          ),
          { minLength: 1, maxLength: 4 },
        ),
      )
      .map(
        ([finite, dcCurves, pulses]): CheckRequest => ({
          part: {
            vdsMax: 100,
            tjMax: 175,
            idPulseMax: 450,
            foster: foster
              ? [
                  { r: 0.1, tau: 1e-3 },
                  { r: 0.4, tau: 0.1 },
                ]
              : undefined,
            soa: { curves: [...finite, ...dcCurves] },
          },
          caseTemp,
          policy: { betweenCurves: policy },
          pulses: pulses.map((p, j) => {
            const pulse = { id: `p${j}`, ...p } as Pulse;
            if (pulse.kind === "waveform" && pulse.start === undefined) delete pulse.start;
            return pulse;
          }),
        }),
      ),
  );

describe("the engine against the rules as written (METHODS.md §2–§8, curve view)", () => {
  it("agrees on allowed current, utilisation, curve verdict, flags and the binding sample", () => {
    fc.assert(
      fc.property(requestArb, (request) => {
        const results = runCheck(request).results;
        request.pulses.forEach((pulse, j) => {
          const ours: PulseResult = results[j];
          const theirs = reference(request, pulse);
          expect(close(ours.allowedCurrent, theirs.allowedCurrent), "allowedCurrent").toBe(true);
          expect(close(ours.utilisation, theirs.utilisation), "utilisation").toBe(true);
          expect(ours.curveVerdict).toBe(theirs.curve);
          const ourCurveFlags = ours.flags.filter((f) => f !== "repetition-applied");
          expect([...ourCurveFlags].sort()).toEqual([...theirs.flags].sort());
          if (pulse.kind === "waveform") {
            expect(ours.at === null).toBe(theirs.at === null);
            if (ours.at && theirs.at) {
              expect(ours.at.t).toBe(theirs.at.t);
              expect(close(ours.at.width, theirs.at.width)).toBe(true);
            }
            if (theirs.cap) expect(rank[ours.verdict]).toBeGreaterThanOrEqual(rank.marginal);
          }
        });
      }),
      { numRuns: 300 },
    );
  });
});
