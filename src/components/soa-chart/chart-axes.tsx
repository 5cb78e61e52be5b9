import type { ReactNode } from "react";
import type { ChartColours } from "./chart-colours";
import { type Axis, axisTicks, type PlotBox } from "./frame-model";

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

/** The axis titles of every SOA chart: V_DS across, I_D up. */
export const vdsTitle = <SubscriptLabel main="V" sub="DS" unit="V" />;
export const idTitle = <SubscriptLabel main="I" sub="D" unit="A" />;

/**
 * The frame's axes: the plot's panel, faint minor grid (2…9 of each decade on a log axis, every tick on a linear
 * one), strong major grid at decades with ticks outside, the tick labels (engineering notation on log axes) and the
 * axis titles. Decades are at least 44 px apart in every chart, so labels never overlap.
 */
export function ChartAxes({
  x,
  y,
  plot,
  colours,
  xTitle,
  yTitle,
}: {
  x: Axis;
  y: Axis;
  plot: PlotBox;
  colours: ChartColours;
  xTitle?: ReactNode;
  yTitle?: ReactNode;
}) {
  const right = plot.left + plot.width;
  const bottom = plot.top + plot.height;
  const xt = axisTicks(x);
  const yt = axisTicks(y);
  // A linear axis's ticks are grid lines of the minor weight: only decades are drawn strong.
  const xMinor = x.kind === "log" ? xt.minor : xt.major.map((t) => t.value);
  const yMinor = y.kind === "log" ? yt.minor : yt.major.map((t) => t.value);
  const xMajor = x.kind === "log" ? xt.major.map((t) => t.value) : [];
  const yMajor = y.kind === "log" ? yt.major.map((t) => t.value) : [];
  const X = x.scale;
  const Y = y.scale;
  return (
    <g data-layer="grid" fontSize={11}>
      <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} fill={colours.panel} />
      <g stroke={colours.line} strokeWidth={0.6} opacity={0.7}>
        {xMinor.map((v) => (
          <line key={`xm${v}`} x1={X(v)} x2={X(v)} y1={plot.top} y2={bottom} />
        ))}
        {yMinor.map((i) => (
          <line key={`ym${i}`} x1={plot.left} x2={right} y1={Y(i)} y2={Y(i)} />
        ))}
      </g>
      <g stroke={colours.lineStrong} strokeWidth={0.9}>
        {xMajor.map((v) => (
          <line key={`xM${v}`} x1={X(v)} x2={X(v)} y1={plot.top} y2={bottom + 5} />
        ))}
        {yMajor.map((i) => (
          <line key={`yM${i}`} x1={plot.left - 5} x2={right} y1={Y(i)} y2={Y(i)} />
        ))}
        {(x.unlabelled ? [] : xMinor).map((v) => (
          <line key={`xt${v}`} x1={X(v)} x2={X(v)} y1={bottom} y2={bottom + 3} />
        ))}
        {yMinor.map((i) => (
          <line key={`yt${i}`} x1={plot.left - 3} x2={plot.left} y1={Y(i)} y2={Y(i)} />
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
        {(x.unlabelled ? [] : xt.major).map((t) => (
          <text key={`xl${t.value}`} x={X(t.value)} y={bottom + 17} textAnchor="middle" data-tick="x">
            {t.label}
          </text>
        ))}
        {(y.unlabelled ? [] : yt.major).map((t) => (
          <text key={`yl${t.value}`} x={plot.left - 8} y={Y(t.value) + 4} textAnchor="end" data-tick="y">
            {t.label}
          </text>
        ))}
      </g>
      {xTitle ? (
        <text
          x={plot.left + plot.width / 2}
          y={bottom + 36}
          textAnchor="middle"
          fill={colours.ink}
          fontSize={12}
        >
          {xTitle}
        </text>
      ) : null}
      {yTitle ? (
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
      ) : null}
    </g>
  );
}
