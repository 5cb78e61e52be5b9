import { z } from "zod";
import { type CaptureMapping, type CapturePreview, captureMappingSchema } from "@/lib/capture/parse";

// The column picker's form: which columns are time, voltage and current, the time unit, per channel scale and
// offset, and what is stored with the capture; and the mapping the upload is read with.

export const timeUnits = [
  { value: "1", label: "s" },
  { value: "0.001", label: "ms" },
  { value: "0.000001", label: "µs" },
  { value: "1e-9", label: "ns" },
];

const number = (message: string) =>
  z
    .string()
    .trim()
    .min(1, { message })
    .transform((s) => Number(s.replace(",", ".")))
    .refine((n) => Number.isFinite(n), { message });

/** A column picked in a select: "" until the user chooses one. */
const columnChoice = (message: string) =>
  z
    .union([z.string(), z.number()])
    .transform((v) => (v === "" ? Number.NaN : Number(v)))
    .pipe(z.number({ error: message }).int({ error: message }).min(0, { error: message }));

export const pickerSchema = z
  .object({
    name: z.string().trim().min(1, { message: "Name the capture" }).max(120),
    time: columnChoice("Choose the time column"),
    voltage: columnChoice("Choose the voltage column"),
    current: columnChoice("Choose the current column"),
    timeScale: z.coerce.number().positive(),
    vScale: number("A number, e.g. 10 for a 10:1 probe").refine((n) => n !== 0, { message: "Not 0" }),
    vOffset: number("A number in V, e.g. 0"),
    iScale: number("A number, e.g. 0.1 for 100 mV/A").refine((n) => n !== 0, { message: "Not 0" }),
    iOffset: number("A number in A, e.g. 0"),
    start: z.enum(["auto", "rest", "steady"]),
    boardSerial: z.string().max(80),
    probe: z.string().max(120),
    note: z.string().max(2000),
  })
  .refine((f) => new Set([f.time, f.voltage, f.current]).size === 3, {
    path: ["current"],
    message: "Time, voltage and current need three different columns",
  });

export type PickerValues = z.input<typeof pickerSchema>;
export type PickerInput = z.output<typeof pickerSchema>;

export type PickedCapture = {
  name: string;
  mapping: CaptureMapping;
  /** What came before the record (METHODS.md §6); "auto": the engine decides from the data. */
  start: "auto" | "rest" | "steady";
  boardSerial: string;
  probe: string;
  note: string;
};

/** The form's first values: the preview's suggested mapping, else the first numeric columns in order. */
export function pickerDefaults(fileName: string, preview: CapturePreview): PickerValues {
  const suggested = preview.mapping;
  const numeric = preview.columns.filter((c) => c.numeric).map((c) => c.index);
  // Without a suggestion, only numeric columns are offered as defaults; otherwise the user chooses.
  const fallback = (k: number) => (numeric[k] === undefined ? "" : String(numeric[k]));
  return {
    name: fileName.replace(/\.(csv|tsv|txt)$/i, ""),
    time: suggested ? String(suggested.time) : fallback(0),
    voltage: suggested ? String(suggested.voltage) : fallback(1),
    current: suggested ? String(suggested.current) : fallback(2),
    timeScale: String(suggested?.timeScale ?? 1),
    vScale: String(suggested?.vScale ?? 1),
    vOffset: "0",
    iScale: String(suggested?.iScale ?? 1),
    iOffset: "0",
    start: "auto",
    boardSerial: "",
    probe: "",
    note: "",
  };
}

/** What the picker hands over: the capture's name and details, and the mapping with the preview's rows. */
export function pickedCapture(preview: CapturePreview, f: PickerInput): PickedCapture {
  const mapping = captureMappingSchema.parse({
    skipRows: preview.headerRow ?? preview.dataRow ?? 0,
    header: preview.headerRow !== null,
    delimiter: preview.delimiter,
    time: f.time,
    voltage: f.voltage,
    current: f.current,
    timeScale: f.timeScale,
    vScale: f.vScale,
    vOffset: f.vOffset,
    iScale: f.iScale,
    iOffset: f.iOffset,
  });
  return {
    name: f.name,
    mapping,
    start: f.start,
    boardSerial: f.boardSerial,
    probe: f.probe,
    note: f.note,
  };
}

/** "B · CH1 (V)": a column's letter and header, with its unit when the header does not already show it. */
export function columnName(preview: CapturePreview, index: number): string {
  const column = preview.columns[index];
  const letter = String.fromCharCode(65 + (index % 26));
  return column
    ? `${letter} · ${column.label}${column.unit && !column.label.includes(column.unit) ? ` (${column.unit})` : ""}`
    : letter;
}
