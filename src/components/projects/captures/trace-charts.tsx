"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { type PointerEvent, useState } from "react";
import { Button } from "@/components/form";
import { useChartColours } from "@/components/soa-chart/chart-colours";
import { ChartFigure, ChartFrame, PlotArea, pointerAt } from "@/components/soa-chart/chart-frame";
import { ChartTable } from "@/components/soa-chart/chart-table";
import { type AxisSpec, makeAxis } from "@/components/soa-chart/frame-model";
import type { Verdict } from "@/components/verdict-shape";
import { q } from "@/lib/format";
import type { Unit } from "@/lib/soa/units";
import { Envelope, PanelTitle, TraceMarks } from "./trace-layers";
import { type Pair, panelDomain, type TraceSeries, visibleRange } from "./trace-model";

export type { TraceSeries } from "./trace-model";

/** A moment marked across every panel: a capture's binding sample for one candidate, say. */
export interface TraceMark {
  key: string;
  t: number;
  label: string;
  verdict: Verdict;
}

export interface TracePanel {
  key: string;
  /** The symbol drawn in the panel's corner: main letter and subscript (SVG text has no <sub>). */
  symbol: { main: string; sub?: string };
  /** Plain name for the text alternative, e.g. "V_DS (V)". */
  name: string;
  unit: Unit;
  series: TraceSeries[];
}

const MARGIN = { left: 64, right: 16 };
const PLOT_HEIGHT = 92;
const PANEL_GAP = 22;
const TITLE_SPACE = 16;
const AXIS_HEIGHT = 44;

/**
 * V, I, P and T_j panels against one shared time axis, each series drawn as its min/max envelope (no spike
 * between drawn points is lost). Drag across any panel to zoom all of them to that time span; "Reset zoom" returns.
 */
export function TraceCharts({
  panels,
  span,
  marks = [],
}: {
  panels: TracePanel[];
  span: [number, number];
  marks?: TraceMark[];
}) {
  const [domain, setDomain] = useState<[number, number]>(span);
  const zoomed = domain[0] !== span[0] || domain[1] !== span[1];
  return (
    <ChartFigure
      testId="capture-traces"
      placeholder="h-80"
      header={
        <div className="mb-2 flex items-center justify-between gap-3">
          <p className="text-xs text-ink-muted">
            Drag across a panel to zoom in time; the shaded band is the lowest to highest sample in each drawn
            step.
          </p>
          <Button size="sm" disabled={!zoomed} onClick={() => setDomain(span)}>
            Reset zoom
          </Button>
        </div>
      }
      caption={<TraceTable panels={panels} domain={domain} />}
    >
      {(width) => (
        <TraceFrame panels={panels} marks={marks} domain={domain} onZoom={setDomain} width={width} />
      )}
    </ChartFigure>
  );
}

