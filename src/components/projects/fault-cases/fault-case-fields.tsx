import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { SelectField } from "@/components/form";
import { type Bind, errorAt, fieldBinder } from "@/components/form-errors";
import { UnitField } from "@/components/library/fields";
import { Sym } from "@/components/library/symbols";
import type { FaultCaseFormValues } from "./fault-case-form-schema";

// The fault-case form's rows of fields; `id` prefixes their ids so a new and an edited form can sit on one page.

type FaultCaseBind = Bind<FaultCaseFormValues>;

/** The pulse itself: name, shape, voltage, peak current and width. */
export function PulseFields({ id, bind }: { id: string; bind: FaultCaseBind }) {
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-6">
      <UnitField id={`${id}-name`} label="Name" className="lg:col-span-2" {...bind("name")} />
      <SelectField id={`${id}-kind`} label="Shape" {...bind("kind")}>
        <option value="rect">Rectangle</option>
        <option value="triangle">Falling triangle</option>
      </SelectField>
      <UnitField
        id={`${id}-v`}
        label={<Sym main="V" sub="DS" />}
        unit="V"
        inputMode="decimal"
        {...bind("v")}
      />
      <UnitField
        id={`${id}-i`}
        label={
          <>
            <Sym main="I" sub="D" /> (peak)
          </>
        }
        unit="A"
        inputMode="decimal"
        {...bind("i")}
      />
      <UnitField id={`${id}-width`} label="Width" unit="s" placeholder="2m" {...bind("duration")} />
    </div>
  );
}

/**
 * How the pulse repeats (single, by period or by frequency; counted or continuous) and its own case temperature.
 * The schema reports repetition problems under `repeat.*`, shown under the field that was typed.
 */
export function RepetitionFields({
  id,
  register,
  errors,
  repeats,
  continuous,
}: {
  id: string;
  register: UseFormRegister<FaultCaseFormValues>;
  errors: FieldErrors<FaultCaseFormValues>;
  repeats: FaultCaseFormValues["repeats"];
  continuous: boolean;
}) {
  const periodError = errorAt(errors, "repeat.period") ?? errorAt(errors, "period");
  const bind = fieldBinder(register, errors);
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-6">
      <SelectField id={`${id}-repeats`} label="Repetition" {...register("repeats")}>
        <option value="single">Single pulse</option>
        <option value="period">By period</option>
        <option value="frequency">By frequency</option>
      </SelectField>
      {repeats === "period" ? (
        <UnitField id={`${id}-period`} label="Period" unit="s" {...bind("period")} error={periodError} />
      ) : null}
      {repeats === "frequency" ? (
        <UnitField
          id={`${id}-frequency`}
          label="Frequency"
          unit="Hz"
          {...bind("frequency")}
          error={periodError ?? errorAt(errors, "repeat.frequency")}
        />
      ) : null}
      {repeats !== "single" ? (
        <div>
          <UnitField
            id={`${id}-count`}
            label="Count"
            inputMode="numeric"
            disabled={continuous}
            placeholder={continuous ? "continuous" : "10"}
            {...bind("count")}
            error={errorAt(errors, "repeat.count")}
          />
          <label className="mt-1 flex items-center gap-1.5 text-xs text-ink-muted">
            <input type="checkbox" {...register("continuous")} className="accent-[var(--color-accent)]" />
            Continuous train
          </label>
        </div>
      ) : null}
      <UnitField
        id={`${id}-case`}
        label={
          <>
            Own case temperature <Sym main="T" sub="C" />
          </>
        }
        unit="°C"
        inputMode="decimal"
        hint="Optional: else the project's"
        className="lg:col-span-2"
        {...bind("caseTemp")}
      />
    </div>
  );
}
