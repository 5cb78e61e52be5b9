"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { type UseFormReturn, useForm, useWatch } from "react-hook-form";
import { Button, FormActions, SelectField } from "@/components/form";
import { UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import type { CapturePreview } from "@/lib/capture/parse";
import {
  columnName,
  type PickedCapture,
  type PickerInput,
  type PickerValues,
  pickedCapture,
  pickerDefaults,
  pickerSchema,
  timeUnits,
} from "./column-picker-form";
import { FirstSample, PreviewSummary, PreviewTable } from "./column-picker-preview";

export type { PickedCapture } from "./column-picker-form";

type PickerForm = UseFormReturn<PickerValues, unknown, PickerInput>;

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
  const form = useForm<PickerValues, unknown, PickerInput>({
    resolver: zodResolver(pickerSchema),
    defaultValues: pickerDefaults(fileName, preview),
  });
  const values = useWatch({ control: form.control });
  const parsed = pickerSchema.safeParse(values);
  const chosen = parsed.success ? parsed.data : null;
  const mapped = [values.time, values.voltage, values.current].every((v) => v !== undefined && v !== "");
  const onSubmit = form.handleSubmit((f) => onPick(pickedCapture(preview, f)));

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label="Capture columns"
      className="space-y-5 rounded-md border border-line bg-panel p-4"
    >
      <PreviewSummary fileName={fileName} preview={preview} />
      <PreviewTable preview={preview} chosen={chosen} />
      <ChannelFields form={form} preview={preview} />
      {chosen ? <FirstSample preview={preview} chosen={chosen} /> : null}
      <DetailFields form={form} />
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

/** The two channels' scale and offset fields: a probe factor times the unit, and an offset in V or A. */
const CHANNELS = [
  {
    symbol: { main: "V", sub: "DS" },
    unit: "V",
    scale: "vScale",
    offset: "vOffset",
    ids: ["cap-v-scale", "cap-v-offset"],
    hint: "Probe factor × unit: 10 for 10:1",
  },
  {
    symbol: { main: "I", sub: "D" },
    unit: "A",
    scale: "iScale",
    offset: "iOffset",
    ids: ["cap-i-scale", "cap-i-offset"],
    hint: "A per reading: 0.1 for 100 mV/A ÷ 1 V",
  },
] as const;

/** Which columns are time, voltage and current, the time unit, and each channel's scale and offset. */
function ChannelFields({ form, preview }: { form: PickerForm; preview: CapturePreview }) {
  const { register } = form;
  const { errors } = form.formState;
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
  const column = (name: "time" | "voltage" | "current", label: string) => (
    <SelectField id={`cap-${name}`} label={label} error={errors[name]?.message} {...register(name)}>
      {options}
    </SelectField>
  );
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
      {column("time", "Time column")}
      <SelectField id="cap-time-unit" label="Time unit" {...register("timeScale")}>
        {timeUnits.map((u) => (
          <option key={u.value} value={u.value}>
            {u.label}
          </option>
        ))}
      </SelectField>
      {column("voltage", "Voltage column")}
      {column("current", "Current column")}
      {CHANNELS.map((c) => [
        <UnitField
          key={c.scale}
          id={c.ids[0]}
          label={
            <>
              Scale, <Sym {...c.symbol} />
            </>
          }
          unit="×"
          inputMode="decimal"
          hint={c.hint}
          error={errors[c.scale]?.message}
          {...register(c.scale)}
        />,
        <UnitField
          key={c.offset}
          id={c.ids[1]}
          label={
            <>
              Offset, <Sym {...c.symbol} />
            </>
          }
          unit={c.unit}
          inputMode="decimal"
          error={errors[c.offset]?.message}
          {...register(c.offset)}
        />,
      ])}
    </div>
  );
}

/** The capture's name and what is stored with it: board, probe, note, and what came before the record. */
function DetailFields({ form }: { form: PickerForm }) {
  const { register } = form;
  const { errors } = form.formState;
  return (
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
  );
}
