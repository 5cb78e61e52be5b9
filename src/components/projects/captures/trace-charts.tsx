"use client";

import { scaleLinear } from "d3-scale";
import { type PointerEvent, useEffect, useRef, useState } from "react";
import { Button } from "@/components/form";
import { ScrollRegion } from "@/components/scroll-region";
import { type Verdict, VerdictGlyph } from "@/components/verdict-shape";
import { TEMPERATURE_DISPLAY_RANGE } from "@/lib/soa/sanity";
import { formatQuantity, type Unit } from "@/lib/soa/units";

type Pair = [number | null, number | null];

export interface TraceSeries {
  key: string;
  label: string;
  t: number[];
  y: Pair[];
  stroke: string;
  dash?: string;
}

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
const AXIS_HEIGHT = 26;

function useWidth() {
  const ref = useRef<HTMLDivElement | null>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const node = ref.current;
    if (!node) return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.floor(entry.contentRect.width)));
    observer.observe(node);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

/** Indices of the samples inside [t0, t1], with one neighbour either side so lines reach the edges. */
function visibleRange(t: number[], t0: number, t1: number): [number, number] {
  let first = 0;
  while (first < t.length - 1 && t[first + 1] < t0) first++;
  let last = t.length - 1;
  while (last > 0 && t[last - 1] > t1) last--;
  return [first, last];
}

