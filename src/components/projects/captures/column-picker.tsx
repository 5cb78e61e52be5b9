"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import { z } from "zod";
import { Button, FormActions, SelectField } from "@/components/form";
import { UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import { type CaptureMapping, type CapturePreview, captureMappingSchema } from "@/lib/capture/parse";
import { formatQuantity } from "@/lib/soa/units";

const timeUnits = [
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

const pickerSchema = z
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

type PickerValues = z.input<typeof pickerSchema>;
export type PickedCapture = {
  name: string;
  mapping: CaptureMapping;
  /** What came before the record (METHODS.md §6); "auto": the engine decides from the data. */
  start: "auto" | "rest" | "steady";
  boardSerial: string;
  probe: string;
  note: string;
};

function columnName(preview: CapturePreview, index: number): string {
  const column = preview.columns[index];
  const letter = String.fromCharCode(65 + (index % 26));
  return column
    ? `${letter} · ${column.label}${column.unit && !column.label.includes(column.unit) ? ` (${column.unit})` : ""}`
    : letter;
}

function cellNumber(cell: string | undefined, decimalComma: boolean): number {
  if (cell === undefined || cell === "") return Number.NaN;
  return Number(decimalComma ? cell.replace(",", ".") : cell);
}

/**
 * The column picker for a capture: the file's first rows as the browser read them, which columns are time,
 * voltage and current, the time unit, and per channel the scale (probe and unit) and offset, with the first
 * samples as they will be read so a wrong probe factor shows before anything is uploaded.
 */
export function ColumnPicker({
  fileName,
  preview,
  busy,
  onPick,
  onCancel,
}: {
  fileName: string;
  preview: CapturePreview;
  busy: boolean;
  onPick: (picked: PickedCapture) => void;
  onCancel: () => void;
}) {
  const suggested = preview.mapping;
  const numeric = preview.columns.filter((c) => c.numeric).map((c) => c.index);
  // Without a suggestion, only numeric columns are offered as defaults; otherwise the user chooses.
  const fallback = (k: number) => (numeric[k] === undefined ? "" : String(numeric[k]));
  const {
    register,
    handleSubmit,
    control,
    formState: { errors },
  } = useForm<PickerValues, unknown, z.output<typeof pickerSchema>>({
    resolver: zodResolver(pickerSchema),
    defaultValues: {
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
    },
  });
  const values = useWatch({ control });
  const parsed = pickerSchema.safeParse(values);
  const chosen = parsed.success ? parsed.data : null;
  const mapped = [values.time, values.voltage, values.current].every((v) => v !== undefined && v !== "");
  const role = (index: number) =>
    chosen?.time === index ? "t" : chosen?.voltage === index ? "V" : chosen?.current === index ? "I" : null;

  const onSubmit = handleSubmit((f) => {
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
    onPick({
      name: f.name,
      mapping,
      start: f.start,
      boardSerial: f.boardSerial,
      probe: f.probe,
      note: f.note,
    });
  });

  const options = [
    <option key="none" value="">
      choose a column…
    </option>,
    ...preview.columns.map((c) => (
      <option key={c.index} value={c.index}>
        {columnName(preview, c.index)}
      </option>
    )),
  ];

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label="Capture columns"
      className="space-y-5 rounded-md border border-line bg-panel p-4"
    >
      <div>
        <p className="text-sm">
          <span className="font-medium">{fileName}</span>{" "}
          <span className="text-ink-muted">
            · separated by {preview.delimiter === "\t" ? "tabs" : `“${preview.delimiter}”`}
            {preview.decimalComma ? ", decimal commas" : ""}
            {preview.headerRow !== null ? `, header on line ${preview.headerRow + 1}` : ", no header"}
            {preview.dataRow !== null ? `, data from line ${preview.dataRow + 1}` : ""}
          </span>
        </p>
        {preview.preamble.length ? (
          <details className="mt-1 text-xs text-ink-muted">
            <summary className="cursor-pointer">
              {preview.preamble.length} {preview.preamble.length === 1 ? "line" : "lines"} before the data are
              skipped
            </summary>
            <pre className="mt-1 max-h-32 overflow-auto rounded bg-sunken p-2 font-mono">
              {preview.preamble.join("\n")}
            </pre>
          </details>
        ) : null}
        {preview.problems.length ? (
          <ul className="mt-2 list-disc pl-5 text-sm text-fail">
            {preview.problems.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        ) : null}
      </div>

      <div className="max-h-64 overflow-auto rounded-md border border-line">
        <table
          aria-label="First rows of the file"
          className="w-full border-separate border-spacing-0 text-xs"
        >
          <thead>
            <tr>
              {preview.columns.map((c) => (
                <th
                  key={c.index}
                  scope="col"
                  className={`sticky top-0 border-b border-line px-2 py-1.5 text-right font-medium whitespace-nowrap ${
                    role(c.index) ? "bg-accent-soft text-accent-strong" : "bg-sunken text-ink-muted"
                  }`}
                >
                  {role(c.index) ? (
                    <span className="mr-1.5 rounded bg-accent px-1 text-white">{role(c.index)}</span>
                  ) : null}
                  {columnName(preview, c.index)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((row, k) => (
              // biome-ignore lint/suspicious/noArrayIndexKey: the file's first rows, shown once in file order
              <tr key={k}>
                {preview.columns.map((c) => (
                  <td key={c.index} className="num border-b border-line px-2 py-1 text-right font-mono">
                    {row[c.index] ?? ""}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField id="cap-time" label="Time column" error={errors.time?.message} {...register("time")}>
          {options}
        </SelectField>
        <SelectField id="cap-time-unit" label="Time unit" {...register("timeScale")}>
          {timeUnits.map((u) => (
            <option key={u.value} value={u.value}>
              {u.label}
            </option>
          ))}
        </SelectField>
        <SelectField
          id="cap-voltage"
          label="Voltage column"
          error={errors.voltage?.message}
          {...register("voltage")}
        >
          {options}
        </SelectField>
        <SelectField
          id="cap-current"
          label="Current column"
          error={errors.current?.message}
          {...register("current")}
        >
          {options}
        </SelectField>
        <UnitField
          id="cap-v-scale"
          label={
            <>
              Scale, <Sym main="V" sub="DS" />
            </>
          }
          unit="×"
          inputMode="decimal"
          hint="Probe factor × unit: 10 for 10:1"
          error={errors.vScale?.message}
          {...register("vScale")}
        />
        <UnitField
          id="cap-v-offset"
          label={
            <>
              Offset, <Sym main="V" sub="DS" />
            </>
          }
          unit="V"
          inputMode="decimal"
          error={errors.vOffset?.message}
          {...register("vOffset")}
        />
        <UnitField
          id="cap-i-scale"
          label={
            <>
              Scale, <Sym main="I" sub="D" />
            </>
          }
          unit="×"
          inputMode="decimal"
          hint="A per reading: 0.1 for 100 mV/A ÷ 1 V"
          error={errors.iScale?.message}
          {...register("iScale")}
        />
        <UnitField
          id="cap-i-offset"
          label={
            <>
              Offset, <Sym main="I" sub="D" />
            </>
          }
          unit="A"
          inputMode="decimal"
          error={errors.iOffset?.message}
          {...register("iOffset")}
        />
      </div>

      {chosen ? (
        <p className="text-xs text-ink-muted" data-testid="capture-as-read">
          First sample as it will be read:{" "}
          <span className="num font-mono text-ink">
            t ={" "}
            {formatQuantity(
              cellNumber(preview.rows[0]?.[chosen.time], preview.decimalComma) * chosen.timeScale,
              "s",
            )}
            , V<sub>DS</sub> ={" "}
            {formatQuantity(
              cellNumber(preview.rows[0]?.[chosen.voltage], preview.decimalComma) * chosen.vScale +
                chosen.vOffset,
              "V",
            )}
            , I<sub>D</sub> ={" "}
            {formatQuantity(
              cellNumber(preview.rows[0]?.[chosen.current], preview.decimalComma) * chosen.iScale +
                chosen.iOffset,
              "A",
            )}
          </span>
        </p>
      ) : null}

      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <UnitField id="cap-name" label="Capture name" error={errors.name?.message} {...register("name")} />
        <UnitField id="cap-board" label="Board serial" hint="Optional" {...register("boardSerial")} />
        <UnitField id="cap-probe" label="Probe" hint="Optional" {...register("probe")} />
        <UnitField id="cap-note" label="Note" hint="Optional" {...register("note")} />
        <SelectField
          id="cap-start"
          label="Before the record"
          className="sm:col-span-2"
          hint="Whether the pulse was already under way when the record began. Let the data decide: a first sample at 1 % of the peak power or more counts as a settled level, and the verdict is then at best marginal."
          {...register("start")}
        >
          <option value="auto">Let the data decide</option>
          <option value="rest">Nothing flowed before (from rest)</option>
          <option value="steady">A settled level (the first sample had flowed long enough to settle)</option>
        </SelectField>
      </div>
      <FormActions
        aside={
          <Button variant="quiet" onClick={onCancel} disabled={busy}>
            Choose another file
          </Button>
        }
      >
        <Button
          type="submit"
          variant="primary"
          pending={busy}
          disabled={!mapped}
          title={mapped ? undefined : "Map the time, voltage and current columns first"}
        >
          Upload and check
        </Button>
      </FormActions>
    </form>
  );
}
