"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useEffect, useId, useState } from "react";
import { messageOf } from "@/components/api-client";
import {
  type ChartCurve,
  type ChartFinding,
  type ChartInterpolated,
  InstabilityNote,
  SoaChart,
} from "@/components/soa-chart";
import { FLAG_EXPLANATIONS } from "@/lib/soa/explain";
import type { BetweenCurves, Flag } from "@/lib/soa/types";
import { formatQuantity, parseQuantity } from "@/lib/soa/units";
import { callJson } from "./api";
import { FindingsList } from "./findings-list";
import { Sym } from "./symbols";

interface Limits {
  refCaseTemp: number;
  caseTemp: number;
  derating: number;
  curves: ChartCurve[];
  derated: ChartCurve[];
  interpolated: { width: number; policy: string; flags: Flag[]; points: [number, number][] } | null;
  instability: { width: number; zth: number; points: [number, number][] } | null;
  findings: ChartFinding[];
}

export interface ActiveCurveSet {
  id: string;
  fileName: string;
  refCaseTemp: number;
  curves: ChartCurve[];
  findings: ChartFinding[];
}

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

/** How the typed width was read, in a few words for its label. */
function widthNote(flags: Flag[]): string {
  if (flags.includes("interpolated")) return "interpolated";
  if (flags.includes("next-longer-curve")) return "next longer curve";
  if (flags.includes("shorter-than-shortest-curve")) return "shortest curve";
  if (flags.includes("dc-curve-used")) return "DC curve";
  return "datasheet curve";
}

/**
 * The part's limits: the SOA chart of the active curve set, a case temperature that draws the derated curves,
 * a pulse width that draws its line, both computed by the engine on the server, and the findings beside.
 */