/** The min/max envelope of a decimated series as closed paths, one per run of finite samples. */
function envelopePaths(
  series: TraceSeries,
  first: number,
  last: number,
  x: (t: number) => number,
  y: (v: number) => number,
) {
  const paths: string[] = [];
  let run: number[] = [];
  const flush = () => {
    if (run.length === 0) return;
    const upper = run.map((k) => `${x(series.t[k]).toFixed(1)},${y(series.y[k][1] as number).toFixed(1)}`);
    const lower = run
      .slice()
      .reverse()
      .map((k) => `${x(series.t[k]).toFixed(1)},${y(series.y[k][0] as number).toFixed(1)}`);
    paths.push(`M${upper.join("L")}L${lower.join("L")}Z`);
    run = [];
  };
  for (let k = first; k <= last; k++) {
    const [lo, hi] = series.y[k] ?? [null, null];
    if (lo === null || hi === null || !Number.isFinite(lo) || !Number.isFinite(hi)) flush();
    else run.push(k);
  }
  flush();
  return paths;
}

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
  const { ref, width } = useWidth();
  const [domain, setDomain] = useState<[number, number]>(span);
  const [brush, setBrush] = useState<{ from: number; to: number } | null>(null);
  const zoomed = domain[0] !== span[0] || domain[1] !== span[1];
  const plotWidth = Math.max(10, width - MARGIN.left - MARGIN.right);
  const x = scaleLinear()
    .domain(domain)
    .range([MARGIN.left, MARGIN.left + plotWidth]);
  const height = TITLE_SPACE + panels.length * (PLOT_HEIGHT + PANEL_GAP) - PANEL_GAP + AXIS_HEIGHT;
  const ticks = x.ticks(Math.max(2, Math.floor(plotWidth / 110)));

  function local(event: PointerEvent<SVGRectElement>) {
    const box = event.currentTarget.ownerSVGElement?.getBoundingClientRect();
    const px = box ? event.clientX - box.left : 0;
    return Math.min(MARGIN.left + plotWidth, Math.max(MARGIN.left, px));
  }

  return (
    <figure className="min-w-0" data-testid="capture-traces">
      <div className="mb-2 flex items-center justify-between gap-3">
        <p className="text-xs text-ink-muted">
          Drag across a panel to zoom in time; the shaded band is the lowest to highest sample in each drawn
          step.
        </p>
        <Button size="sm" disabled={!zoomed} onClick={() => setDomain(span)}>
          Reset zoom
        </Button>
      </div>
      <div ref={ref}>
        {width > 0 ? (
          <svg
            width={width}
            height={height}
            role="img"
            aria-label={`Capture traces against time, ${formatQuantity(domain[0], "s")} to ${formatQuantity(domain[1], "s")}`}
            className="select-none"
          >
            {panels.map((panel, index) => {
              const top = TITLE_SPACE + index * (PLOT_HEIGHT + PANEL_GAP);
              let lo = Number.POSITIVE_INFINITY;
              let hi = Number.NEGATIVE_INFINITY;
              const ranges = panel.series.map((s) => visibleRange(s.t, domain[0], domain[1]));
              panel.series.forEach((s, k) => {
                for (let j = ranges[k][0]; j <= ranges[k][1]; j++) {
                  const [a, b] = s.y[j] ?? [null, null];
                  if (a !== null && Number.isFinite(a)) lo = Math.min(lo, a);
                  if (b !== null && Number.isFinite(b)) hi = Math.max(hi, b);
                }
              });
              if (panel.unit === "°C") {
                // A runaway thermal result stays on a sane scale; the table and the readout say "off scale".
                lo = Math.max(lo, TEMPERATURE_DISPLAY_RANGE.min);
                hi = Math.min(hi, TEMPERATURE_DISPLAY_RANGE.max);
              }
              if (!(lo <= hi)) [lo, hi] = [0, 1];
              if (lo === hi) [lo, hi] = [lo - 1, hi + 1];
              const pad = (hi - lo) * 0.06;
              const y = scaleLinear()
                .domain([lo - pad, hi + pad])
                .range([top + PLOT_HEIGHT, top]);
              return (
                <g key={panel.key} data-panel={panel.key}>
                  <rect
                    x={MARGIN.left}
                    y={top}
                    width={plotWidth}
                    height={PLOT_HEIGHT}
                    fill="var(--color-panel)"
                    stroke="var(--color-line)"
                  />
                  {ticks.map((t) => (
                    <line
                      key={t}
                      x1={x(t)}
                      x2={x(t)}
                      y1={top}
                      y2={top + PLOT_HEIGHT}
                      stroke="var(--color-line)"
                      strokeWidth={0.6}
                    />
                  ))}
                  {y.ticks(3).map((v) => (
                    <g key={v}>
                      <line
                        x1={MARGIN.left}
                        x2={MARGIN.left + plotWidth}
                        y1={y(v)}
                        y2={y(v)}
                        stroke="var(--color-line)"
                        strokeWidth={0.6}
                      />
                      <text
                        x={MARGIN.left - 6}
                        y={y(v) + 3.5}
                        textAnchor="end"
                        fontSize={10}
                        fill="var(--color-ink-muted)"
                        className="num"
                      >
                        {formatQuantity(v, panel.unit, 3)}
                      </text>
                    </g>
                  ))}
                  <svg x={MARGIN.left} y={top} width={plotWidth} height={PLOT_HEIGHT} overflow="hidden">
                    <g transform={`translate(${-MARGIN.left},${-top})`}>
                      {panel.series.map((s, k) =>
                        envelopePaths(s, ranges[k][0], ranges[k][1], x, y).map((d) => (
                          <path
                            key={`${s.key}-${d.length}-${d.slice(0, 24)}`}
                            d={d}
                            fill={s.stroke}
                            fillOpacity={s.dash ? 0 : 0.3}
                            stroke={s.stroke}
                            strokeWidth={1.1}
                            strokeDasharray={s.dash}
                            strokeLinejoin="round"
                            data-series={s.key}
                          />
                        )),
                      )}
                    </g>
                  </svg>
                  <text x={MARGIN.left} y={top - 5} fontSize={11} fill="var(--color-ink)" fontWeight={600}>
                    {panel.symbol.main}
                    {panel.symbol.sub ? (
                      <tspan fontSize={8} dy={3}>
                        {panel.symbol.sub}
                      </tspan>
                    ) : null}
                    <tspan dy={panel.symbol.sub ? -3 : 0} fontWeight={400} fill="var(--color-ink-muted)">
                      {" "}
                      ({panel.unit})
                    </tspan>
                  </text>
                  {panel.series.length > 1
                    ? panel.series.map((s, k) => (
                        <g
                          key={s.key}
                          transform={`translate(${MARGIN.left + plotWidth - (panel.series.length - k) * 120},${top - 9})`}
                        >
                          <line
                            x1={0}
                            x2={18}
                            y1={0}
                            y2={0}
                            stroke={s.stroke}
                            strokeWidth={1.6}
                            strokeDasharray={s.dash}
                          />
                          <text x={22} y={3.5} fontSize={10} fill="var(--color-ink-muted)">
                            {s.label}
                          </text>
                        </g>
                      ))
                    : null}
                  {marks
                    .filter((m) => m.t >= domain[0] && m.t <= domain[1])
                    .map((m, k) => (
                      <g key={m.key} data-testid={index === 0 ? "binding-mark" : undefined}>
                        <line
                          x1={x(m.t)}
                          x2={x(m.t)}
                          y1={top}
                          y2={top + PLOT_HEIGHT}
                          stroke="var(--color-ink)"
                          strokeWidth={1}
                          strokeDasharray="3 2"
                        />
                        {index === 0 ? (
                          <>
                            <VerdictGlyph verdict={m.verdict} x={x(m.t)} y={top + 7 + 12 * k} size={8} />
                            <text
                              x={x(m.t) + (x(m.t) > MARGIN.left + plotWidth / 2 ? -7 : 7)}
                              y={top + 10.5 + 12 * k}
                              fontSize={10}
                              textAnchor={x(m.t) > MARGIN.left + plotWidth / 2 ? "end" : "start"}
                              fill="var(--color-ink)"
                            >
                              {m.label}
                            </text>
                          </>
                        ) : null}
                      </g>
                    ))}
                  {brush ? (
                    <rect
                      x={Math.min(brush.from, brush.to)}
                      y={top}
                      width={Math.abs(brush.to - brush.from)}
                      height={PLOT_HEIGHT}
                      fill="var(--color-accent)"
                      fillOpacity={0.12}
                      stroke="var(--color-accent)"
                      strokeWidth={0.8}
                    />
                  ) : null}
                  <rect
                    x={MARGIN.left}
                    y={top}
                    width={plotWidth}
                    height={PLOT_HEIGHT}
                    fill="transparent"
                    className="cursor-crosshair"
                    onPointerDown={(e) => {
                      e.currentTarget.setPointerCapture(e.pointerId);
                      const at = local(e);
                      setBrush({ from: at, to: at });
                    }}
                    onPointerMove={(e) => {
                      if (brush) setBrush({ ...brush, to: local(e) });
                    }}
                    onPointerUp={(e) => {
                      if (brush && Math.abs(local(e) - brush.from) > 4) {
                        const a = x.invert(Math.min(brush.from, local(e)));
                        const b = x.invert(Math.max(brush.from, local(e)));
                        setDomain([a, b]);
                      }
                      setBrush(null);
                    }}
                  />
                </g>
              );
            })}
            <g
              transform={`translate(0,${TITLE_SPACE + panels.length * (PLOT_HEIGHT + PANEL_GAP) - PANEL_GAP + 14})`}
            >
              {ticks.map((t) => (
                <text
                  key={t}
                  x={x(t)}
                  y={0}
                  textAnchor="middle"
                  fontSize={10}
                  fill="var(--color-ink-muted)"
                  className="num"
                >
                  {formatQuantity(t, "s", 3)}
                </text>
              ))}
              <text x={MARGIN.left - 6} y={13} textAnchor="end" fontSize={10} fill="var(--color-ink-muted)">
                time
              </text>
            </g>
          </svg>
        ) : (
          <div className="h-80 rounded-md bg-sunken" />
        )}
      </div>
      <figcaption className="mt-2">
        <TraceTable panels={panels} domain={domain} />
      </figcaption>
    </figure>
  );
}

