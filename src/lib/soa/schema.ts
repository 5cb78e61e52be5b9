// Request schema of the check contract (METHODS.md §9), shared by the route handler, the command line and
// client forms. Shape and ranges are checked field by field; the rules that relate fields (sorted points,
// unique widths and ids, a period longer than its pulse, a time axis that only moves forward) run once the
// shape is right, so every error names the one field at fault. Decisions beyond METHODS.md:
// - a key the contract does not know, anywhere, is an error naming its path (revision 2: a misspelt
//   `utilisationlimit` must not fall back to the default); a capture with `repeat` is an error (repetition is for
//   rect and triangle) and so is `start` on anything but a capture;
// - every curve holds at least one point, a Foster array at least one term; a request may hold no pulses;
// - the reference case temperature must lie below Tj,max (else no derating factor exists);
// - two curve widths within 1e-9 relative are the same width (the tolerance of METHODS.md §3).
//
// Long file: the contract's whole request shape and its cross-field rules, kept together so that one read shows
// everything a request must satisfy.
import { z } from "zod";
import { SANITY_LIMITS, type SaneQuantity, saneValue } from "./sanity";
import type { CheckRequest } from "./types";

function show(input: unknown): string {
  if (input === null) return "null";
  if (Array.isArray(input)) return "an array";
  if (typeof input === "string") {
    return `the string ${JSON.stringify(input.length > 24 ? `${input.slice(0, 24)}…` : input)}`;
  }
  if (typeof input === "object") return "an object";
  return String(input);
}

/** Message for a missing value or one of the wrong type. */
const expected =
  (what: string) =>
  (issue: { input?: unknown }): string =>
    issue.input === undefined ? "is required" : `expected ${what}, got ${show(issue.input)}`;

const finite = () => z.number({ error: expected("a finite number") });
const positive = () => finite().gt(0, { error: (issue) => `must be greater than 0, got ${issue.input}` });

/**
 * A value refused as physically absurd (sanity.ts: above 100 kV, 1 MA or 10⁶ s, below 1 ps, a temperature outside
 * −273.15…1000 °C). Only the bounds that catch slips are applied: tiny voltages, currents and resistances harm
 * nothing, so only durations have a lower bound.
 */
const sane = (quantity: SaneQuantity, { lower = false } = {}) =>
  z.number().check((payload) => {
    const value = payload.value;
    const { min, max } = SANITY_LIMITS[quantity];
    const size = quantity === "temperature" ? value : Math.abs(value);
    if (size > max || (lower && size < min)) {
      payload.issues.push({
        code: "custom",
        message: saneValue(value, quantity) ?? "out of range",
        input: value,
      });
    }
  });
const volts = () => positive().pipe(sane("voltage"));
const amps = () => positive().pipe(sane("current"));
const seconds = () => positive().pipe(sane("time", { lower: true }));
const celsius = () => finite().pipe(sane("temperature"));
const sample = (quantity: SaneQuantity) => finite().pipe(sane(quantity));
const object = <T extends z.core.$ZodLooseShape>(shape: T) =>
  z.strictObject(shape, {
    error: (issue) =>
      issue.code === "unrecognized_keys"
        ? "is not a field of the check contract"
        : expected("an object")(issue),
  });
const array = <T extends z.core.SomeType>(item: T) => z.array(item, { error: expected("an array") });

const fosterTerm = object({ r: positive(), tau: seconds() });

const point = z.tuple([volts(), amps()], {
  error: (issue) =>
    issue.code === "invalid_type"
      ? expected("a point [v, i]")(issue)
      : "a point is exactly two numbers [v, i]",
});

const curve = object({
  duration: z.union([seconds(), z.literal("DC")], {
    error: (issue) =>
      issue.input === undefined
        ? "is required"
        : `expected a pulse width in seconds (> 0) or "DC", got ${show(issue.input)}`,
  }),
  points: array(point).min(1, { error: "a curve needs at least one point" }),
});

const curveSet = object({
  refCaseTemp: celsius().optional(),
  curves: array(curve).min(1, { error: "at least one curve is required" }),
});

// Transfer characteristics (METHODS.md §12): exactly two temperatures and two curves of at least two points each;
// the order of points is checked with the relations below.
const transfer = object({
  temps: z.tuple([celsius(), celsius()], {
    error: (issue) =>
      issue.code === "invalid_type"
        ? expected("two temperatures [Ta, Tb]")(issue)
        : "exactly two temperatures [Ta, Tb]",
  }),
  curves: z.tuple(
    [
      array(point).min(2, { error: "a transfer curve needs at least two points [vgs, id]" }),
      array(point).min(2, { error: "a transfer curve needs at least two points [vgs, id]" }),
    ],
    {
      error: (issue) =>
        issue.code === "invalid_type"
          ? expected("two curves")(issue)
          : "exactly two curves, one per temperature",
    },
  ),
});

