"use client";

import { LineSeries, XYChart } from "@visx/xychart";
import { scaleLog } from "d3-scale";
import { type PointerEvent, useId, useMemo, useState } from "react";
import { VerdictGlyph } from "@/components/verdict-shape";
import { interpolateCurve } from "@/lib/soa/interpolate-curve";
import { formatQuantity } from "@/lib/soa/units";
import { useChartColours } from "./chart-colours";
import { ChartExport } from "./chart-export-buttons";
import { ChartLegend, FindingMark, legendRows } from "./chart-legend";
import { buildLines, type ChartLine, chartDomains, chartLayout, placePulse, textWidth } from "./chart-model";
import { type Readout, ReadoutBox, Sym } from "./chart-readout";
import { placeLabels } from "./label-layout";
import { LogGrid, SubscriptLabel } from "./log-grid";
import { OffScaleMark } from "./off-scale-mark";
import { PointsTable } from "./points-table";
import type { ChartFinding, SoaChartProps } from "./types";
import { useWidth } from "./use-width";

const vOf = (d: [number, number]) => d[0];
const iOf = (d: [number, number]) => d[1];
const snapDistance = 10;

/** A finding's place on the chart: its curve's current at its voltage (the curve's end beyond its range). */
export function findingPoint(finding: ChartFinding, lines: ChartLine[]): [number, number] | null {
  const { location, curve } = finding;
  if (location === undefined || curve === undefined || !("v" in location)) return null;
  const line = lines.find((l) => l.kind === "curve" && l.duration === curve.duration);
  if (!line || line.points.length === 0) return null;
  const v = location.v;
  const value = interpolateCurve(line.points, v).current;
  return value === null ? line.points[line.points.length - 1] : [v, value];
}

/**
 * The SOA chart: log-log axes with square decades, each curve a chain of straight log-log segments labelled with
 * its pulse width at its end, derated curves dashed in their curve's hue, the line for a typed width in its own
 * dash, findings and pulses as markers, a legend in words, export as SVG and PNG, and a table of the points.
 * Props are plain data so that any screen can draw a part's limits and its pulses.
 */
export function SoaChart(props: SoaChartProps) {
  const { ref, width } = useWidth<HTMLDivElement>();
  return (
    <figure className="min-w-0" data-testid="soa-chart">
      <div ref={ref} className="relative overflow-x-auto">
        {width ? (
          <ChartFrame {...props} available={width} />
        ) : (
          <div className="h-[30rem] rounded-md bg-sunken" />
        )}
      </div>
      <figcaption className="mt-2 flex flex-wrap items-start justify-between gap-3">
        <PointsTable {...props} />
        <ChartExport frame={ref} fileName={`${props.title}-soa`} />
      </figcaption>
    </figure>
  );
}

