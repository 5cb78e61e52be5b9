// Long file: every field rule of the check contract, one table of broken requests per area.
import { describe, expect, it } from "vitest";
import { formatPath, validateCheckRequest } from "./schema";

/** A valid request as JSON would bring it; each test breaks one thing. */
function request(): Record<string, unknown> & { part: Record<string, unknown> } {
  return {
    part: {
      vdsMax: 60,
      tjMax: 175,
      foster: [{ r: 0.1, tau: 1e-3 }],
      soa: {
        refCaseTemp: 25,
        curves: [
          {
            duration: 1e-3,
            points: [
              [40, 10],
              [10, 50],
            ],
          },
          { duration: "DC", points: [[10, 5]] },
        ],
      },
    },
    caseTemp: 80,
    policy: { utilisationLimit: 0.8, tjGuard: 25, betweenCurves: "loglog" },
    pulses: [
      { id: "r", kind: "rect", v: 20, i: 5, duration: 1e-3, repeat: { period: 1e-2, count: 3 } },
      { id: "t", kind: "triangle", v: 20, i: 5, duration: 1e-3 },
      { id: "w", kind: "waveform", t: [0, 1e-4, 2e-4], v: [20, 20, 20], i: [0, 5, 0] },
    ],
  };
}

function errorOf(body: unknown): { path: string; message: string } {
  const result = validateCheckRequest(body);
  if (result.ok) throw new Error("expected an error");
  return result.error;
}

/** Applies a change to a fresh valid request (by mutation: the fixtures are plain JSON). */
function broken(change: (r: ReturnType<typeof request>) => void): ReturnType<typeof request> {
  const r = request();
  change(r);
  return r;
}

// biome-ignore lint/suspicious/noExplicitAny: tests reach into plain JSON fixtures by path.
type Json = any;

describe("formatPath", () => {
  // Our choice: the field path format of §9's 400 answers (a.b[0].c).
  it("writes keys with dots and indices in brackets", () => {
    expect(formatPath(["part", "soa", "curves", 1, "points", 3])).toBe("part.soa.curves[1].points[3]");
    expect(formatPath([])).toBe("");
    expect(formatPath([0, "a"])).toBe("[0].a");
  });
});

