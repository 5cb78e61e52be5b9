"use client";

import { useId } from "react";
import {
  type ColumnMapping,
  MEASUREMENT_FIELDS,
  type MeasurementColumns,
  type MeasurementField,
} from "@/lib/csv/measurements";

const fieldWords: Record<MeasurementField, string> = {
  label: "label",
  voltage: "V_DS (voltage)",
  current: "I_D (current)",
  width: "pulse width",
  shape: "shape (rect or triangle)",
  period: "repetition period",
  frequency: "repetition frequency",
  count: "pulse count",
};

/** What a column is read as now: a field, "skip" when left out, "" when nothing reads it. */
function currentChoice(columns: MeasurementColumns, index: number): MeasurementField | "skip" | "" {
  const field = MEASUREMENT_FIELDS.find((f) => columns[f] === index);
  if (field) return field;
  if (columns.ignored.some((c) => c.index === index && c.note === "left out")) return "skip";
  return "";
}

/**
 * The bench paste's column step, like the capture's: every pasted column with what it is read as, each one
 * changeable; a column nothing reads must be mapped or left out before the rows can be saved.
 */
export function ColumnMappingTable({
  columns,
  onChange,
  pending,
}: {
  columns: MeasurementColumns;
  onChange: (mapping: ColumnMapping) => void;
  pending: boolean;
}) {
  const id = useId();
  const headers = columns.headers ?? [];
  if (headers.length === 0) return null;
  const unread = new Set((columns.unread ?? []).map((c) => c.index));
  const choose = (index: number, value: string) => {
    const mapping: Record<string, MeasurementField | "skip"> = {};
    headers.forEach((_, k) => {
      const choice = k === index ? value : currentChoice(columns, k);
      if (choice !== "") mapping[String(k)] = choice as MeasurementField | "skip";
    });
    onChange(mapping);
  };
  return (
    <fieldset
      className="rounded-md border border-line bg-panel p-3"
      data-testid="bench-columns"
      disabled={pending}
    >
      <legend className="px-1 text-sm font-medium">Columns</legend>
      <p className="mb-2 text-xs text-ink-muted">
        What each pasted column is read as. Nothing is dropped unless you choose &ldquo;leave out&rdquo;.
      </p>
      <div className="grid gap-2 sm:grid-cols-2 lg:grid-cols-4">
        {headers
          .map((header, position) => ({ header, index: position }))
          .map(({ header, index }) => {
            const choice = currentChoice(columns, index);
            return (
              <div key={`column-${index}`} className="min-w-0">
                <label htmlFor={`${id}-${index}`} className="block truncate font-mono text-xs" title={header}>
                  {header}
                </label>
                <select
                  id={`${id}-${index}`}
                  value={choice}
                  aria-invalid={unread.has(index) ? true : undefined}
                  onChange={(e) => choose(index, e.target.value)}
                  className="mt-0.5 block h-8 w-full rounded-md border border-line-strong bg-panel px-2 text-sm aria-invalid:border-fail"
                >
                  {choice === "" ? <option value="">not read: choose…</option> : null}
                  {MEASUREMENT_FIELDS.map((f) => (
                    <option key={f} value={f}>
                      {fieldWords[f]}
                    </option>
                  ))}
                  <option value="skip">leave out</option>
                </select>
              </div>
            );
          })}
      </div>
    </fieldset>
  );
}
