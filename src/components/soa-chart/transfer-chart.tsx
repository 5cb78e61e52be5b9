"use client";

import { scaleLinear, scaleLog } from "d3-scale";
import { useMemo } from "react";
import { decadeDomain, decadeTicks, engineeringTick, minorTicks } from "@/lib/chart/log-axis";
import { useChartColours } from "./chart-colours";

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
  const x = scaleLinear()
    .domain(gDomain)
    .range([plot.left, plot.left + plot.width])
    .nice();
  const y = scaleLog()
    .domain(iDomain)
    .range([plot.top + plot.height, plot.top])
    .clamp(true);
  const height = plot.top + plot.height + margin.bottom;
  const bottom = plot.top + plot.height;
  return (
    <figure className="space-y-2">
      <svg
        width={width}
        height={height}
        viewBox={`0 0 ${width} ${height}`}
        className="h-auto max-w-full"
        role="img"
        aria-label="Transfer characteristics: I_D against V_GS at two junction temperatures"
        data-testid="transfer-chart"
      >
        {minorTicks(iDomain).map((i) => (
          <line
            key={`m${i}`}
            x1={plot.left}
            x2={plot.left + plot.width}
            y1={y(i)}
            y2={y(i)}
            stroke={colours.line}
            strokeWidth={0.5}
          />
        ))}
        {decadeTicks(iDomain).map((i) => (
          <g key={`d${i}`}>
            <line
              x1={plot.left}
              x2={plot.left + plot.width}
              y1={y(i)}
              y2={y(i)}
              stroke={colours.lineStrong}
            />
            <text
              x={plot.left - 6}
              y={y(i)}
              dy="0.32em"
              textAnchor="end"
              fontSize={11}
              fill={colours.inkMuted}
            >
              {engineeringTick(i)}
            </text>
          </g>
        ))}
        {x.ticks(6).map((g) => (
          <g key={`g${g}`}>
            <line x1={x(g)} x2={x(g)} y1={plot.top} y2={bottom} stroke={colours.line} strokeWidth={0.5} />
            <text x={x(g)} y={bottom + 16} textAnchor="middle" fontSize={11} fill={colours.inkMuted}>
              {g}
            </text>
          </g>
        ))}
        <text
          x={plot.left + plot.width / 2}
          y={bottom + 36}
          textAnchor="middle"
          fontSize={12}
          fill={colours.ink}
        >
          V
          <tspan dy={3} fontSize="0.78em">
            GS
          </tspan>
          <tspan dy={-3}> (V)</tspan>
        </text>
        <text
          transform={`translate(14 ${plot.top + plot.height / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={12}
          fill={colours.ink}
        >
          I
          <tspan dy={3} fontSize="0.78em">
            D
          </tspan>
          <tspan dy={-3}> (A)</tspan>
        </text>
        {curves.map((curve, k) => (
          <g key={curve.temp} data-series={`transfer-${curve.temp}`}>
            <path
              d={curve.points
                .map(([g, i], n) => `${n ? "L" : "M"}${x(g).toFixed(1)},${y(i).toFixed(1)}`)
                .join("")}
              fill="none"
              stroke={k === 0 ? colours.accentStrong : colours.ink}
              strokeWidth={1.75}
              strokeDasharray={k === 0 ? undefined : "6 3"}
            />
            {curve.points.map(([g, i]) => (
              <circle
                key={`${g}-${i}`}
                cx={x(g)}
                cy={y(i)}
                r={2.5}
                fill={colours.panel}
                stroke={k === 0 ? colours.accentStrong : colours.ink}
              />
            ))}
          </g>
        ))}
        {zeroTc ? (
          <g data-testid="zero-tc-point">
            <circle
              cx={x(zeroTc.gate)}
              cy={y(zeroTc.current)}
              r={6}
              fill="none"
              stroke={colours.ink}
              strokeWidth={1.5}
            />
            <text x={x(zeroTc.gate) + 9} y={y(zeroTc.current) + 14} fontSize={11} fill={colours.ink}>
              zero TC
            </text>
          </g>
        ) : null}
      </svg>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
        {curves.map((curve, k) => (
          <span key={curve.temp} className="inline-flex items-center gap-1.5">
            <svg width="22" height="6" aria-hidden="true">
              <line
                x1="0"
                x2="22"
                y1="3"
                y2="3"
                stroke={k === 0 ? colours.accentStrong : colours.ink}
                strokeWidth={1.75}
                strokeDasharray={k === 0 ? undefined : "6 3"}
              />
            </svg>
            <span className="num">
              T<sub>j</sub> = {curve.temp} °C
            </span>
          </span>
        ))}
        {zeroTc ? (
          <span className="num">
            Zero-temperature-coefficient point: {Number(zeroTc.gate.toPrecision(3))} V,{" "}
            {Number(zeroTc.current.toPrecision(3))} A
          </span>
        ) : null}
      </figcaption>
    </figure>
  );
}