/** The text alternative: up to 60 evenly spaced drawn steps of the window shown, lowest and highest of each. */
function TraceTable({ panels, domain }: { panels: TracePanel[]; domain: [number, number] }) {
  const first = panels[0]?.series[0];
  if (!first) return null;
  const [a, b] = visibleRange(first.t, domain[0], domain[1]);
  const step = Math.max(1, Math.ceil((b - a + 1) / 60));
  const rows: number[] = [];
  for (let k = a; k <= b; k += step) rows.push(k);
  const columns = panels.flatMap((p) =>
    p.series.map((s) => ({ name: p.series.length > 1 ? `${p.name}, ${s.label}` : p.name, s, unit: p.unit })),
  );
  const range = (pair: Pair | undefined, unit: Unit) => {
    if (!pair || pair[0] === null || pair[1] === null) return "—";
    return pair[0] === pair[1]
      ? formatQuantity(pair[0], unit)
      : `${formatQuantity(pair[0], unit)} … ${formatQuantity(pair[1], unit)}`;
  };
  return (
    <details className="text-sm">
      <summary className="cursor-pointer text-ink-muted select-none hover:text-ink">
        Show the traces as a table ({rows.length} steps)
      </summary>
      <ScrollRegion className="mt-2 max-h-80 overflow-auto rounded-md border border-line bg-panel">
        <table className="w-full border-separate border-spacing-0 text-xs" aria-label="Capture traces">
          <thead>
            <tr>
              <th
                scope="col"
                className="sticky top-0 border-b border-line bg-sunken px-2 py-1.5 text-right font-medium text-ink-muted"
              >
                t
              </th>
              {columns.map((c) => (
                <th
                  key={c.name}
                  scope="col"
                  className="sticky top-0 border-b border-line bg-sunken px-2 py-1.5 text-right font-medium text-ink-muted"
                >
                  {c.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((k) => (
              <tr key={k}>
                <td className="num border-b border-line px-2 py-1 text-right font-mono">
                  {formatQuantity(first.t[k], "s")}
                </td>
                {columns.map((c) => (
                  <td key={c.name} className="num border-b border-line px-2 py-1 text-right font-mono">
                    {range(c.s.y[k], c.unit)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </details>
  );
}
