"use client";

import { type PointerEvent, useMemo, useState } from "react";
import { useChartColours } from "@/components/soa-chart/chart-colours";
import { ChartFigure, ChartFrame, pointerAt, SoaPlotArea } from "@/components/soa-chart/chart-frame";
import { EndLabels, LimitLines, PulseMarks } from "@/components/soa-chart/chart-layers";
import type { LegendRow } from "@/components/soa-chart/chart-legend";
import { chartDomains, chartLayout, textWidth } from "@/components/soa-chart/chart-model";
import { limitReadout, type Readout, Sym } from "@/components/soa-chart/chart-readout";
import { plotAxes } from "@/components/soa-chart/frame-model";
import { percent, q } from "@/lib/format";
import { verdictWords } from "@/lib/vocabulary";
import type { OverlayLine, OverlayMarker } from "./overlay-model";

/** The legend: the heading, each candidate's line, and the worst verdicts among the chosen pulses. */
export function overlayLegend(heading: string, lines: OverlayLine[], markers: OverlayMarker[]): LegendRow[] {
  const verdicts = new Set(markers.map((m) => m.verdict));
  return [
    { key: "h", text: heading, swatch: { kind: "heading" } },
    ...lines.map(
      (l): LegendRow => ({
        key: l.key,
        text: l.label,
        swatch: { kind: "line", stroke: l.stroke, dash: l.dash, width: 1.75 },
      }),
    ),
    ...(["pass", "marginal", "fail", "no-data"] as const)
      .filter((v) => verdicts.has(v))
      .map(
        (v): LegendRow => ({
          key: v,
          text: `Pulse, worst: ${verdictWords[v]}`,
          swatch: { kind: "verdict", verdict: v },
        }),
      ),
  ];
}

/**
 * Several candidates' limit lines on one log-log SOA frame (the SOA chart's frame, scales and layout): each line
 * labelled with its candidate at its end and named in the legend, the chosen pulses as verdict-shaped markers.
 * Exports as SVG and PNG like every chart.
 */
export function OverlayChart({
  title,
  heading,
  lines,
  markers,
}: {
  title: string;
  /** The legend's first line, e.g. "Derated, T_C = 85 °C". */
  heading: string;
  lines: OverlayLine[];
  markers: OverlayMarker[];
}) {
  return (
    <ChartFigure testId="overlay-chart" placeholder="h-[28rem]" exportName={`${title}-overlay`}>
      {(width) => (
        <OverlayPlot title={title} heading={heading} lines={lines} markers={markers} available={width} />
      )}
    </ChartFigure>
  );
}

function OverlayPlot({
  title,
  heading,
  lines,
  markers,
  available,
}: {
  title: string;
  heading: string;
  lines: OverlayLine[];
  markers: OverlayMarker[];
  available: number;
}) {
  const colours = useChartColours();
  const [readout, setReadout] = useState<Readout | null>(null);
  // The axes stay on the curves' decades; a pulse far beyond them is held at the edge with its value.
  const domains = useMemo(() => chartDomains({ curves: lines, pulses: markers }), [lines, markers]);
  const legend = useMemo(() => overlayLegend(heading, lines, markers), [heading, lines, markers]);
  const gutter = Math.max(48, ...lines.map((l) => textWidth(l.label) + 10));
  const layout = chartLayout(available, domains, gutter, legend.length);
  const { plot } = layout;
  const { x, y } = plotAxes(plot, { kind: "log", domain: domains.x }, { kind: "log", domain: domains.y });

  const onMove = (event: PointerEvent<SVGRectElement>) =>
    setReadout(limitReadout(lines, pointerAt(event), x, y, false));

  return (
    <ChartFrame
      width={layout.width}
      height={layout.height}
      label={`Limit lines of ${lines.length} candidate${lines.length === 1 ? "" : "s"} with the chosen pulses: drain current against drain-source voltage, log-log`}
      title={title}
      legend={{ rows: legend, x: layout.legend.x, y: layout.legend.y }}
      readout={readout}
    >
      <SoaPlotArea
        plot={plot}
        x={x}
        y={y}
        clipped={
          <LimitLines lines={lines} x={x} y={y} attributes={(line) => ({ "data-candidate": line.partId })} />
        }
        above={<EndLabels lines={lines} x={x} y={y} plot={plot} colours={colours} />}
        pointer={{ onPointerMove: onMove, onPointerLeave: () => setReadout(null) }}
        front={
          <PulseMarks
            pulses={markers}
            x={x}
            y={y}
            plot={plot}
            colours={colours}
            size={11}
            readoutOf={(m) => ({
              title: m.name,
              rows: [
                { label: Sym.vds, value: q(m.v, "V") },
                { label: Sym.id, value: q(m.i, "A") },
                ...m.byCandidate.map((b) => ({
                  label: b.partNumber,
                  value: `${verdictWords[b.verdict]}${b.utilisation !== null ? ` ${percent(b.utilisation)}` : ""}`,
                })),
              ],
            })}
            onReadout={setReadout}
          />
        }
      />
    </ChartFrame>
  );
}
