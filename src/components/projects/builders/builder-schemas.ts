import { z } from "zod";
import { optionalQuantity, quantity } from "@/lib/library/part-schema";
import { parseQuantity } from "@/lib/soa/units";

// The builders' form fields: text in engineering notation ("1.5m", "1.5 mF") read into SI numbers, so the
// engine's builders get plain values. A slew rate is typed in V/ms (the field says so) or with its own unit.

const SLEW_UNITS: Record<string, number> = { "V/s": 1, "V/ms": 1e3, "V/us": 1e6, "V/µs": 1e6, "V/μs": 1e6 };

export const slewQuantity = z.string().transform((text, ctx): number => {
  const match = /^(.*?)\s*(V\/(?:s|ms|us|µs|μs))?\s*$/.exec(text.trim());
  const parsed = parseQuantity(match?.[1] ?? "");
  const scale = SLEW_UNITS[match?.[2] ?? "V/ms"];
  if (!parsed.ok || parsed.unit !== null || typeof parsed.value !== "number") {
    ctx.addIssue({ code: "custom", message: "Enter a slew rate such as 1 (V/ms), 0.5 V/ms or 200 V/s" });
    return z.NEVER;
  }
  if (!(parsed.value > 0)) {
    ctx.addIssue({ code: "custom", message: "Must be greater than zero" });
    return z.NEVER;
  }
  return parsed.value * scale;
});

/** A tolerance in percent ("1", "0.5 %") as a fraction. */
export const tolerance = quantity("%", { positive: false })
  .refine((p) => p >= 0 && p < 100, { message: "Between 0 and 100 %" })
  .transform((p) => p / 100);

const name = z.string().trim().min(1, { message: "Name the fault case" }).max(120);

export const inrushForm = z.object({
  name,
  supply: quantity("V"),
  capacitance: quantity("F"),
  slew: slewQuantity,
  load: optionalQuantity("Ω"),
  equivalent: z.enum(["rect", "triangle"]),
});

export const currentLimitForm = z
  .object({
    name,
    supplyMax: quantity("V"),
    limitCurrentMax: quantity("A"),
    holdTimeMax: quantity("s"),
    restarts: z.boolean(),
    restartPeriod: optionalQuantity("s"),
    restartCount: z.preprocess(
      (v) => (v === "" ? undefined : v),
      z.coerce.number().int({ message: "A whole number" }).min(1, { message: "1 or more" }).optional(),
    ),
  })
  .superRefine((f, ctx) => {
    if (f.restarts && f.restartPeriod === undefined) {
      ctx.addIssue({ code: "custom", path: ["restartPeriod"], message: "Give the restart period" });
    }
  });

export const tripWindowForm = z
  .object({
    shunt: quantity("Ω"),
    shuntTolerance: tolerance,
    reference: quantity("V"),
    referenceTolerance: tolerance,
    divider: z.boolean(),
    r1: optionalQuantity("Ω"),
    r2: optionalQuantity("Ω"),
    dividerTolerance: tolerance,
    offset: optionalQuantity("V", { positive: false }),
  })
  .superRefine((f, ctx) => {
    if (!f.divider) return;
    if (f.r1 === undefined) ctx.addIssue({ code: "custom", path: ["r1"], message: "Give R1" });
    if (f.r2 === undefined) ctx.addIssue({ code: "custom", path: ["r2"], message: "Give R2" });
  });

export const clampForm = z
  .object({
    name,
    /** "clamp": the current falls through a clamp; "none": no clamp below breakdown (an avalanche pulse). */
    clamp: z.enum(["clamp", "none"]),
    inductance: quantity("H"),
    tripCurrent: quantity("A"),
    busVoltage: quantity("V"),
    clampVoltage: optionalQuantity("V"),
    delay: optionalQuantity("s", { positive: false }),
  })
  .superRefine((f, ctx) => {
    if (f.clamp === "clamp" && f.clampVoltage === undefined) {
      ctx.addIssue({ code: "custom", path: ["clampVoltage"], message: "Give the clamp voltage" });
    }
  });

export const sequenceForm = z
  .object({
    name,
    supply: quantity("V"),
    limitCurrent: quantity("A"),
    holdTime: quantity("s"),
    inductance: quantity("H"),
    clamp: z.enum(["clamp", "none"]),
    clampVoltage: optionalQuantity("V"),
    breakdown: optionalQuantity("V"),
    restarts: z.preprocess(
      (v) => (v === "" ? 0 : v),
      z.coerce.number().int({ message: "A whole number" }).min(0, { message: "0 or more" }).max(100, {
        message: "At most 100",
      }),
    ),
    pause: optionalQuantity("s"),
  })
  .superRefine((f, ctx) => {
    if (f.clamp === "clamp" && f.clampVoltage === undefined) {
      ctx.addIssue({ code: "custom", path: ["clampVoltage"], message: "Give the clamp voltage" });
    }
    if (f.clamp === "none" && f.breakdown === undefined) {
      ctx.addIssue({ code: "custom", path: ["breakdown"], message: "Give the breakdown voltage" });
    }
    if (f.restarts > 0 && f.pause === undefined) {
      ctx.addIssue({ code: "custom", path: ["pause"], message: "Give the pause before each restart" });
    }
  });
