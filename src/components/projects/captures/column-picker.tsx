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
  return (
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
