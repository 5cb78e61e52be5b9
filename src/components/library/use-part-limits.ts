import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { requestJson } from "@/components/api-client";
import type { ChartFinding, ChartInterpolated } from "@/components/soa-chart";
import { useDebounced } from "@/components/use-debounced";
import { q } from "@/lib/format";
import type { Limits as ComputedLimits } from "@/lib/library/limits";
import type { BetweenCurves, Flag } from "@/lib/soa/types";
import { parseQuantity } from "@/lib/soa/units";

/**
 * GET /api/parts/:id/limits: the engine's limits (the curves, derated for the case temperature, and the line for a
 * typed width) with the curve set's findings.
 */
export type Limits = ComputedLimits & { findings: ChartFinding[] };

/** How the typed width was read, in a few words for its label. */
function widthNote(flags: Flag[]): string {
  if (flags.includes("interpolated")) return "interpolated";
  if (flags.includes("next-longer-curve")) return "next longer curve";
  if (flags.includes("shorter-than-shortest-curve")) return "shortest curve";
  if (flags.includes("dc-curve-used")) return "DC curve";
  return "datasheet curve";
}

/** Why a typed width cannot be drawn, or null. */
function widthProblem(parsed: ReturnType<typeof parseQuantity> | null): string | null {
  if (!parsed) return null;
  if (!parsed.ok) return `Enter a pulse width such as 2 ms or 150us: ${parsed.reason}`;
  if (typeof parsed.value !== "number" || !(parsed.value > 0))
    return "Enter a pulse width greater than 0, e.g. 2 ms";
  return null;
}

/**
 * The limits panel's inputs (case temperature, pulse width, policy between widths) and the server's answer for
 * them, asked once the typing settles; the previous answer stays drawn while the next one loads.
 */
export function usePartLimits(partId: string, curveSetId: string, refCaseTemp: number) {
  const [caseTemp, setCaseTemp] = useState(refCaseTemp);
  const [widthText, setWidthText] = useState("");
  const [policy, setPolicy] = useState<BetweenCurves>("loglog");
  const sentTemp = useDebounced(caseTemp, 120);
  const sentWidth = useDebounced(widthText.trim(), 300);
  const parsedWidth = sentWidth ? parseQuantity(sentWidth, "s") : null;
  const widthError = widthProblem(parsedWidth);
  const width = parsedWidth?.ok && !widthError ? sentWidth : "";

  const search = new URLSearchParams({ caseTemp: String(sentTemp), policy });
  if (width) search.set("width", width);
  const limits = useQuery({
    queryKey: ["part-limits", partId, curveSetId, search.toString()],
    queryFn: () => requestJson<Limits>("GET", `/api/parts/${partId}/limits?${search}`),
    placeholderData: keepPreviousData,
  });
  const data = limits.data;
  const interpolated: ChartInterpolated | null =
    data?.interpolated && width
      ? {
          width: data.interpolated.width,
          points: data.interpolated.points,
          note:
            widthNote(data.interpolated.flags) + (data.derating < 1 ? `, at ${q(data.caseTemp, "°C")}` : ""),
        }
      : null;

  return {
    limits,
    caseTemp,
    setCaseTemp,
    widthText,
    setWidthText,
    policy,
    setPolicy,
    /** The width drawn: the typed one once it settled and reads as a width, else "". */
    width,
    widthError,
    interpolated,
    /** How the drawn width was read. */
    flags: (width && data?.interpolated?.flags) || [],
  };
}