describe("validateCheckRequest", () => {
  // Derived from §9: the contract's request shape.
  it("accepts a valid request and keeps its values", () => {
    const result = validateCheckRequest(request());
    expect(result.ok).toBe(true);
    expect(result.ok && result.request.pulses.map((p) => p.kind)).toEqual(["rect", "triangle", "waveform"]);
  });

  // METHODS.md §9: policy, optional ratings and pulses may be left out of a request.
  it("accepts the smallest request: no policy, no optional ratings, no pulses", () => {
    const body = {
      part: { vdsMax: 1, tjMax: 150, soa: { curves: [{ duration: 1, points: [[1, 1]] }] } },
      caseTemp: 25,
      pulses: [],
    };
    expect(validateCheckRequest(body).ok).toBe(true);
  });

  // METHODS.md §9 (v2): a key the contract does not know, anywhere, is invalid input naming its path.
  it.each([
    [
      "a misspelt policy key",
      (r: Json) => ((r.policy as Json).utilisationlimit = 0.5),
      "policy.utilisationlimit",
    ],
    ["an extra top-level key", (r: Json) => (r.extra = true), "extra"],
    ["an extra part key", (r: Json) => ((r.part as Json).maker = "x"), "part.maker"],
    ["start on a rectangle", (r: Json) => ((r.pulses as Json[])[0].start = "rest"), "pulses[0].start"],
  ])("rejects %s with its path", (_, change, path) => {
    const result = validateCheckRequest(broken(change as never));
    expect(result).toEqual({ ok: false, error: { path, message: "is not a field of the check contract" } });
  });

  // METHODS.md §9 (v2): the voltage limit, the thermal reading between curves and a capture's start.
  it("accepts the v2 fields: voltage limit, thermal reading and a capture's start", () => {
    const capture = (start: string) => ({
      id: "cap",
      kind: "waveform",
      t: [0, 1],
      v: [1, 1],
      i: [1, 1],
      start,
    });
    const body = broken((r) => {
      r.policy = { voltageLimit: 0.9, betweenCurves: "thermal" };
      (r.pulses as Json[]).push(capture("steady"));
    });
    expect(validateCheckRequest(body).ok).toBe(true);
    const wrong = broken((r) => {
      (r.pulses as Json[]).push(capture("hot"));
    });
    expect(validateCheckRequest(wrong)).toMatchObject({ ok: false, error: { path: "pulses[3].start" } });
  });

  // METHODS.md §9: each field's rule, and the error naming the first broken field's path and why.
  it.each([
    ["a body that is not an object", 42, "", "expected an object, got 42"],
    ["a missing part", broken((r) => delete (r as Json).part), "part", "is required"],
    [
      "a negative V_DSS",
      broken((r) => (r.part.vdsMax = -60)),
      "part.vdsMax",
      "must be greater than 0, got -60",
    ],
    [
      "a string NaN",
      broken((r) => (r.part.tjMax = "NaN")),
      "part.tjMax",
      'expected a finite number, got the string "NaN"',
    ],
    [
      "null for a number",
      broken((r) => (r.caseTemp = null)),
      "caseTemp",
      "expected a finite number, got null",
    ],
    ["a zero R_DS(on)", broken((r) => (r.part.rdsOn = 0)), "part.rdsOn", "must be greater than 0, got 0"],
    [
      "a negative I_DM",
      broken((r) => (r.part.idPulseMax = -1)),
      "part.idPulseMax",
      "must be greater than 0, got -1",
    ],
    ["a zero R_th", broken((r) => (r.part.rthJc = 0)), "part.rthJc", "must be greater than 0, got 0"],
    [
      "an empty Foster network",
      broken((r) => (r.part.foster = [])),
      "part.foster",
      "a Foster network needs at least one term",
    ],
    [
      "a Foster τ of 0",
      broken((r) => ((r.part.foster as Json)[0].tau = 0)),
      "part.foster[0].tau",
      "must be greater than 0, got 0",
    ],
    [
      "a negative Foster R",
      broken((r) => ((r.part.foster as Json)[0].r = -1)),
      "part.foster[0].r",
      "must be greater than 0, got -1",
    ],
    [
      "no curves",
      broken((r) => ((r.part.soa as Json).curves = [])),
      "part.soa.curves",
      "at least one curve is required",
    ],
    [
      "a curve without points",
      broken((r) => ((r.part.soa as Json).curves[0].points = [])),
      "part.soa.curves[0].points",
      "a curve needs at least one point",
    ],
    [
      "a zero width",
      broken((r) => ((r.part.soa as Json).curves[0].duration = 0)),
      "part.soa.curves[0].duration",
      'expected a pulse width in seconds (> 0) or "DC", got 0',
    ],
    // Issue 12: physically absurd values are slips (a wrong prefix or unit) and are refused (sanity.ts limits).
    [
      "a pulse of 1 GV",
      broken((r) => ((r.pulses as Json)[0].v = 1e9)),
      "pulses[0].v",
      "1\u2009GV is above 100\u2009kV, the most a voltage can be here: check the prefix and the unit",
    ],
    [
      "a pulse of 0.1 ps",
      broken((r) => ((r.pulses as Json)[0].duration = 1e-13)),
      "pulses[0].duration",
      "1e-13\u2009s is below 1\u2009ps, the least a time can be here: check the prefix and the unit",
    ],
    [
      "a case at 5000 °C",
      broken((r) => (r.caseTemp = 5000)),
      "caseTemp",
      "5000\u2009°C is above 1000\u2009°C, the most a temperature can be here: check the prefix and the unit",
    ],
    [
      "a width word",
      broken((r) => ((r.part.soa as Json).curves[0].duration = "AC")),
      "part.soa.curves[0].duration",
      'expected a pulse width in seconds (> 0) or "DC", got the string "AC"',
    ],
    [
      "a missing width",
      broken((r) => delete (r.part.soa as Json).curves[0].duration),
      "part.soa.curves[0].duration",
      "is required",
    ],
    [
      "a negative current",
      broken((r) => ((r.part.soa as Json).curves[0].points[1][1] = -5)),
      "part.soa.curves[0].points[1][1]",
      "must be greater than 0, got -5",
    ],
    [
      "a point of three numbers",
      broken((r) => ((r.part.soa as Json).curves[0].points[0] = [1, 2, 3])),
      "part.soa.curves[0].points[0]",
      "a point is exactly two numbers [v, i]",
    ],
    [
      "a point that is not a pair",
      broken((r) => ((r.part.soa as Json).curves[0].points[0] = 5)),
      "part.soa.curves[0].points[0]",
      "expected a point [v, i], got 5",
    ],
    [
      "a non-finite reference temperature",
      broken((r) => ((r.part.soa as Json).refCaseTemp = "hot")),
      "part.soa.refCaseTemp",
      'expected a finite number, got the string "hot"',
    ],
    [
      "a utilisation limit above 1",
      broken((r) => ((r.policy as Json).utilisationLimit = 1.2)),
      "policy.utilisationLimit",
      "must lie in (0, 1]",
    ],
    [
      "a utilisation limit of 0",
      broken((r) => ((r.policy as Json).utilisationLimit = 0)),
      "policy.utilisationLimit",
      "must lie in (0, 1]",
    ],
    [
      "a negative guard",
      broken((r) => ((r.policy as Json).tjGuard = -1)),
      "policy.tjGuard",
      "must be 0 K or more",
    ],
    [
      "an unknown policy",
      broken((r) => ((r.policy as Json).betweenCurves = "linear")),
      "policy.betweenCurves",
      'expected "loglog", "next-longer" or "thermal", got the string "linear"',
    ],
    [
      "a long string for a number",
      broken((r) => (r.caseTemp = "twenty-five degrees celsius")),
      "caseTemp",
      'expected a finite number, got the string "twenty-five degrees cels…"',
    ],
    [
      "an object for a number",
      broken((r) => (r.caseTemp = { value: 25 })),
      "caseTemp",
      "expected a finite number, got an object",
    ],
    ["an array for an object", broken((r) => (r.policy = [])), "policy", "expected an object, got an array"],
    [
      "pulses that are not an array",
      broken((r) => (r.pulses = {})),
      "pulses",
      "expected an array, got an object",
    ],
    [
      "a pulse that is not an object",
      broken((r) => (r.pulses = [7])),
      "pulses[0]",
      "expected an object, got 7",
    ],
    [
      "an unknown pulse kind",
      broken((r) => ((r.pulses as Json)[1].kind = "sine")),
      "pulses[1].kind",
      'unknown pulse kind the string "sine": expected "rect", "triangle", "waveform" or "avalanche"',
    ],
    [
      "a missing pulse kind",
      broken((r) => delete (r.pulses as Json)[1].kind),
      "pulses[1].kind",
      'is required: expected "rect", "triangle", "waveform" or "avalanche"',
    ],
    ["an empty id", broken((r) => ((r.pulses as Json)[0].id = " ")), "pulses[0].id", "must not be empty"],
    [
      "a numeric id",
      broken((r) => ((r.pulses as Json)[0].id = 3)),
      "pulses[0].id",
      "expected a string, got 3",
    ],
    [
      "a negative voltage",
      broken((r) => ((r.pulses as Json)[0].v = -20)),
      "pulses[0].v",
      "must be greater than 0, got -20",
    ],
    [
      "a zero duration",
      broken((r) => ((r.pulses as Json)[1].duration = 0)),
      "pulses[1].duration",
      "must be greater than 0, got 0",
    ],
    [
      "a fractional count",
      broken((r) => ((r.pulses as Json)[0].repeat.count = 2.5)),
      "pulses[0].repeat.count",
      "expected a whole number of pulses, got 2.5",
    ],
    [
      "a count of 0",
      broken((r) => ((r.pulses as Json)[0].repeat.count = 0)),
      "pulses[0].repeat.count",
      "must be 1 or more",
    ],
    [
      "a capture of one sample",
      broken((r) => Object.assign((r.pulses as Json)[2], { t: [0], v: [1], i: [1] })),
      "pulses[2].t",
      "a capture needs at least two samples",
    ],
    [
      "a capture sample that is not a number",
      broken((r) => ((r.pulses as Json)[2].i[1] = "5")),
      "pulses[2].i[1]",
      'expected a finite number, got the string "5"',
    ],
    [
      "a repeated capture",
      broken((r) => ((r.pulses as Json)[2].repeat = { period: 1 })),
      "pulses[2].repeat",
      "a capture cannot be repeated; repetition applies to rect and triangle pulses",
    ],
  ])("rejects %s", (_, body, path, message) => {
    expect(errorOf(body)).toEqual({ path, message });
  });

  // Derived from §5 and §9: derating needs the reference case temperature below Tj,max; each broken field is named.
  it.each([
    [
      "a reference temperature at Tj,max",
      broken((r) => ((r.part.soa as Json).refCaseTemp = 175)),
      "part.soa.refCaseTemp",
      "must be below tjMax (175 °C)",
    ],
    [
      "Tj,max below the default reference",
      broken((r) => {
        delete (r.part.soa as Json).refCaseTemp;
        r.part.tjMax = 20;
      }),
      "part.tjMax",
      "must be above the curves' reference case temperature (25 °C by default)",
    ],
    [
      "two DC curves",
      broken((r) => (r.part.soa as Json).curves.push({ duration: "DC", points: [[1, 1]] })),
      "part.soa.curves[2].duration",
      "a second DC curve (see curves[1]); a curve set holds at most one",
    ],
    [
      "two curves of the same width",
      broken((r) => (r.part.soa as Json).curves.push({ duration: 1e-3 * (1 + 1e-12), points: [[1, 1]] })),
      "part.soa.curves[2].duration",
      "same pulse width as curves[0]",
    ],
    [
      "two points at the same voltage, unsorted",
      broken((r) => (r.part.soa as Json).curves[0].points.push([5, 60], [40, 9])),
      "part.soa.curves[0].points[3]",
      "two points at the same voltage 40 V (points[0] and points[3])",
    ],
    [
      "duplicate pulse ids",
      broken((r) => ((r.pulses as Json)[2].id = "r")),
      "pulses[2].id",
      'duplicate pulse id "r" (see pulses[0])',
    ],
    [
      "a period equal to the duration",
      broken((r) => ((r.pulses as Json)[0].repeat.period = 1e-3)),
      "pulses[0].repeat.period",
      "must be longer than the pulse's duration (0.001 s), got 0.001 s",
    ],
    [
      "waveform arrays of different lengths",
      broken((r) => ((r.pulses as Json)[2].v = [20, 20])),
      "pulses[2].v",
      "has 2 samples but t has 3; the arrays must be equally long",
    ],
    [
      "a current array of a different length",
      broken((r) => ((r.pulses as Json)[2].i = [0, 5, 0, 1])),
      "pulses[2].i",
      "has 4 samples but t has 3; the arrays must be equally long",
    ],
    [
      "a time axis going backwards",
      broken((r) => ((r.pulses as Json)[2].t = [0, 2e-4, 1e-4])),
      "pulses[2].t[2]",
      "time must increase strictly: t[2] = 0.0001 s does not follow t[1] = 0.0002 s",
    ],
    [
      "a repeated time",
      broken((r) => ((r.pulses as Json)[2].t = [0, 0, 1e-4])),
      "pulses[2].t[1]",
      "time must increase strictly: t[1] = 0 s does not follow t[0] = 0 s",
    ],
  ])("rejects %s (a rule relating fields)", (_, body, path, message) => {
    expect(errorOf(body)).toEqual({ path, message });
  });

  // Our choice: the first error a caller sees is the simplest to fix.
  it("reports a shape error before any rule relating fields", () => {
    const body = broken((r) => {
      (r.pulses as Json)[2].id = "r";
      (r.pulses as Json)[1].v = -1;
    });
    expect(errorOf(body).path).toBe("pulses[1].v");
  });

  // Derived from §1 and §9: every number finite; undefined is not a number.
  it("accepts a JavaScript NaN, Infinity or undefined nowhere a number is needed", () => {
    expect(errorOf(broken((r) => (r.caseTemp = Number.NaN))).path).toBe("caseTemp");
    expect(errorOf(broken((r) => (r.part.vdsMax = Number.POSITIVE_INFINITY))).path).toBe("part.vdsMax");
    expect(errorOf(broken((r) => (r.caseTemp = undefined)))).toEqual({
      path: "caseTemp",
      message: "is required",
    });
  });
});
