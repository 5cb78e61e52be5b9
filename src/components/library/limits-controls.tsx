import { factor, q } from "@/lib/format";
import { FLAG_EXPLANATIONS } from "@/lib/soa/explain";
import type { BetweenCurves, Flag } from "@/lib/soa/types";
import { Sym } from "./symbols";
import type { Limits } from "./use-part-limits";

/** A slider and a number field for the case temperature, and what the curves do at it. */
export function CaseTempControl({
  id,
  value,
  onChange,
  tjMax,
  refCaseTemp,
  data,
}: {
  id: string;
  value: number;
  onChange: (caseTemp: number) => void;
  tjMax: number;
  refCaseTemp: number;
  data: Limits | undefined;
}) {
  return (
    <div className="min-w-64">
      <label htmlFor={`${id}-tc`} className="text-sm font-medium">
        Case temperature <Sym main="T" sub="C" />
      </label>
      <div className="mt-1 flex items-center gap-3">
        <input
          type="range"
          aria-label="Case temperature slider"
          min={-40}
          max={Math.floor(tjMax)}
          step={1}
          value={value}
          onChange={(e) => onChange(Number(e.target.value))}
          className="w-44 accent-[var(--color-accent)]"
        />
        <span className="relative">
          <input
            id={`${id}-tc`}
            type="number"
            min={-55}
            max={400}
            step={1}
            value={value}
            onChange={(e) => {
              const typed = Number(e.target.value);
              if (e.target.value !== "" && Number.isFinite(typed))
                onChange(Math.max(-55, Math.min(400, typed)));
            }}
            className="h-8 w-24 rounded-md border border-line-strong bg-panel pr-8 pl-2 text-right font-mono text-sm"
          />
          <span className="pointer-events-none absolute top-1/2 right-2 -translate-y-1/2 text-sm text-ink-faint">
            °C
          </span>
        </span>
      </div>
      <p className="mt-1 text-xs text-ink-muted" aria-live="polite">
        {data && data.derating === 0
          ? `At ${q(data.caseTemp, "°C")} case, at or above Tj,max, the curves allow no current at all.`
          : data && data.derating < 1
            ? `Dashed: the curves derated ×${factor(data.derating)} for ${q(data.caseTemp, "°C")} case.`
            : `The curves hold at ${q(refCaseTemp, "°C")} case; a higher case temperature draws them derated, dashed.`}
      </p>
    </div>
  );
}

/** A pulse width to draw the limit line for, how to read between the datasheet's widths, and its note. */
export function WidthControl({
  id,
  text,
  onText,
  policy,
  onPolicy,
  error,
  empty,
}: {
  id: string;
  text: string;
  onText: (text: string) => void;
  policy: BetweenCurves;
  onPolicy: (policy: BetweenCurves) => void;
  error: string | null;
  /** The width is drawn but the curves say nothing for it. */
  empty: boolean;
}) {
  return (
    <div className="min-w-64 flex-1">
      <label htmlFor={`${id}-width`} className="text-sm font-medium">
        Pulse width
      </label>
      <div className="mt-1 flex flex-wrap items-center gap-2">
        <input
          id={`${id}-width`}
          value={text}
          onChange={(e) => onText(e.target.value)}
          placeholder="e.g. 2 ms"
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-width-note`}
          className="h-8 w-32 rounded-md border border-line-strong bg-panel px-2 font-mono text-sm aria-invalid:border-fail"
        />
        <select
          aria-label="Between datasheet widths"
          value={policy}
          onChange={(e) => onPolicy(e.target.value as BetweenCurves)}
          className="h-8 rounded-md border border-line-strong bg-panel px-2 text-sm"
        >
          <option value="loglog">Interpolate between widths (log-log)</option>
          <option value="next-longer">Use the next longer curve (strict)</option>
          <option value="thermal">Scale the next shorter curve by the thermal model</option>
        </select>
      </div>
      <p id={`${id}-width-note`} className={`mt-1 text-xs ${error ? "text-fail" : "text-ink-muted"}`}>
        {error ??
          (empty
            ? "The curves say nothing for this width."
            : "Draws the limit line for any width, read between the datasheet's curves.")}
      </p>
    </div>
  );
}

/** How the line for the typed width was read, one explanation per flag. */
export function WidthExplanation({ width, flags }: { width: number; flags: Flag[] }) {
  return (
    <div
      className="rounded-md border border-line bg-sunken px-3 py-2 text-sm"
      data-testid="width-explanation"
    >
      <p className="font-medium">How the {q(width, "s")} line was read</p>
      <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-muted">
        {flags.map((flag) =>
          flag === "interpolated" ? (
            <li key={flag}>
              The width lies between two datasheet curves, so the line is interpolated between them on log-log
              axes. That is exact where <Sym main="Z" sub="th" /> grows as √t, but it may overstate the limit
              (by up to about 27&nbsp;% within a decade) where <Sym main="Z" sub="th" /> bends toward{" "}
              <Sym main="R" sub="th" />. The thermal check and the utilisation limit are there to cover that.
            </li>
          ) : (
            <li key={flag}>{FLAG_EXPLANATIONS[flag]}</li>
          ),
        )}
      </ul>
    </div>
  );
}
