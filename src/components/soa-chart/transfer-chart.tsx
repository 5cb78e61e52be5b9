"use client";

import { useMemo } from "react";
import { decadeDomain } from "@/lib/chart/log-axis";
import { q } from "@/lib/format";
import { SubscriptLabel } from "./chart-axes";
import { useChartColours } from "./chart-colours";
import { ChartFrame, PlotArea } from "./chart-frame";
import { linePath, plotAxes } from "./frame-model";

const margin = { top: 10, left: 52, bottom: 44, right: 16 };

export interface TransferChartCurve {
  temp: number;
  points: [number, number][];
}

/**
 * A part's transfer characteristics: I_D on a log axis against V_GS on a linear one (each curve is read linearly in
 * V_GS against ln I_D, so its segments are straight here), the cooler curve solid and the hotter one dashed, and
 * the zero-temperature-coefficient point ringed where they cross. Below it the hotter curve carries more current:
 * the region where a pulse held at fixed gate voltage can run away (METHODS.md §12).
 */
export function TransferChart({
  curves,
  zeroTc,
  maxWidth = 440,
}: {
  curves: TransferChartCurve[];
  zeroTc: { gate: number; current: number } | null;
  maxWidth?: number;
}) {
  const colours = useChartColours();
  const { gDomain, iDomain } = useMemo(() => {
    const gs = curves.flatMap((c) => c.points.map(([g]) => g));
    const is = curves.flatMap((c) => c.points.map(([, i]) => i));
    const span = Math.max(...gs) - Math.min(...gs) || 1;
    const gDomain = [Math.max(0, Math.min(...gs) - span * 0.05), Math.max(...gs) + span * 0.05] as [
      number,
      number,
    ];
    return { gDomain, iDomain: decadeDomain(is, [0.1, 100], 2) };
  }, [curves]);
  const decades = Math.log10(iDomain[1] / iDomain[0]);
  const width = maxWidth;
  const plot = {
    left: margin.left,
    top: margin.top,
    width: width - margin.left - margin.right,
    height: Math.min(320, decades * 56),
  };
  const { x, y } = plotAxes(
    plot,
    { kind: "linear", domain: gDomain, nice: true, count: 6 },
    { kind: "log", domain: iDomain, clamp: true },
  );
  const style = (k: number) => ({
    stroke: k === 0 ? colours.accentStrong : colours.ink,
    dash: k === 0 ? undefined : "6 3",
  });
  return (
    <figure className="space-y-2">
      <ChartFrame
        width={width}
        height={plot.top + plot.height + margin.bottom}
        label="Transfer characteristics: I_D against V_GS at two junction temperatures"
        testId="transfer-chart"
        scalable
      >
        <PlotArea
          plot={plot}
          x={x}
          y={y}
          xTitle={<SubscriptLabel main="V" sub="GS" unit="V" />}
          yTitle={<SubscriptLabel main="I" sub="D" unit="A" />}
          above={
            <>
              {curves.map((curve, k) => (
                <g key={curve.temp} data-series={`transfer-${curve.temp}`}>
                  <path
                    d={linePath(curve.points, x.scale, y.scale)}
                    fill="none"
                    stroke={style(k).stroke}
                    strokeWidth={1.75}
                    strokeDasharray={style(k).dash}
                  />
                  {curve.points.map(([g, i]) => (
                    <circle
                      key={`${g}-${i}`}
                      cx={x.scale(g)}
                      cy={y.scale(i)}
                      r={2.5}
                      fill={colours.panel}
                      stroke={style(k).stroke}
                    />
                  ))}
                </g>
              ))}
              {zeroTc ? (
                <ZeroTcMark x={x.scale(zeroTc.gate)} y={y.scale(zeroTc.current)} colour={colours.ink} />
              ) : null}
            </>
          }
        />
      </ChartFrame>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
        {curves.map((curve, k) => (
          <span key={curve.temp} className="inline-flex items-center gap-1.5">
            <svg width="22" height="6" aria-hidden="true">
              <line
                x1="0"
                x2="22"
                y1="3"
                y2="3"
                stroke={style(k).stroke}
                strokeWidth={1.75}
                strokeDasharray={style(k).dash}
              />
            </svg>
            <span className="num">
              T<sub>j</sub> = {curve.temp} °C
            </span>
          </span>
        ))}
        {zeroTc ? (
          <span className="num">
            Zero-temperature-coefficient point: {q(zeroTc.gate, "V")}, {q(zeroTc.current, "A")}
          </span>
        ) : null}
      </figcaption>
    </figure>
  );
}

/** The zero-temperature-coefficient point: a ring where the two curves cross, named beside it. */
function ZeroTcMark({ x, y, colour }: { x: number; y: number; colour: string }) {
  return (
    <g data-testid="zero-tc-point">
      <circle cx={x} cy={y} r={6} fill="none" stroke={colour} strokeWidth={1.5} />
      <text x={x + 9} y={y + 14} fontSize={11} fill={colour}>
        zero TC
      </text>
    </g>
  );
}
