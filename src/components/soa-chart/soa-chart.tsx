"use client";

import { type PointerEvent, useMemo, useState } from "react";
import { q } from "@/lib/format";
import { interpolateCurve } from "@/lib/soa/interpolate-curve";
import { verdictWords } from "@/lib/vocabulary";
import { useChartColours } from "./chart-colours";
import { ChartFigure, ChartFrame, pointerAt, SoaPlotArea } from "./chart-frame";
import { EndLabels, LimitLines, PulseMarks } from "./chart-layers";
import { FindingMark, legendRows } from "./chart-legend";
import { buildLines, type ChartLine, chartDomains, chartLayout, textWidth } from "./chart-model";
import { limitReadout, type Readout, Sym } from "./chart-readout";
import { type Axis, plotAxes } from "./frame-model";
import { PointsTable } from "./points-table";
import type { ChartFinding, SoaChartProps } from "./types";

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
  return (
    <ChartFigure
      testId="soa-chart"
      placeholder="h-[30rem]"
      caption={<PointsTable {...props} />}
      exportName={`${props.title}-soa`}
    >
      {(width) => <SoaPlot {...props} available={width} />}
    </ChartFigure>
  );
}

function SoaPlot(props: SoaChartProps & { available: number }) {
  const colours = useChartColours();
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
  const { x, y } = plotAxes(plot, { kind: "log", domain: domains.x }, { kind: "log", domain: domains.y });
  const readable = lines.filter((l) => l.kind !== "instability");

  const onMove = (event: PointerEvent<SVGRectElement>) =>
    setReadout(limitReadout(readable, pointerAt(event), x, y, true));

  return (
    <ChartFrame
      width={layout.width}
      height={layout.height}
      label={`Safe operating area of ${title}: drain current against drain-source voltage, log-log`}
      title={`SOA of ${title}`}
      legend={{ rows, ...layout.legend, columnWidth: legendWidth }}
      readout={readout}
    >
      <SoaPlotArea
        plot={plot}
        x={x}
        y={y}
        clipped={
          <LimitLines
            lines={lines}
            x={x}
            y={y}
            caps="round"
            attributes={(line) => ({ "data-series": line.kind, "data-name": line.name })}
          />
        }
        above={
          <EndLabels lines={labelled} x={x} y={y} plot={plot} colours={colours} kindOf={(l) => l.kind} />
        }
        pointer={{ onPointerMove: onMove, onPointerLeave: () => setReadout(null) }}
        crosshair={readout}
        front={
          <>
            <FindingMarks findings={findings ?? []} lines={lines} x={x} y={y} onReadout={setReadout} />
            <PulseMarks
              pulses={pulses ?? []}
              x={x}
              y={y}
              plot={plot}
              colours={colours}
              size={10}
              readoutOf={(pulse, off) => ({
                title: `${pulse.label} (${verdictWords[pulse.verdict]})${off ? ", off scale" : ""}`,
                rows: [
                  { label: Sym.vds, value: q(pulse.v, "V") },
                  { label: Sym.id, value: q(pulse.i, "A") },
                  { label: Sym.p, value: q(pulse.v * pulse.i, "W") },
                ],
              })}
              onReadout={setReadout}
            />
          </>
        }
      />
    </ChartFrame>
  );
}

/** The curve set's findings, numbered as listed, each on its curve at its voltage. */
function FindingMarks({
  findings,
  lines,
  x,
  y,
  onReadout,
}: {
  findings: ChartFinding[];
  lines: ChartLine[];
  x: Axis;
  y: Axis;
  onReadout: (readout: Readout | null) => void;
}) {
  const colours = useChartColours();
  return (
    <g data-layer="findings">
      {findings.map((finding, k) => {
        const number = k + 1;
        const at = findingPoint(finding, lines);
        if (!at) return null;
        return (
          <g
            key={number}
            data-finding={number}
            onPointerEnter={() =>
              onReadout({
                left: x.scale(at[0]),
                top: y.scale(at[1]),
                title: `Finding ${number}: ${finding.message}`,
                rows: [
                  { label: Sym.vds, value: q(at[0], "V") },
                  { label: Sym.id, value: q(at[1], "A") },
                ],
              })
            }
            onPointerLeave={() => onReadout(null)}
          >
            <FindingMark x={x.scale(at[0])} y={y.scale(at[1])} label={String(number)} colours={colours} />
          </g>
        );
      })}
    </g>
  );
}
