"use client";

import { scaleLog } from "d3-scale";
import { type PointerEvent, useId, useMemo, useState } from "react";
import { useChartColours } from "@/components/soa-chart/chart-colours";
import { ChartExport } from "@/components/soa-chart/chart-export-buttons";
import {
  chartDomains,
  chartLayout,
  LEGEND_ROW,
  placePulse,
  textWidth,
} from "@/components/soa-chart/chart-model";
import { type Readout, ReadoutBox, Sym } from "@/components/soa-chart/chart-readout";
import { placeLabels } from "@/components/soa-chart/label-layout";
import { LogGrid, SubscriptLabel } from "@/components/soa-chart/log-grid";
import { OffScaleMark } from "@/components/soa-chart/off-scale-mark";
import { useWidth } from "@/components/soa-chart/use-width";
import { VerdictGlyph } from "@/components/verdict-shape";
import { interpolateCurve } from "@/lib/soa/interpolate-curve";
import type { Verdict } from "@/lib/soa/types";
import { formatQuantity } from "@/lib/soa/units";
import { verdictWords } from "./format";
import type { OverlayLine, OverlayMarker } from "./overlay-model";

const snapDistance = 10;

interface LegendEntry {
  key: string;
  text: string;
  line?: OverlayLine;
  verdict?: Verdict;
}

/**
 * Several candidates' limit lines on one log-log SOA frame (the SOA chart's grid, scales and layout): each line
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
  const { ref, width } = useWidth<HTMLDivElement>();
  return (
    <figure className="min-w-0" data-testid="overlay-chart">
      <div ref={ref} className="relative overflow-x-auto">
        {width ? (
          <Frame title={title} heading={heading} lines={lines} markers={markers} available={width} />
        ) : (
          <div className="h-[28rem] rounded-md bg-sunken" />
        )}
      </div>
      <figcaption className="mt-2 flex justify-end">
        <ChartExport frame={ref} fileName={`${title}-overlay`} />
      </figcaption>
    </figure>
  );
}

function Frame({
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
  const clipId = `overlay-clip-${useId().replace(/[^a-zA-Z0-9]/g, "")}`;
  const [readout, setReadout] = useState<Readout | null>(null);
  // The axes stay on the curves' decades; a pulse far beyond them is held at the edge with its value.
  const domains = useMemo(() => chartDomains({ curves: lines, pulses: markers }), [lines, markers]);
  const legend: LegendEntry[] = useMemo(() => {
    const verdicts = new Set(markers.map((m) => m.verdict));
    return [
      { key: "h", text: heading },
      ...lines.map((l) => ({ key: l.key, text: l.label, line: l })),
      ...(["pass", "marginal", "fail", "no-data"] as const)
        .filter((v) => verdicts.has(v))
        .map((v) => ({ key: v, text: `Pulse, worst: ${verdictWords[v]}`, verdict: v })),
    ];
  }, [heading, lines, markers]);

  const gutter = Math.max(48, ...lines.map((l) => textWidth(l.label) + 10));
  const layout = chartLayout(available, domains, gutter, legend.length);
  const { plot } = layout;
  const x = scaleLog()
    .domain(domains.x)
    .range([plot.left, plot.left + plot.width]);
  const y = scaleLog()
    .domain(domains.y)
    .range([plot.top + plot.height, plot.top]);
  const labels = placeLabels(
    lines.map((line) => {
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
  const path = (points: [number, number][]) =>
    points.map(([v, i], k) => `${k ? "L" : "M"}${x(v).toFixed(1)},${y(i).toFixed(1)}`).join("");

  function onMove(event: PointerEvent<SVGRectElement>) {
    const box = event.currentTarget.ownerSVGElement?.getBoundingClientRect();
    if (!box) return;
    const px = event.clientX - box.left;
    const py = event.clientY - box.top;
    const v = x.invert(px);
    let nearest: { line: OverlayLine; current: number; distance: number } | null = null;
    for (const line of lines) {
      const read = interpolateCurve(line.points, v);
      if (read.current === null || read.flag !== null) continue;
      const distance = Math.abs(y(read.current) - py);
      if (distance <= snapDistance && (!nearest || distance < nearest.distance)) {
        nearest = { line, current: read.current, distance };
      }
    }
    const i = nearest ? nearest.current : y.invert(py);
    setReadout({
      left: px,
      top: nearest ? y(nearest.current) : py,
      title: nearest ? `${nearest.line.name} limit` : undefined,
      rows: [
        { label: Sym.vds, value: formatQuantity(v, "V") },
        { label: Sym.id, value: formatQuantity(i, "A") },
      ],
    });
  }

  return (
    <>
      <svg
        width={layout.width}
        height={layout.height}
        role="img"
        aria-label={`Limit lines of ${lines.length} candidate${lines.length === 1 ? "" : "s"} with the chosen pulses: drain current against drain-source voltage, log-log`}
        fontFamily="inherit"
      >
        <title>{title}</title>
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
        <g clipPath={`url(#${clipId})`} fill="none" strokeLinejoin="round">
          {lines.map((line) => (
            <path
              key={line.key}
              d={path(line.points)}
              stroke={line.stroke}
              strokeWidth={1.75}
              strokeDasharray={line.dash}
              data-candidate={line.partId}
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
                <text x={label.x + 1} y={label.placedY + 4} fill={line.text}>
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
        <g data-layer="pulses">
          {markers.map((m) => {
            const at = placePulse(m, domains);
            const value = at.offScale;
            return (
              <g
                key={m.id}
                data-pulse={m.id}
                data-off-scale={value ? "true" : undefined}
                onPointerEnter={() =>
                  setReadout({
                    left: x(at.v),
                    top: y(at.i),
                    title: m.name,
                    rows: [
                      { label: Sym.vds, value: formatQuantity(m.v, "V") },
                      { label: Sym.id, value: formatQuantity(m.i, "A") },
                      ...m.byCandidate.map((b) => ({
                        label: b.partNumber,
                        value: `${verdictWords[b.verdict]}${b.utilisation !== null ? ` ${Math.round(b.utilisation * 100)}\u2009%` : ""}`,
                      })),
                    ],
                  })
                }
                onPointerLeave={() => setReadout(null)}
              >
                <VerdictGlyph verdict={m.verdict} x={x(at.v)} y={y(at.i)} size={11} />
                {value ? (
                  <OffScaleMark
                    x={x(at.v)}
                    y={y(at.i)}
                    right={at.off.v && m.v > at.v}
                    up={at.off.i && m.i > at.i}
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
        <g data-layer="legend" fontSize={11} transform={`translate(${layout.legend.x} ${layout.legend.y})`}>
          {legend.map((row, k) => {
            const cy = k * LEGEND_ROW + 9;
            return (
              <g key={row.key}>
                {row.line ? (
                  <line
                    x1={0}
                    x2={22}
                    y1={cy}
                    y2={cy}
                    stroke={row.line.stroke}
                    strokeWidth={1.75}
                    strokeDasharray={row.line.dash}
                  />
                ) : null}
                {row.verdict ? <VerdictGlyph verdict={row.verdict} x={11} y={cy} size={8} /> : null}
                <text
                  x={row.line || row.verdict ? 30 : 0}
                  y={cy + 4}
                  fill={k === 0 ? colours.ink : colours.inkMuted}
                  fontWeight={k === 0 ? 600 : 400}
                >
                  {row.text}
                </text>
              </g>
            );
          })}
        </g>
      </svg>
      {readout ? <ReadoutBox readout={readout} frameWidth={layout.width} /> : null}
    </>
  );
}