const avalancheRating = object({
  energy: positive(),
  current: amps().optional(),
  breakdown: volts().optional(),
});

const part = object({
  vdsMax: volts(),
  tjMax: celsius(),
  rdsOn: positive().optional(),
  idPulseMax: amps().optional(),
  rthJc: positive().optional(),
  foster: array(fosterTerm).min(1, { error: "a Foster network needs at least one term" }).optional(),
  soa: curveSet,
  transfer: transfer.optional(),
  avalanche: avalancheRating.optional(),
});

const policy = object({
  utilisationLimit: finite()
    .gt(0, { error: "must lie in (0, 1]" })
    .lte(1, { error: "must lie in (0, 1]" })
    .optional(),
  tjGuard: finite().gte(0, { error: "must be 0 K or more" }).optional(),
  voltageLimit: finite()
    .gt(0, { error: "must lie in (0, 1]" })
    .lte(1, { error: "must lie in (0, 1]" })
    .optional(),
  betweenCurves: z
    .enum(["loglog", "next-longer", "thermal"], {
      error: (issue) => `expected "loglog", "next-longer" or "thermal", got ${show(issue.input)}`,
    })
    .optional(),
});

const id = z
  .string({ error: expected("a string") })
  .refine((s) => s.trim().length > 0, { error: "must not be empty" });

const repeat = object({
  period: seconds(),
  count: finite()
    .int({ error: (issue) => `expected a whole number of pulses, got ${show(issue.input)}` })
    .gte(1, { error: "must be 1 or more" })
    .optional(),
});

const rect = object({
  id,
  kind: z.literal("rect"),
  v: volts(),
  i: amps(),
  duration: seconds(),
  repeat: repeat.optional(),
});

const triangle = object({
  id,
  kind: z.literal("triangle"),
  v: volts(),
  i: amps(),
  duration: seconds(),
  repeat: repeat.optional(),
});

const waveform = object({
  id,
  kind: z.literal("waveform"),
  t: array(sample("time")).min(2, { error: "a capture needs at least two samples" }),
  v: array(sample("voltage")),
  i: array(sample("current")),
  start: z
    .enum(["rest", "steady"], {
      error: (issue) => `expected "rest" or "steady", got ${show(issue.input)}`,
    })
    .optional(),
  repeat: z
    .never({ error: "a capture cannot be repeated; repetition applies to rect and triangle pulses" })
    .optional(),
});

const avalanchePulse = object({
  id,
  kind: z.literal("avalanche"),
  inductance: positive(),
  current: amps(),
  supply: sample("voltage").pipe(
    z.number().gte(0, { error: (issue) => `must be 0 V or more, got ${issue.input}` }),
  ),
});

const pulse = z.discriminatedUnion("kind", [rect, triangle, waveform, avalanchePulse], {
  error: (issue) => {
    if (issue.code !== "invalid_union") return expected("an object")(issue);
    const kind = (issue.input as { kind?: unknown } | undefined)?.kind;
    const known = `expected "rect", "triangle", "waveform" or "avalanche"`;
    return kind === undefined ? `is required: ${known}` : `unknown pulse kind ${show(kind)}: ${known}`;
  },
});

type Issue = z.core.$ZodRawIssue;

/** Relative tolerance within which two curve widths are the same (METHODS.md §3). */
const SAME_WIDTH = 1e-9;