export function LimitsPanel({
  partId,
  partNumber,
  tjMax,
  curveSet,
  accepted = [],
  hasTransfer = false,
  hasThermal = false,
}: {
  partId: string;
  partNumber: string;
  tjMax: number;
  curveSet: ActiveCurveSet;
  /** The findings the lead accepted on verifying, with reasons. */
  accepted?: { key: string; reason: string }[];
  hasTransfer?: boolean;
  hasThermal?: boolean;
}) {
  const id = useId();
  const ref = curveSet.refCaseTemp;
  const [caseTemp, setCaseTemp] = useState(ref);
  const [widthText, setWidthText] = useState("");
  const [policy, setPolicy] = useState<BetweenCurves>("loglog");
  const sentTemp = useDebounced(caseTemp, 120);
  const sentWidth = useDebounced(widthText.trim(), 300);
  const parsedWidth = sentWidth ? parseQuantity(sentWidth, "s") : null;
  const widthError =
    parsedWidth && (!parsedWidth.ok || typeof parsedWidth.value !== "number" || !(parsedWidth.value > 0))
      ? parsedWidth.ok
        ? "Enter a pulse width greater than 0, e.g. 2 ms"
        : `Enter a pulse width such as 2 ms or 150us: ${parsedWidth.reason}`
      : null;
  const width = parsedWidth?.ok && !widthError ? sentWidth : "";

  const search = new URLSearchParams({ caseTemp: String(sentTemp), policy });
  if (width) search.set("width", width);
  const limits = useQuery({
    queryKey: ["part-limits", partId, curveSet.id, search.toString()],
    queryFn: () => callJson<Limits>("GET", `/api/parts/${partId}/limits?${search}`),
    placeholderData: keepPreviousData,
  });
  const data = limits.data;
  const interpolated: ChartInterpolated | null =
    data?.interpolated && width
      ? {
          width: data.interpolated.width,
          points: data.interpolated.points,
          note:
            widthNote(data.interpolated.flags) +
            (data.derating < 1 ? `, at ${formatQuantity(data.caseTemp, "°C")}` : ""),
        }
      : null;
  const flags = (width && data?.interpolated?.flags) || [];

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_18rem]">
      <div className="min-w-0 space-y-4">
        <div className="flex flex-wrap items-start gap-x-8 gap-y-4 rounded-md border border-line bg-panel p-4">
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
                value={caseTemp}
                onChange={(e) => setCaseTemp(Number(e.target.value))}
                className="w-44 accent-[var(--color-accent)]"
              />
              <span className="relative">
                <input
                  id={`${id}-tc`}
                  type="number"
                  min={-55}
                  max={400}
                  step={1}
                  value={caseTemp}
                  onChange={(e) => {
                    const value = Number(e.target.value);
                    if (e.target.value !== "" && Number.isFinite(value))
                      setCaseTemp(Math.max(-55, Math.min(400, value)));
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
                ? `At ${formatQuantity(data.caseTemp, "°C")} case, at or above Tj,max, the curves allow no current at all.`
                : data && data.derating < 1
                  ? `Dashed: the curves derated ×${data.derating.toFixed(2)} for ${formatQuantity(data.caseTemp, "°C")} case.`
                  : `The curves hold at ${formatQuantity(ref, "°C")} case; a higher case temperature draws them derated, dashed.`}
            </p>
          </div>
          <div className="min-w-64 flex-1">
            <label htmlFor={`${id}-width`} className="text-sm font-medium">
              Pulse width
            </label>
            <div className="mt-1 flex flex-wrap items-center gap-2">
              <input
                id={`${id}-width`}
                value={widthText}
                onChange={(e) => setWidthText(e.target.value)}
                placeholder="e.g. 2 ms"
                aria-invalid={widthError ? true : undefined}
                aria-describedby={`${id}-width-note`}
                className="h-8 w-32 rounded-md border border-line-strong bg-panel px-2 font-mono text-sm aria-invalid:border-fail"
              />
              <select
                aria-label="Between datasheet widths"
                value={policy}
                onChange={(e) => setPolicy(e.target.value as typeof policy)}
                className="h-8 rounded-md border border-line-strong bg-panel px-2 text-sm"
              >
                <option value="loglog">Interpolate between widths (log-log)</option>
                <option value="next-longer">Use the next longer curve (strict)</option>
                <option value="thermal">Scale the next shorter curve by the thermal model</option>
              </select>
            </div>
            <p
              id={`${id}-width-note`}
              className={`mt-1 text-xs ${widthError ? "text-fail" : "text-ink-muted"}`}
            >
              {widthError ??
                (width && data?.interpolated && data.interpolated.points.length === 0
                  ? "The curves say nothing for this width."
                  : "Draws the limit line for any width, read between the datasheet's curves.")}
            </p>
          </div>
        </div>

        <SoaChart
          title={partNumber}
          curves={data?.curves ?? curveSet.curves}
          refCaseTemp={ref}
          derated={
            data && data.derating < 1
              ? { caseTemp: data.caseTemp, factor: data.derating, curves: data.derated }
              : null
          }
          interpolated={interpolated}
          instability={width && data?.instability ? data.instability : null}
          findings={curveSet.findings}
        />
        <InstabilityNote
          width={width && data?.instability ? data.instability.width : null}
          zth={data?.instability?.zth}
          hasTransfer={hasTransfer}
          hasThermal={hasThermal}
        />
        {limits.isError ? (
          <p role="alert" className="text-sm text-fail">
            {messageOf(limits.error)}
          </p>
        ) : null}
        {flags.length ? (
          <div
            className="rounded-md border border-line bg-sunken px-3 py-2 text-sm"
            data-testid="width-explanation"
          >
            <p className="font-medium">
              How the {formatQuantity(data!.interpolated!.width, "s")} line was read
            </p>
            <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-muted">
              {flags.map((flag) =>
                flag === "interpolated" ? (
                  <li key={flag}>
                    The width lies between two datasheet curves, so the line is interpolated between them on
                    log-log axes. That is exact where <Sym main="Z" sub="th" /> grows as √t, but it may
                    overstate the limit (by up to about 27&nbsp;% within a decade) where{" "}
                    <Sym main="Z" sub="th" /> bends toward <Sym main="R" sub="th" />. The thermal check and
                    the utilisation limit are there to cover that.
                  </li>
                ) : (
                  <li key={flag}>{FLAG_EXPLANATIONS[flag]}</li>
                ),
              )}
            </ul>
          </div>
        ) : null}
      </div>
      <aside aria-labelledby={`${id}-findings`} className="min-w-0">
        <h3 id={`${id}-findings`} className="mb-2 text-sm font-semibold">
          Findings in {curveSet.fileName}
        </h3>
        <FindingsList findings={curveSet.findings} accepted={accepted} />
      </aside>
    </div>
  );
}
