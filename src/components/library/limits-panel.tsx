"use client";

import dynamic from "next/dynamic";
import { useId } from "react";
import { AfterLoad } from "@/components/after-load";
import { messageOf } from "@/components/api-client";
import { LoadingBox } from "@/components/loading-box";
import type { ChartCurve, ChartFinding } from "@/components/soa-chart";
import { InstabilityNote } from "@/components/soa-chart/instability-note";
import { FindingsList } from "./findings-list";
import { CaseTempControl, WidthControl, WidthExplanation } from "./limits-controls";
import { usePartLimits } from "./use-part-limits";

// The chart stack (about a sixth of the page's script) loads once the page has loaded, in the browser only (it
// measures its width there): the page's figures and controls come first, the chart a moment later in a box of its
// height.
const drawing = () => <LoadingBox className="h-[26rem]">Drawing the SOA curves…</LoadingBox>;
const SoaChart = dynamic(() => import("@/components/soa-chart").then((m) => m.SoaChart), {
  ssr: false,
  loading: drawing,
});

export interface ActiveCurveSet {
  id: string;
  fileName: string;
  refCaseTemp: number;
  curves: ChartCurve[];
  findings: ChartFinding[];
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
  const state = usePartLimits(partId, curveSet.id, ref);
  const { limits, width, flags } = state;
  const data = limits.data;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_18rem]">
      <div className="min-w-0 space-y-4">
        <div className="flex flex-wrap items-start gap-x-8 gap-y-4 rounded-md border border-line bg-panel p-4">
          <CaseTempControl
            id={id}
            value={state.caseTemp}
            onChange={state.setCaseTemp}
            tjMax={tjMax}
            refCaseTemp={ref}
            data={data}
          />
          <WidthControl
            id={id}
            text={state.widthText}
            onText={state.setWidthText}
            policy={state.policy}
            onPolicy={state.setPolicy}
            error={state.widthError}
            empty={Boolean(width && data?.interpolated && data.interpolated.points.length === 0)}
          />
        </div>

        <AfterLoad fallback={drawing()}>
          <SoaChart
            title={partNumber}
            curves={data?.curves ?? curveSet.curves}
            refCaseTemp={ref}
            derated={
              data && data.derating < 1
                ? { caseTemp: data.caseTemp, factor: data.derating, curves: data.derated }
                : null
            }
            interpolated={state.interpolated}
            instability={width && data?.instability ? data.instability : null}
            findings={curveSet.findings}
          />
        </AfterLoad>
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
        {flags.length && data?.interpolated ? (
          <WidthExplanation width={data.interpolated.width} flags={flags} />
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
