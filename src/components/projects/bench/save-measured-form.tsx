import { useId } from "react";
import { useForm } from "react-hook-form";
import { messageOf } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";
import { UnitField } from "@/components/library/fields";

export interface SaveFields {
  note: string;
  boardSerial: string;
  probe: string;
}

/** The bench setup saved with the previewed rows, and the button that saves the rows without problems. */
export function SaveMeasuredForm({
  rows,
  withProblems,
  blocked,
  stale,
  save,
}: {
  /** How many rows can be saved. */
  rows: number;
  withProblems: number;
  /** The paste has problems of its own (columns not read): nothing is saved until they are fixed. */
  blocked: boolean;
  /** The text changed since the preview. */
  stale: boolean;
  save: {
    mutate: (fields: SaveFields) => void;
    isPending: boolean;
    isError: boolean;
    error: unknown;
  };
}) {
  const id = useId();
  // Saving clears the preview, which takes this form away: the next one starts empty.
  const { register, handleSubmit } = useForm<SaveFields>({
    defaultValues: { note: "", boardSerial: "", probe: "" },
  });
  return (
    <form
      noValidate
      aria-label="Save the measured pulses"
      onSubmit={handleSubmit((fields) => save.mutate(fields))}
      className="rounded-md border border-line bg-panel p-4"
    >
      <div className="grid gap-4 sm:grid-cols-3">
        <UnitField id={`${id}-board`} label="Board serial" hint="Optional" {...register("boardSerial")} />
        <UnitField
          id={`${id}-probe`}
          label="Probe"
          hint="Optional: current probe or shunt"
          {...register("probe")}
        />
        <UnitField id={`${id}-note`} label="Note" hint="Optional" {...register("note")} />
      </div>
      {save.isError ? <FormMessage tone="error">{messageOf(save.error)}</FormMessage> : null}
      <div className="mt-4 flex items-center justify-between gap-3">
        <p className="text-sm text-ink-muted">
          {blocked
            ? "Saving waits until every column is read or left out and the paste has no problems."
            : withProblems > 0
              ? `${withProblems} ${withProblems === 1 ? "row has" : "rows have"} problems and will be left out.`
              : "Every row can be saved."}
        </p>
        <Button type="submit" variant="primary" pending={save.isPending} disabled={stale || blocked}>
          Save {rows} {rows === 1 ? "row" : "rows"}
        </Button>
      </div>
    </form>
  );
}
