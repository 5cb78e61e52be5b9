import { z } from "zod";
import { optionalQuantity, quantity } from "@/lib/library/part-schema";

// Shared by the project forms and the route handlers. Quantities accept engineering notation ("48 V", "2 ms").

export const projectSchema = z
  .object({
    name: z.string().trim().min(1, { message: "Name the project" }).max(120),
    description: z.preprocess((v) => (v === "" ? undefined : v), z.string().trim().max(4000).optional()),
    caseTemp: quantity("°C", { positive: false }).refine((t) => t >= -55 && t <= 200, {
      message: "Case temperature between −55 °C and 200 °C",
    }),
    utilisationLimit: z.coerce
      .number()
      .gt(0, { message: "Above 0" })
      .max(1, { message: "At most 1 (100 %)" })
      .default(0.8),
    tjGuard: z.coerce.number().min(0, { message: "0 K or more" }).max(200).default(25),
    voltageLimit: z.coerce
      .number()
      .gt(0, { message: "Above 0" })
      .max(1, { message: "At most 1 (100 % of V_DSS)" })
      .default(0.8),
    betweenCurves: z.enum(["loglog", "next-longer", "thermal"]).default("loglog"),
    ownerId: z.uuid().nullable().optional(),
    /** Case-to-ambient Foster network (METHODS.md §14); null removes it, absent leaves it as it is. */
    caseNetwork: z
      .array(z.object({ r: quantity("K/W"), tau: quantity("s") }))
      .max(8, { message: "At most 8 terms" })
      .nullable()
      .optional(),
    applyCaseNetwork: z.boolean().optional(),
  })
  .refine((p) => !p.applyCaseNetwork || p.caseNetwork === undefined || Boolean(p.caseNetwork?.length), {
    path: ["caseNetwork"],
    message: "Give the case path's terms, or do not apply it",
  });

export type ProjectInput = z.input<typeof projectSchema>;

/** Repetition: a period or a frequency, a count or continuous. */
const repeatSchema = z
  .object({
    period: optionalQuantity("s"),
    frequency: optionalQuantity("Hz"),
    count: z.preprocess(
      (v) => (v === "" || v === null ? undefined : v),
      z.coerce.number().int({ message: "A whole number" }).min(1).optional(),
    ),
  })
  .transform((r, ctx) => {
    const period = r.period ?? (r.frequency ? 1 / r.frequency : undefined);
    if (period === undefined) {
      ctx.addIssue({ code: "custom", path: ["period"], message: "Give the period or the frequency" });
      return z.NEVER;
    }
    return { period, ...(r.count !== undefined ? { count: r.count } : {}) };
  });

const caseName = z.string().trim().min(1, { message: "Name the fault case" }).max(120);
const caseTemp = z.preprocess(
  (v) => (v === "" ? null : v),
  quantity("°C", { positive: false }).nullable().optional(),
);
const caseNotes = z.preprocess((v) => (v === "" ? undefined : v), z.string().trim().max(2000).optional());
const caseOrigin = z
  .object({
    builder: z.string().max(40),
    input: z.record(z.string(), z.unknown()),
    figures: z.record(z.string(), z.unknown()),
  })
  .nullable()
  .optional();

/** A rectangle or falling triangle: typed in the fault-case form, or from a pulse builder. */
export const faultCaseSchema = z
  .object({
    name: caseName,
    kind: z.enum(["rect", "triangle"]),
    v: quantity("V"),
    i: quantity("A"),
    duration: quantity("s"),
    repeat: repeatSchema.nullable().optional(),
    caseTemp,
    notes: caseNotes,
    origin: caseOrigin,
  })
  .refine((c) => !c.repeat || c.repeat.period > c.duration, {
    path: ["repeat", "period"],
    message: "The period must be longer than the pulse",
    // Checked whenever both figures were read, even while another field is wrong: every error at once.
    when: (payload) => {
      const value = payload.value as { duration?: unknown; repeat?: { period?: unknown } | null };
      return typeof value.duration === "number" && typeof value.repeat?.period === "number";
    },
  });

/** An unclamped turn-off (METHODS.md §13): the current cut, the loop inductance and the supply. */
export const avalancheCaseSchema = z.object({
  name: caseName,
  kind: z.literal("avalanche"),
  supply: quantity("V"),
  current: quantity("A"),
  inductance: quantity("H"),
  caseTemp,
  notes: caseNotes,
  origin: caseOrigin,
});

/** The most samples a fault sequence may hold: 100 restarts of the builder's pieces fit well within it. */
export const SEQUENCE_MAX_SAMPLES = 5000;
const sampleValue = z.number().refine(Number.isFinite, { message: "Must be a finite number" });
const sampleArray = z.array(sampleValue).min(2).max(SEQUENCE_MAX_SAMPLES);

/** A fault sequence built as one waveform (hold, turn-off, pause, restart): its samples in SI units. */
export const sequenceCaseSchema = z.object({
  name: caseName,
  kind: z.literal("waveform"),
  samples: z.object({ t: sampleArray, v: sampleArray, i: sampleArray }).superRefine((s, ctx) => {
    for (const key of ["v", "i"] as const) {
      if (s[key].length !== s.t.length) {
        ctx.addIssue({
          code: "custom",
          path: [key],
          message: `Has ${s[key].length} samples but t has ${s.t.length}`,
        });
        return;
      }
    }
    for (let n = 1; n < s.t.length; n++) {
      if (!(s.t[n] > s.t[n - 1])) {
        ctx.addIssue({
          code: "custom",
          path: ["t", n],
          message: `Time must increase strictly at sample ${n}`,
        });
        return;
      }
    }
    const negative = s.v.findIndex((v) => v < 0);
    if (negative >= 0) {
      ctx.addIssue({ code: "custom", path: ["v", negative], message: "A sequence's voltage is 0 V or more" });
    }
  }),
  caseTemp,
  notes: caseNotes,
  origin: caseOrigin,
});

/** Any fault case the routes accept, told apart by its kind. */
export const anyFaultCaseSchema = z.discriminatedUnion("kind", [
  faultCaseSchema,
  avalancheCaseSchema,
  sequenceCaseSchema,
]);

export type FaultCaseInput = z.input<typeof faultCaseSchema>;

/** A lead's signed choice (POST /api/projects/:id/decisions): the candidate and why. */
export const signDecisionSchema = z.object({
  partId: z.string().min(1, { message: "Choose a candidate" }),
  rationale: z.string().trim().min(10, { message: "Say why, in a sentence or more" }).max(4000),
  /** One per signing form: a double submission is answered 409. */
  idempotencyKey: z.string().min(8).max(100).optional(),
});
export type SignDecisionValues = z.input<typeof signDecisionSchema>;