/** Rules that relate fields to each other; the request's shape is already known to be right. */
function relations(request: CheckRequest): Issue | null {
  const issue = (path: PropertyKey[], message: string): Issue => ({
    code: "custom",
    message,
    path,
    input: request,
  });
  const { part, pulses } = request;
  const refCaseTemp = part.soa.refCaseTemp ?? 25;
  if (!(refCaseTemp < part.tjMax)) {
    return part.soa.refCaseTemp === undefined
      ? issue(["part", "tjMax"], `must be above the curves' reference case temperature (25 °C by default)`)
      : issue(["part", "soa", "refCaseTemp"], `must be below tjMax (${part.tjMax} °C)`);
  }
  const curves = part.soa.curves;
  for (let c = 0; c < curves.length; c++) {
    const here = ["part", "soa", "curves", c];
    const duration = curves[c].duration;
    for (let other = 0; other < c; other++) {
      const d = curves[other].duration;
      const same =
        duration === "DC" || d === "DC"
          ? duration === d
          : Math.abs(duration - d) <= SAME_WIDTH * Math.max(duration, d);
      if (same) {
        const message =
          duration === "DC"
            ? `a second DC curve (see curves[${other}]); a curve set holds at most one`
            : `same pulse width as curves[${other}]`;
        return issue([...here, "duration"], message);
      }
    }
    const seen = new Map<number, number>();
    const points = curves[c].points;
    for (let p = 0; p < points.length; p++) {
      const earlier = seen.get(points[p][0]);
      if (earlier !== undefined) {
        return issue(
          [...here, "points", p],
          `two points at the same voltage ${points[p][0]} V (points[${earlier}] and points[${p}])`,
        );
      }
      seen.set(points[p][0], p);
    }
  }
  if (part.transfer !== undefined) {
    const [ta, tb] = part.transfer.temps;
    if (!(ta < tb)) return issue(["part", "transfer", "temps"], `Ta must be below Tb, got [${ta}, ${tb}]`);
    for (let c = 0; c < 2; c++) {
      const points = part.transfer.curves[c];
      for (let p = 1; p < points.length; p++) {
        for (const [axis, name] of [
          [0, "V_GS"],
          [1, "I_D"],
        ] as const) {
          if (!(points[p][axis] > points[p - 1][axis])) {
            return issue(
              ["part", "transfer", "curves", c, p],
              `${name} must increase strictly in the order given: ${points[p][axis]} does not follow ${points[p - 1][axis]}`,
            );
          }
        }
      }
    }
  }
  const ids = new Map<string, number>();
  for (let k = 0; k < pulses.length; k++) {
    const pulse = pulses[k];
    const earlier = ids.get(pulse.id);
    if (earlier !== undefined) {
      return issue(
        ["pulses", k, "id"],
        `duplicate pulse id ${JSON.stringify(pulse.id)} (see pulses[${earlier}])`,
      );
    }
    ids.set(pulse.id, k);
    if (pulse.kind === "waveform") {
      const n = pulse.t.length;
      for (const key of ["v", "i"] as const) {
        if (pulse[key].length !== n) {
          return issue(
            ["pulses", k, key],
            `has ${pulse[key].length} samples but t has ${n}; the arrays must be equally long`,
          );
        }
      }
      for (let s = 1; s < n; s++) {
        if (!(pulse.t[s] > pulse.t[s - 1])) {
          return issue(
            ["pulses", k, "t", s],
            `time must increase strictly: t[${s}] = ${pulse.t[s]} s ` +
              `does not follow t[${s - 1}] = ${pulse.t[s - 1]} s`,
          );
        }
      }
    } else if (pulse.kind === "avalanche") {
      const breakdown = part.avalanche?.breakdown ?? part.vdsMax;
      if (!(pulse.supply < breakdown)) {
        return issue(
          ["pulses", k, "supply"],
          `must be below the breakdown voltage (${breakdown} V${part.avalanche?.breakdown === undefined ? ", V_DSS" : ""}), got ${pulse.supply} V`,
        );
      }
    } else if (pulse.repeat !== undefined && !(pulse.repeat.period > pulse.duration)) {
      return issue(
        ["pulses", k, "repeat", "period"],
        `must be longer than the pulse's duration (${pulse.duration} s), got ${pulse.repeat.period} s`,
      );
    }
  }
  return null;
}

/** The check request: shape, ranges, then the rules relating fields (only once the shape is right). */
export const checkRequestSchema: z.ZodType<CheckRequest> = object({
  part,
  caseTemp: celsius(),
  caseNetwork: array(fosterTerm).min(1, { error: "a Foster network needs at least one term" }).optional(),
  policy: policy.optional(),
  pulses: array(pulse),
}).check((payload) => {
  if (payload.issues.length > 0) return;
  const issue = relations(payload.value as CheckRequest);
  if (issue !== null) payload.issues.push(issue);
});

export interface ContractError {
  /** Field path such as `part.soa.curves[1].points[3]`; "" for the request as a whole. */
  path: string;
  message: string;
}

/** `["a", "b", 2, "c"]` → `a.b[2].c`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const key of path) {
    if (typeof key === "number") out += `[${key}]`;
    else out += out === "" ? String(key) : `.${String(key)}`;
  }
  return out;
}

export type Validation = { ok: true; request: CheckRequest } | { ok: false; error: ContractError };

/** Validates an already parsed JSON body; the first problem found is reported with its field path. */
export function validateCheckRequest(body: unknown): Validation {
  const parsed = checkRequestSchema.safeParse(body);
  if (parsed.success) return { ok: true, request: parsed.data };
  const first = parsed.error.issues[0];
  const path = first.code === "unrecognized_keys" ? [...first.path, first.keys[0]] : first.path;
  return { ok: false, error: { path: formatPath(path), message: first.message } };
}
