import { z } from "zod";
import { editable } from "@/lib/format";
import type { StoredShape } from "@/lib/projects/pulse-columns";
import { faultCaseSchema } from "@/lib/projects/schema";
import type { FaultCaseRecord } from "../api";

// The fault-case form's values as typed, and the schema that turns them into what the fault-case routes take.

export interface FaultCaseFormValues {
  name: string;
  kind: StoredShape;
  v: string;
  i: string;
  duration: string;
  repeats: "single" | "period" | "frequency";
  period: string;
  frequency: string;
  continuous: boolean;
  count: string;
  caseTemp: string;
  notes: string;
}

export const blankFaultCase: FaultCaseFormValues = {
  name: "",
  kind: "rect",
  v: "",
  i: "",
  duration: "",
  repeats: "single",
  period: "",
  frequency: "",
  continuous: false,
  count: "",
  caseTemp: "",
  notes: "",
};

/** The form's shape, turned into what the shared fault-case schema takes (and checks). */
export const faultCaseFormSchema = z
  .object({
    name: z.string(),
    kind: z.enum(["rect", "triangle"]),
    v: z.string(),
    i: z.string(),
    duration: z.string(),
    repeats: z.enum(["single", "period", "frequency"]),
    period: z.string(),
    frequency: z.string(),
    continuous: z.boolean(),
    count: z.string(),
    caseTemp: z.string(),
    notes: z.string(),
  })
  .transform(
    (f): z.input<typeof faultCaseSchema> => ({
      name: f.name,
      kind: f.kind,
      v: f.v,
      i: f.i,
      duration: f.duration,
      repeat:
        f.repeats === "single"
          ? null
          : {
              period: f.repeats === "period" ? f.period : "",
              frequency: f.repeats === "frequency" ? f.frequency : "",
              count: f.continuous ? "" : f.count,
            },
      caseTemp: f.caseTemp,
      notes: f.notes,
    }),
  )
  .pipe(faultCaseSchema);

export function faultCaseValues(row: FaultCaseRecord): FaultCaseFormValues {
  return {
    name: row.name,
    // Only rectangles and triangles are edited here; the table offers no edit for the builders' other shapes.
    kind: row.kind === "triangle" ? "triangle" : "rect",
    v: editable(row.v),
    i: editable(row.i),
    duration: editable(row.duration),
    repeats: row.repeatPeriod === null ? "single" : "period",
    period: editable(row.repeatPeriod),
    frequency: "",
    continuous: row.repeatPeriod !== null && row.repeatCount === null,
    count: row.repeatCount === null ? "" : String(row.repeatCount),
    caseTemp: row.caseTemp === null ? "" : String(row.caseTemp),
    notes: row.notes ?? "",
  };
}

export const faultCaseFields = ["name", "kind", "v", "i", "duration", "caseTemp", "notes"] as const;