function TraceFrame({
  panels,
  marks,
  domain,
  onZoom,
  width,
}: {
  panels: TracePanel[];
  marks: TraceMark[];
  domain: [number, number];
  onZoom: (domain: [number, number]) => void;
  width: number;
}) {
  const colours = useChartColours();
  const [brush, setBrush] = useState<{ from: number; to: number } | null>(null);
  const plotWidth = Math.max(10, width - MARGIN.left - MARGIN.right);
  const height = TITLE_SPACE + panels.length * (PLOT_HEIGHT + PANEL_GAP) - PANEL_GAP + AXIS_HEIGHT;
  const time = (last: boolean): AxisSpec => ({
    kind: "linear",
    domain,
    count: Math.max(2, Math.floor(plotWidth / 110)),
    format: (t) => q(t, "s", 3),
    unlabelled: !last,
  });
  const visible = marks.filter((m) => m.t >= domain[0] && m.t <= domain[1]);
  const x = makeAxis(time(false), [MARGIN.left, MARGIN.left + plotWidth]);

  // The brush's edge, held inside the plots.
  const local = (event: PointerEvent<SVGRectElement>) =>
    Math.min(MARGIN.left + plotWidth, Math.max(MARGIN.left, pointerAt(event).px));
  const pointer = {
    className: "cursor-crosshair",
    onPointerDown: (e: PointerEvent<SVGRectElement>) => {
      e.currentTarget.setPointerCapture(e.pointerId);
      setBrush({ from: local(e), to: local(e) });
    },
    onPointerMove: (e: PointerEvent<SVGRectElement>) => {
      if (brush) setBrush({ ...brush, to: local(e) });
    },
    onPointerUp: (e: PointerEvent<SVGRectElement>) => {
      if (brush && Math.abs(local(e) - brush.from) > 4) {
        const [a, b] = [Math.min(brush.from, local(e)), Math.max(brush.from, local(e))];
        onZoom([x.scale.invert(a), x.scale.invert(b)]);
      }
      setBrush(null);
    },
  };

  return (
    <ChartFrame
      width={width}
      height={height}
      label={`Capture traces against time, ${q(domain[0], "s")} to ${q(domain[1], "s")}`}
      className="select-none"
    >
      {panels.map((panel, index) => {
        const plot = {
          left: MARGIN.left,
          top: TITLE_SPACE + index * (PLOT_HEIGHT + PANEL_GAP),
          width: plotWidth,
          height: PLOT_HEIGHT,
        };
        const last = index === panels.length - 1;
        const px = makeAxis(time(last), [plot.left, plot.left + plot.width]);
        const py = makeAxis(
          {
            kind: "linear",
            domain: panelDomain(panel.series, domain, panel.unit),
            count: 3,
            format: (v) => q(v, panel.unit, 3),
          },
          [plot.top + plot.height, plot.top],
        );
        return (
          <g key={panel.key} data-panel={panel.key}>
            <PlotArea
              plot={plot}
              x={px}
              y={py}
              xTitle={last ? "time" : undefined}
              clipped={panel.series.map((s) => (
                <Envelope key={s.key} series={s} window={domain} x={px} y={py} />
              ))}
              above={
                <>
                  <PanelTitle panel={panel} plot={plot} ink={colours.ink} muted={colours.inkMuted} />
                  <TraceMarks marks={visible} x={px} plot={plot} labelled={index === 0} ink={colours.ink} />
                  {brush ? (
                    <rect
                      x={Math.min(brush.from, brush.to)}
                      y={plot.top}
                      width={Math.abs(brush.to - brush.from)}
                      height={plot.height}
                      fill={colours.accent}
                      fillOpacity={0.12}
                      stroke={colours.accent}
                      strokeWidth={0.8}
                    />
                  ) : null}
                </>
              }
              pointer={pointer}
            />
          </g>
        );
      })}
    </ChartFrame>
  );
}

interface TraceRow {
  /** The sample's index in the drawn series. */
  k: number;
}

/** The text alternative: up to 60 evenly spaced drawn steps of the window shown, lowest and highest of each. */
function TraceTable({ panels, domain }: { panels: TracePanel[]; domain: [number, number] }) {
  const first = panels[0]?.series[0];
  if (!first) return null;
  const [a, b] = visibleRange(first.t, domain[0], domain[1]);
  const step = Math.max(1, Math.ceil((b - a + 1) / 60));
  const rows: TraceRow[] = [];
  for (let k = a; k <= b; k += step) rows.push({ k });
  const range = (pair: Pair | undefined, unit: Unit) => {
    if (!pair || pair[0] === null || pair[1] === null) return "—";
    return pair[0] === pair[1] ? q(pair[0], unit) : `${q(pair[0], unit)} … ${q(pair[1], unit)}`;
  };
  const columns: ColumnDef<TraceRow>[] = [
    { id: "t", header: "t", cell: ({ row }) => q(first.t[row.original.k], "s"), meta: { numeric: true } },
    ...panels.flatMap((p) =>
      p.series.map(
        (series, n): ColumnDef<TraceRow> => ({
          id: `${p.key}-${n}`,
          header: p.series.length > 1 ? `${p.name}, ${series.label}` : p.name,
          cell: ({ row }) => range(series.y[row.original.k], p.unit),
          meta: { numeric: true },
        }),
      ),
    ),
  ];
  return (
    <ChartTable
      className="text-sm"
      summary={<>Show the traces as a table ({rows.length} steps)</>}
      label="Capture traces"
      columns={columns}
      data={rows}
      getRowId={(row) => String(row.k)}
    />
  );
}
