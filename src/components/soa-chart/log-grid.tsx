import type { ReactNode } from "react";
import { decadeTicks, engineeringTick, minorTicks } from "@/lib/chart/log-axis";
import type { ChartColours } from "./chart-colours";

export type Scale = (value: number) => number;

export interface PlotBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

/** "V_DS" with its subscript, inside an SVG <text>; `dy` shifts keep it readable in every SVG viewer. */
export function SubscriptLabel({ main, sub, unit }: { main: string; sub: string; unit: string }) {
  return (
    <>
      {main}
      <tspan dy={3} fontSize="0.78em">
        {sub}
      </tspan>
      <tspan dy={-3}>{` (${unit})`}</tspan>
    </>
  );
}

/**
 * A log-log frame: faint minor grid at 2…9, major grid at decades, ticks outside, decade labels in engineering
 * notation on both axes and the axis titles. Decades are at least 44 px apart, so labels never overlap.
 */
export function LogGrid({
  x,
  y,
  xDomain,
  yDomain,
  plot,
  colours,
  xTitle,
  yTitle,
  xPlainFrom = 0.1,
  yPlainFrom = 0.1,
}: {
  x: Scale;
  y: Scale;
  xDomain: [number, number];
  yDomain: [number, number];
  plot: PlotBox;
  colours: ChartColours;
  xTitle: ReactNode;
  yTitle: ReactNode;
  xPlainFrom?: number;
  yPlainFrom?: number;
}) {
  const right = plot.left + plot.width;
  const bottom = plot.top + plot.height;
  const xMajor = decadeTicks(xDomain);
  const yMajor = decadeTicks(yDomain);
  return (
    <g data-layer="grid" fontSize={11}>
      <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} fill={colours.panel} />
      <g stroke={colours.line} strokeWidth={0.6} opacity={0.7}>
        {minorTicks(xDomain).map((v) => (
          <line key={`xm${v}`} x1={x(v)} x2={x(v)} y1={plot.top} y2={bottom} />
        ))}
        {minorTicks(yDomain).map((i) => (
          <line key={`ym${i}`} x1={plot.left} x2={right} y1={y(i)} y2={y(i)} />
        ))}
      </g>
      <g stroke={colours.lineStrong} strokeWidth={0.9}>
        {xMajor.map((v) => (
          <line key={`xM${v}`} x1={x(v)} x2={x(v)} y1={plot.top} y2={bottom + 5} />
        ))}
        {yMajor.map((i) => (
          <line key={`yM${i}`} x1={plot.left - 5} x2={right} y1={y(i)} y2={y(i)} />
        ))}
        {minorTicks(xDomain).map((v) => (
          <line key={`xt${v}`} x1={x(v)} x2={x(v)} y1={bottom} y2={bottom + 3} />
        ))}
        {minorTicks(yDomain).map((i) => (
          <line key={`yt${i}`} x1={plot.left - 3} x2={plot.left} y1={y(i)} y2={y(i)} />
        ))}
      </g>
      <rect
        x={plot.left}
        y={plot.top}
        width={plot.width}
        height={plot.height}
        fill="none"
        stroke={colours.inkFaint}
        strokeWidth={1}
      />
      <g fill={colours.inkMuted} style={{ fontVariantNumeric: "tabular-nums" }}>
        {xMajor.map((v) => (
          <text key={`xl${v}`} x={x(v)} y={bottom + 17} textAnchor="middle" data-tick="x">
            {engineeringTick(v, xPlainFrom)}
          </text>
        ))}
        {yMajor.map((i) => (
          <text key={`yl${i}`} x={plot.left - 8} y={y(i) + 4} textAnchor="end" data-tick="y">
            {engineeringTick(i, yPlainFrom)}
          </text>
        ))}
      </g>
      <text
        x={plot.left + plot.width / 2}
        y={bottom + 36}
        textAnchor="middle"
        fill={colours.ink}
        fontSize={12}
      >
        {xTitle}
      </text>
      <text
        x={0}
        y={0}
        transform={`translate(${plot.left - 38} ${plot.top + plot.height / 2}) rotate(-90)`}
        textAnchor="middle"
        fill={colours.ink}
        fontSize={12}
      >
        {yTitle}
      </text>
    </g>
  );
}