function ChartFrame(props: SoaChartProps & { available: number }) {
  const colours = useChartColours();
  const clipId = `soa-clip-${useId().replace(/[^a-zA-Z0-9]/g, "")}`;
  const [readout, setReadout] = useState<Readout | null>(null);
  const { curves, derated, interpolated, instability, findings, pulses, refCaseTemp, title } = props;
  const lines = useMemo(
    () => buildLines({ title, curves, derated, interpolated, instability }, colours),
    [title, curves, derated, interpolated, instability, colours],
  );
  const domains = useMemo(() => chartDomains({ curves, pulses }), [curves, pulses]);
  const rows = useMemo(
    () => legendRows({ title, curves, derated, findings, pulses, refCaseTemp }, lines, colours),
    [title, curves, derated, findings, pulses, refCaseTemp, lines, colours],
  );
  // The instability boundary is named in the legend: its far end runs off the plot toward the zero-TC point.
  const labelled = lines.filter(
    (l) => l.kind !== "derated" && l.kind !== "instability" && (l.points[l.points.length - 1]?.[1] ?? 0) > 0,
  );
  const gutter = Math.max(48, ...labelled.map((l) => textWidth(l.label) + 10));
  const legendWidth = Math.max(160, ...rows.map((r) => textWidth(r.text) + 34));
  const layout = chartLayout(props.available, domains, gutter, rows.length, legendWidth, true);
  const { plot } = layout;
  const x = useMemo(
    () =>
      scaleLog()
        .domain(domains.x)
        .range([plot.left, plot.left + plot.width]),
    [domains.x, plot.left, plot.width],
  );
  const y = useMemo(
    () =>
      scaleLog()
        .domain(domains.y)
        .range([plot.top + plot.height, plot.top]),
    [domains.y, plot.top, plot.height],
  );
  const { top: mt, right: mr, bottom: mb, left: ml } = layout.margin;
  // XYChart keeps its margin in state: a new object only when a side changes.
  const margin = useMemo(() => ({ top: mt, right: mr, bottom: mb, left: ml }), [mt, mr, mb, ml]);
  const xScale = useMemo(() => ({ type: "log" as const, domain: domains.x }), [domains.x]);
  const yScale = useMemo(() => ({ type: "log" as const, domain: domains.y }), [domains.y]);

  const labels = placeLabels(
    labelled.map((line) => {
      const [v, i] = line.points[line.points.length - 1];
      return {
        key: line.key,
        x: Math.min(x(v), plot.left + plot.width) + 5,
        y: y(i),
        width: textWidth(line.label),
      };
    }),
    plot.top + 4,
    plot.top + plot.height - 4,
  );
  const marked = (findings ?? []).map((f, k) => ({ finding: f, number: k + 1, at: findingPoint(f, lines) }));

  function onMove(event: PointerEvent<SVGRectElement>) {
    const box = event.currentTarget.ownerSVGElement?.getBoundingClientRect();
    if (!box) return;
    const px = event.clientX - box.left;
    const py = event.clientY - box.top;
    const v = x.invert(px);
    const i = y.invert(py);
    let nearest: { line: ChartLine; current: number; distance: number } | null = null;
    for (const line of lines) {
      if (line.kind === "instability") continue;
      const current = interpolateCurve(line.points, v);
      if (current.current === null || current.flag !== null) continue;
      const distance = Math.abs(y(current.current) - py);
      if (distance <= snapDistance && (!nearest || distance < nearest.distance)) {
        nearest = { line, current: current.current, distance };
      }
    }
    const shownI = nearest ? nearest.current : i;
    setReadout({
      left: px,
      top: nearest ? y(nearest.current) : py,
      title: nearest ? `${nearest.line.name} limit` : undefined,
      rows: [
        { label: Sym.vds, value: formatQuantity(v, "V") },
        { label: Sym.id, value: formatQuantity(shownI, "A") },
        { label: Sym.p, value: formatQuantity(v * shownI, "W") },
      ],
    });
  }

  return (
    <>
      <XYChart
        width={layout.width}
        height={layout.height}
        margin={margin}
        xScale={xScale}
        yScale={yScale}
        captureEvents={false}
        accessibilityLabel={`Safe operating area of ${title}: drain current against drain-source voltage, log-log`}
      >
        <title>{`SOA of ${title}`}</title>
        <defs>
          <clipPath id={clipId}>
            <rect x={plot.left} y={plot.top} width={plot.width} height={plot.height} />
          </clipPath>
        </defs>
        <LogGrid
          x={x}
          y={y}
          xDomain={domains.x}
          yDomain={domains.y}
          plot={plot}
          colours={colours}
          xTitle={<SubscriptLabel main="V" sub="DS" unit="V" />}
          yTitle={<SubscriptLabel main="I" sub="D" unit="A" />}
        />
        <g clipPath={`url(#${clipId})`}>
          {lines.map((line) => (
            <LineSeries
              key={line.key}
              dataKey={line.key}
              data={line.points}
              xAccessor={vOf}
              yAccessor={iOf}
              enableEvents={false}
              stroke={line.stroke}
              strokeWidth={line.strokeWidth}
              strokeDasharray={line.dash}
              strokeLinejoin="round"
              data-series={line.kind}
              data-name={line.name}
            />
          ))}
        </g>
        <g data-layer="labels" fontSize={11}>
          {labels.map((label) => {
            const line = lines.find((l) => l.key === label.key)!;
            const [v, i] = line.points[line.points.length - 1];
            const moved = Math.abs(label.placedY - y(i)) > 3;
            return (
              <g key={label.key}>
                {moved ? (
                  <line
                    x1={Math.min(x(v), plot.left + plot.width)}
                    y1={y(i)}
                    x2={label.x - 1}
                    y2={label.placedY}
                    stroke={line.stroke}
                    strokeWidth={0.8}
                  />
                ) : null}
                <text
                  x={label.x + 1}
                  y={label.placedY + 4}
                  fill={line.text}
                  stroke={colours.panel}
                  strokeWidth={3}
                  strokeLinejoin="round"
                  paintOrder="stroke"
                  data-curve-label={line.kind}
                >
                  {line.label}
                </text>
              </g>
            );
          })}
        </g>
        <rect
          data-export="skip"
          x={plot.left}
          y={plot.top}
          width={plot.width}
          height={plot.height}
          fill="transparent"
          onPointerMove={onMove}
          onPointerLeave={() => setReadout(null)}
        />
        {readout ? (
          <g data-export="skip" pointerEvents="none" stroke={colours.inkFaint} strokeWidth={0.75}>
            <line x1={readout.left} x2={readout.left} y1={plot.top} y2={plot.top + plot.height} />
            <line x1={plot.left} x2={plot.left + plot.width} y1={readout.top} y2={readout.top} />
          </g>
        ) : null}
        <g data-layer="findings">
          {marked.map(({ finding, number, at }) =>
            at ? (
              <g
                key={number}
                data-finding={number}
                onPointerEnter={() =>
                  setReadout({
                    left: x(at[0]),
                    top: y(at[1]),
                    title: `Finding ${number}: ${finding.message}`,
                    rows: [
                      { label: Sym.vds, value: formatQuantity(at[0], "V") },
                      { label: Sym.id, value: formatQuantity(at[1], "A") },
                    ],
                  })
                }
                onPointerLeave={() => setReadout(null)}
              >
                <FindingMark x={x(at[0])} y={y(at[1])} label={String(number)} colours={colours} />
              </g>
            ) : null,
          )}
        </g>
        <g data-layer="pulses">
          {(pulses ?? []).map((pulse) => {
            const at = placePulse(pulse, domains);
            const off = at.off.v || at.off.i;
            const px = x(at.v);
            const py = y(at.i);
            const value = at.offScale;
            return (
              <g
                key={pulse.id}
                data-pulse={pulse.id}
                data-off-scale={off ? "true" : undefined}
                onPointerEnter={() =>
                  setReadout({
                    left: px,
                    top: py,
                    title: `${pulse.label} (${pulse.verdict === "no-data" ? "no data" : pulse.verdict})${off ? ", off scale" : ""}`,
                    rows: [
                      { label: Sym.vds, value: formatQuantity(pulse.v, "V") },
                      { label: Sym.id, value: formatQuantity(pulse.i, "A") },
                      { label: Sym.p, value: formatQuantity(pulse.v * pulse.i, "W") },
                    ],
                  })
                }
                onPointerLeave={() => setReadout(null)}
              >
                <VerdictGlyph verdict={pulse.verdict} x={px} y={py} size={10} />
                {off ? (
                  <OffScaleMark
                    x={px}
                    y={py}
                    right={at.off.v && pulse.v > at.v}
                    up={at.off.i && pulse.i > at.i}
                    horizontal={at.off.v}
                    vertical={at.off.i}
                    text={`${value} off scale`}
                    plot={plot}
                    colour={colours.ink}
                  />
                ) : null}
              </g>
            );
          })}
        </g>
        <ChartLegend
          rows={rows}
          x={layout.legend.x}
          y={layout.legend.y}
          colours={colours}
          columns={layout.legend.columns}
          columnWidth={legendWidth}
        />
      </XYChart>
      {readout ? <ReadoutBox readout={readout} frameWidth={layout.width} /> : null}
    </>
  );
}
