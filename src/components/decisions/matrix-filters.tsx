import type { MatrixFilter, PulseScope } from "./matrix-model";

const scopeLabels: Record<PulseScope, string> = {
  all: "All pulses",
  "fault-cases": "Fault cases",
  measured: "Measured",
};

/** Which pulses the matrix shows as columns; the ranking always weighs them all. */
export function MatrixFilters({
  filter,
  counts,
  onChange,
}: {
  filter: MatrixFilter;
  counts: Record<PulseScope, number>;
  onChange: (filter: MatrixFilter) => void;
}) {
  return (
    <div className="flex flex-wrap items-center gap-x-5 gap-y-2">
      <fieldset className="flex items-center gap-2">
        <legend className="sr-only">Pulses to show</legend>
        <div className="inline-flex rounded-md border border-line-strong bg-panel p-0.5">
          {(Object.keys(scopeLabels) as PulseScope[]).map((scope) => (
            <label
              key={scope}
              className="flex h-7 cursor-pointer items-center gap-1.5 rounded px-2.5 text-sm text-ink-muted has-checked:bg-accent-soft has-checked:text-ink has-focus-visible:outline-2 has-focus-visible:outline-accent"
            >
              <input
                type="radio"
                name="matrix-scope"
                value={scope}
                checked={filter.scope === scope}
                onChange={() => onChange({ ...filter, scope })}
                className="sr-only"
              />
              {scopeLabels[scope]}
              <span className="font-mono text-xs text-ink-faint num">{counts[scope]}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={filter.failuresOnly}
          onChange={(e) => onChange({ ...filter, failuresOnly: e.target.checked })}
          className="size-4 accent-accent"
        />
        Failures only
      </label>
    </div>
  );
}
