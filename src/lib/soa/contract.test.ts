import { describe, expect, it } from "vitest";
import { handleCheckRequest, handleCheckText } from "./contract";
import { FLAGS } from "./types";

const curves = [
  {
    duration: 1e-4,
    points: [
      [1, 200],
      [10, 120],
      [60, 12],
    ],
  },
  {
    duration: 1e-3,
    points: [
      [1, 200],
      [10, 60],
      [60, 4],
    ],
  },
  {
    duration: 1e-2,
    points: [
      [1, 150],
      [10, 25],
      [60, 1.5],
    ],
  },
];
const dc = {
  duration: "DC",
  points: [
    [1, 40],
    [60, 0.5],
  ],
};
const foster = [
  { r: 0.05, tau: 1e-4 },
  { r: 0.3, tau: 5e-3 },
  { r: 0.4, tau: 0.08 },
];

const pulses = [
  { id: "rect", kind: "rect", v: 12, i: 20, duration: 5e-4 },
  { id: "rect-train", kind: "rect", v: 12, i: 20, duration: 5e-4, repeat: { period: 5e-3, count: 10 } },
  { id: "slow-train", kind: "rect", v: 12, i: 20, duration: 5e-4, repeat: { period: 5e-2 } },
  { id: "triangle", kind: "triangle", v: 24, i: 30, duration: 4e-4 },
  { id: "triangle-train", kind: "triangle", v: 24, i: 30, duration: 4e-4, repeat: { period: 2e-3 } },
  { id: "long", kind: "rect", v: 5, i: 2, duration: 1 },
  {
    id: "capture",
    kind: "waveform",
    t: [0, 5e-5, 1e-4, 1.5e-4, 2e-4, 2.5e-4],
    v: [30, 29, 27, 20, 8, 1],
    i: [0, 8, 15, 20, 22, 0],
  },
];

function body(options: { foster: boolean; dc: boolean; betweenCurves: "loglog" | "next-longer" }) {
  return {
    part: {
      vdsMax: 60,
      tjMax: 175,
      idPulseMax: 250,
      ...(options.foster ? { foster } : { rthJc: 0.75 }),
      soa: { curves: options.dc ? [...curves, dc] : curves },
    },
    caseTemp: 85,
    policy: { betweenCurves: options.betweenCurves },
    pulses,
  };
}

describe("handleCheckRequest", () => {
  for (const withFoster of [true, false]) {
    for (const withDc of [true, false]) {
      for (const betweenCurves of ["loglog", "next-longer"] as const) {
        it(`answers every pulse (Foster ${withFoster}, DC curve ${withDc}, ${betweenCurves})`, () => {
          const outcome = handleCheckRequest(body({ foster: withFoster, dc: withDc, betweenCurves }));
          if (outcome.status !== 200) throw new Error(JSON.stringify(outcome.body));
          const results = outcome.body.results;
          expect(results.map((r) => r.id)).toEqual(pulses.map((p) => p.id));
          for (const r of results) {
            // METHODS.md §9: revision 2 adds the partial verdicts, stability, equivalent width, repetition
            // scale and, for captures, the binding sample.
            const keys = [
              "allowedCurrent",
              "derating",
              "flags",
              "id",
              "tjPeak",
              "utilisation",
              "verdict",
              "curveVerdict",
              "thermalVerdict",
              "stabilityVerdict",
              "stability",
              "equivalentWidth",
              "repetitionScale",
            ];
            expect(Object.keys(r).sort()).toEqual((r.id === "capture" ? [...keys, "at"] : keys).sort());
            expect(r.derating).toBeCloseTo(0.6, 12);
            expect(["pass", "marginal", "fail", "no-data"]).toContain(r.verdict);
            for (const f of r.flags) expect(FLAGS).toContain(f);
            expect(r.tjPeak === null).toBe(!withFoster);
            expect(JSON.parse(JSON.stringify(r))).toEqual(r);
          }
          const byId = Object.fromEntries(results.map((r) => [r.id, r]));
          expect(byId.rect.flags).toEqual([
            betweenCurves === "loglog" ? "interpolated" : "next-longer-curve",
          ]);
          expect(byId.triangle.flags).toContain("equivalent-rectangle");
          expect(byId.long.flags).toEqual([withDc ? "dc-curve-used" : "longer-than-longest-curve"]);
          expect(byId.long.verdict === "no-data").toBe(!withDc);
          expect(byId.capture.flags).toContain("equivalent-rectangle");
          expect(byId["rect-train"].allowedCurrent as number).toBeLessThan(
            byId.rect.allowedCurrent as number,
          );
          // Without a Foster network, repetition reads Z_th off the curves, which end at 10 ms: no data
          // beyond.
          expect(byId["slow-train"].flags.includes("repetition-outside-data")).toBe(!withFoster);
          if (withFoster)
            expect(byId["rect-train"].tjPeak as number).toBeGreaterThan(byId.rect.tjPeak as number);
        });
      }
    }
  }

  // Derived from §9: invalid input answers 400 with the field path and the reason.
  it("answers 400 with the field path for an invalid request", () => {
    expect(handleCheckRequest({ caseTemp: 25, pulses: [] })).toEqual({
      status: 400,
      body: { error: { path: "part", message: "is required" } },
    });
  });
});

describe("handleCheckText", () => {
  // Derived from §9: the contract's text entry point answers as the object one does.
  it("parses JSON text and checks it", () => {
    const outcome = handleCheckText(
      JSON.stringify(body({ foster: true, dc: true, betweenCurves: "loglog" })),
    );
    expect(outcome.status).toBe(200);
  });

  // Derived from §9 (400 with a path); our choice: the whole body's path is "".
  it('rejects text that is not JSON (a bare NaN, say) at path "" without a stack trace', () => {
    const outcome = handleCheckText('{"caseTemp": NaN}');
    expect(outcome.status).toBe(400);
    if (outcome.status !== 400) return;
    expect(outcome.body.error.path).toBe("");
    expect(outcome.body.error.message).toMatch(/^the request is not valid JSON: /);
    expect(outcome.body.error.message).not.toMatch(/\n\s+at /);
    expect(handleCheckText("").status).toBe(400);
  });
});
