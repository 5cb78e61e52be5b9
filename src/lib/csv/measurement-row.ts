// One measured pulse as the save route accepts it (the paste reader, ./measurements.ts, previews rows; this schema
// is what a save or a bench script's request is checked against).
import { z } from "zod";
import { type SaneQuantity, saneValue } from "@/lib/soa/sanity";
import { MAX_LABEL_LENGTH, MAX_PULSE_COUNT } from "./measurement-cells";

const measuredValue = (what: string, quantity: SaneQuantity) =>
  z
    .number({ error: `${what} must be a finite number` })
    .gt(0, { error: `${what} must be greater than 0` })
    .check((ctx) => {
      const reason = saneValue(ctx.value, quantity);
      if (reason !== null)
        ctx.issues.push({ code: "custom", input: ctx.value, message: `${what}: ${reason}` });
    });

/** Keys a bench script may mean as repetition but which the schema does not read (repetition is `repeat`). */
const STRAY_REPETITION = /^(?!repeat$).*(rep|period|freq|rate|count|cycle|train|burst|interval)/i;

/**
 * One measured pulse as the save route accepts it: SI units within the sanity limits, a period longer than the
 * pulse. Unknown keys are dropped, except ones that look like repetition ("period", "count", "frequency" beside
 * `repeat`): those are refused, so that a train is never checked as a single pulse because of a key's name.
 */
export const measurementRowSchema = z
  .looseObject({
    label: z
      .string({ error: "the label must be text" })
      .trim()
      .min(1, { error: "the label must not be empty" })
      .max(MAX_LABEL_LENGTH, { error: `the label must be at most ${MAX_LABEL_LENGTH} characters` }),
    kind: z.enum(["rect", "triangle"], { error: 'the shape must be "rect" or "triangle"' }),
    v: measuredValue("the voltage", "voltage"),
    i: measuredValue("the current", "current"),
    duration: measuredValue("the pulse width", "time"),
    repeat: z
      .object({
        period: measuredValue("the period", "time"),
        count: z
          .int({ error: "the count must be a whole number" })
          .min(1, { error: "the count must be 1 or more" })
          .max(MAX_PULSE_COUNT, { error: "the count is too large; leave it out for a continuous train" })
          .optional(),
      })
      .optional(),
  })
  .refine((row) => row.repeat === undefined || row.repeat.period > row.duration, {
    path: ["repeat", "period"],
    error: "the period must be longer than the pulse width",
  })
  .superRefine((row, ctx) => {
    for (const key of Object.keys(row).filter((k) => STRAY_REPETITION.test(k))) {
      ctx.addIssue({
        code: "custom",
        path: [key],
        message: `'${key}' is not read: give repetition as repeat: { period, count } (seconds; count optional)`,
      });
    }
  })
  .transform(({ label, kind, v, i, duration, repeat }) => ({
    label,
    kind,
    v,
    i,
    duration,
    ...(repeat === undefined ? {} : { repeat }),
  }));

export type MeasurementInput = z.infer<typeof measurementRowSchema>;
