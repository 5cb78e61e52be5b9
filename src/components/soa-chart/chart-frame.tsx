"use client";

import { type ComponentProps, type PointerEvent, type ReactNode, useId } from "react";
import { ChartAxes, idTitle, vdsTitle } from "./chart-axes";
import { useChartColours } from "./chart-colours";
import { ChartExport } from "./chart-export-buttons";
import { ChartLegend, type LegendRow } from "./chart-legend";
import { type Readout, ReadoutBox } from "./chart-readout";
import type { Axis, PlotBox } from "./frame-model";
import { useWidth } from "./use-width";

// The one chart frame of every log-log and time chart: ChartFigure measures the room and holds the caption and the
// export buttons; ChartFrame is the <svg> with its accessible name, the legend and the hover readout; PlotArea is
// one plot inside it (axes, grid, ticks, the clipped layers, the pointer's surface and the crosshair). A chart
// passes in only its own layers.

/**
 * The figure around a chart that fills its container's width: `children` draws the chart for the measured width
 * (a placeholder of `placeholder` height stands until then); the caption row ends with SVG and PNG export when
 * `exportName` is given.
 */
export function ChartFigure({
  testId,
  placeholder,
  header,
  caption,
  exportName,
  children,
}: {
  testId: string;
  /** The placeholder's height class, e.g. "h-[30rem]". */
  placeholder: string;
  header?: ReactNode;
  caption?: ReactNode;
  exportName?: string;
  children: (width: number) => ReactNode;
}) {
  const { ref, width } = useWidth<HTMLDivElement>();
  return (
    <figure className="min-w-0" data-testid={testId}>
      {header}
      <div ref={ref} className="relative overflow-x-auto">
        {width ? children(width) : <div className={`${placeholder} rounded-md bg-sunken`} />}
      </div>
      {caption || exportName ? (
        <figcaption className="mt-2 flex flex-wrap items-start justify-between gap-3">
          {caption}
          {exportName ? (
            <div className="ml-auto">
              <ChartExport frame={ref} fileName={exportName} />
            </div>
          ) : null}
        </figcaption>
      ) : null}
    </figure>
  );
}

/** The chart's <svg>: its size, accessible name and title, its plots (children), legend and hover readout. */
export function ChartFrame({
  width,
  height,
  label,
  title,
  testId,
  scalable = false,
  className,
  legend,
  readout,
  children,
}: {
  width: number;
  height: number;
  /** The accessible name: what is drawn against what, and on which axes. */
  label: string;
  title?: string;
  testId?: string;
  /** Shrinks with its container (a viewBox) instead of scrolling. */
  scalable?: boolean;
  className?: string;
  legend?: { rows: LegendRow[]; x: number; y: number; columns?: number; columnWidth?: number };
  readout?: Readout | null;
  children: ReactNode;
}) {
  const colours = useChartColours();
  return (
    <>
      <svg
        width={width}
        height={height}
        viewBox={scalable ? `0 0 ${width} ${height}` : undefined}
        className={[scalable ? "h-auto max-w-full" : "", className ?? ""].join(" ").trim() || undefined}
        role="img"
        aria-label={label}
        fontFamily="inherit"
        data-testid={testId}
      >
        {title ? <title>{title}</title> : null}
        {children}
        {legend ? <ChartLegend {...legend} colours={colours} /> : null}
      </svg>
      {readout ? <ReadoutBox readout={readout} frameWidth={width} /> : null}
    </>
  );
}

export interface PlotPointer {
  onPointerDown?: (event: PointerEvent<SVGRectElement>) => void;
  onPointerMove?: (event: PointerEvent<SVGRectElement>) => void;
  onPointerUp?: (event: PointerEvent<SVGRectElement>) => void;
  onPointerLeave?: (event: PointerEvent<SVGRectElement>) => void;
  className?: string;
}

/** The pointer's position inside the chart's <svg>, in px. */
export function pointerAt(event: PointerEvent<SVGElement>): { px: number; py: number } {
  const box = (event.currentTarget.ownerSVGElement ?? event.currentTarget).getBoundingClientRect();
  return { px: event.clientX - box.left, py: event.clientY - box.top };
}

/**
 * One plot of a frame, drawn in order: axes and grid; `clipped` layers, cut at the plot's edge; `above` layers
 * (labels, marks); the pointer's surface, when `pointer` is given (left out of exports); the crosshair at
 * `crosshair`; and `front` layers that take their own pointer events (markers with hover text).
 */
export function PlotArea({
  plot,
  x,
  y,
  xTitle,
  yTitle,
  clipped,
  above,
  pointer,
  crosshair,
  front,
}: {
  plot: PlotBox;
  x: Axis;
  y: Axis;
  xTitle?: ReactNode;
  yTitle?: ReactNode;
  clipped?: ReactNode;
  above?: ReactNode;
  pointer?: PlotPointer;
  crosshair?: { left: number; top: number } | null;
  front?: ReactNode;
}) {
  const colours = useChartColours();
  const clipId = `plot-clip-${useId().replace(/[^a-zA-Z0-9]/g, "")}`;
  const { className, ...handlers } = pointer ?? {};
  return (
    <g>
      <defs>
        <clipPath id={clipId}>
          <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} />
        </clipPath>
      </defs>
      <ChartAxes x={x} y={y} plot={plot} colours={colours} xTitle={xTitle} yTitle={yTitle} />
      <g clipPath={`url(#${clipId})`}>{clipped}</g>
      {above}
      {pointer ? (
        <rect
          data-export="skip"
          x={plot.left}
          y={plot.top}
          width={plot.width}
          height={plot.height}
          fill="transparent"
          className={className}
          {...handlers}
        />
      ) : null}
      {crosshair ? (
        <g data-export="skip" pointerEvents="none" stroke={colours.inkFaint} strokeWidth={0.75}>
          <line x1={crosshair.left} x2={crosshair.left} y1={plot.top} y2={plot.top + plot.height} />
          <line x1={plot.left} x2={plot.left + plot.width} y1={crosshair.top} y2={crosshair.top} />
        </g>
      ) : null}
      {front}
    </g>
  );
}

/** The plot area of an SOA chart (the full chart, the overlay, the sketch): V_DS across and I_D up as its titles. */
export function SoaPlotArea(props: Omit<ComponentProps<typeof PlotArea>, "xTitle" | "yTitle">) {
  return <PlotArea {...props} xTitle={vdsTitle} yTitle={idTitle} />;
}
