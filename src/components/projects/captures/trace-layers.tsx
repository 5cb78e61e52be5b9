import type { Axis, PlotBox } from "@/components/soa-chart/frame-model";
import { VerdictGlyph } from "@/components/verdict-shape";
import type { TraceMark, TracePanel } from "./trace-charts";
import { envelopePaths, type TraceSeries } from "./trace-model";

// The trace charts' own layers on the frame: each series' envelope, a panel's title and series names, and the
// marked moments.

/** One series' min/max envelope over the window: filled, or outlined when dashed. */
export function Envelope({
  series,
  window,
  x,
  y,
}: {
  series: TraceSeries;
  window: [number, number];
  x: Axis;
  y: Axis;
}) {
  return envelopePaths(series, window, x.scale, y.scale).map((d) => (
    <path
      key={`${series.key}-${d.length}-${d.slice(0, 24)}`}
      d={d}
      fill={series.stroke}
      fillOpacity={series.dash ? 0 : 0.3}
      stroke={series.stroke}
      strokeWidth={1.1}
      strokeDasharray={series.dash}
      strokeLinejoin="round"
      data-series={series.key}
    />
  ));
}

/** The panel's symbol and unit at its top left, and its series named at its top right when there are several. */
export function PanelTitle({
  panel,
  plot,
  ink,
  muted,
}: {
  panel: TracePanel;
  plot: PlotBox;
  ink: string;
  muted: string;
}) {
  const n = panel.series.length;
  return (
    <>
      <text x={plot.left} y={plot.top - 5} fontSize={11} fill={ink} fontWeight={600}>
        {panel.symbol.main}
        {panel.symbol.sub ? (
          <tspan fontSize={8} dy={3}>
            {panel.symbol.sub}
          </tspan>
        ) : null}
        <tspan dy={panel.symbol.sub ? -3 : 0} fontWeight={400} fill={muted}>
          {" "}
          ({panel.unit})
        </tspan>
      </text>
      {n > 1
        ? panel.series.map((s, k) => (
            <g key={s.key} transform={`translate(${plot.left + plot.width - (n - k) * 120},${plot.top - 9})`}>
              <line
                x1={0}
                x2={18}
                y1={0}
                y2={0}
                stroke={s.stroke}
                strokeWidth={1.6}
                strokeDasharray={s.dash}
              />
              <text x={22} y={3.5} fontSize={10} fill={muted}>
                {s.label}
              </text>
            </g>
          ))
        : null}
    </>
  );
}

/** The marked moments as dashed verticals; the top panel (`labelled`) names each beside its verdict's shape. */
export function TraceMarks({
  marks,
  x,
  plot,
  labelled,
  ink,
}: {
  marks: TraceMark[];
  x: Axis;
  plot: PlotBox;
  labelled: boolean;
  ink: string;
}) {
  const middle = plot.left + plot.width / 2;
  return marks.map((m, k) => {
    const at = x.scale(m.t);
    return (
      <g key={m.key} data-testid={labelled ? "binding-mark" : undefined}>
        <line
          x1={at}
          x2={at}
          y1={plot.top}
          y2={plot.top + plot.height}
          stroke={ink}
          strokeWidth={1}
          strokeDasharray="3 2"
        />
        {labelled ? (
          <>
            <VerdictGlyph verdict={m.verdict} x={at} y={plot.top + 7 + 12 * k} size={8} />
            <text
              x={at + (at > middle ? -7 : 7)}
              y={plot.top + 10.5 + 12 * k}
              fontSize={10}
              textAnchor={at > middle ? "end" : "start"}
              fill={ink}
            >
              {m.label}
            </text>
          </>
        ) : null}
      </g>
    );
  });
}
