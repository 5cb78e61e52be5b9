import { decadeDomain } from "@/lib/chart/log-axis";
import { q } from "@/lib/format";
import { type ChartColours, curveHues } from "./chart-colours";
import type { ChartCurve, ChartDuration, SoaChartProps } from "./types";

// What the SOA chart draws, worked out from its props before any pixel: the lines with their styles, the
// whole-decade domains, and the layout that gives a decade the same length on both axes.

export type LineKind = "curve" | "derated" | "interpolated" | "instability";

/** A limit line as the SOA frame's layers draw it (the SOA chart's curves, the overlay's candidates). */
export interface LimitLine {
  key: string;
  /** Its name in the legend and the readout ("1 ms", "DC", "2 ms, interpolated"). */
  name: string;
  /** Its label at the line's end, kept short ("1 ms", "2 ms interp."). */
  label: string;
  /** [V, I] in SI units, sorted by V. */
  points: [number, number][];
  stroke: string;
  /** The label's colour. */
  text: string;
  dash?: string;
  strokeWidth?: number;
}

export interface ChartLine extends LimitLine {
  kind: LineKind;
  duration: ChartDuration;
  strokeWidth: number;
}

export const DERATED_DASH = "5 3";
export const INTERPOLATED_DASH = "9 3 2 3";
/** The instability boundary: dots, heavier than any limit line, so it never reads as a curve of the figure. */
export const INSTABILITY_DASH = "1 4";

/** "10 µs", "1 ms" or "DC". */
export function durationName(duration: ChartDuration): string {
  return duration === "DC" ? "DC" : q(duration, "s");
}

function order(duration: ChartDuration): number {
  return duration === "DC" ? Number.POSITIVE_INFINITY : duration;
}

export function sortByDuration(curves: readonly ChartCurve[]): ChartCurve[] {
  return [...curves].sort((a, b) => order(a.duration) - order(b.duration));
}

export function buildLines(props: SoaChartProps, colours: ChartColours): ChartLine[] {
  const curves = sortByDuration(props.curves);
  const hues = curveHues(colours, curves.length);
  const hueOf = (d: ChartDuration) =>
    hues[
      Math.max(
        0,
        curves.findIndex((c) => c.duration === d),
      )
    ];
  const lines: ChartLine[] = curves.map((c, k) => ({
    key: `curve-${k}`,
    kind: "curve",
    duration: c.duration,
    name: durationName(c.duration),
    label: durationName(c.duration),
    points: c.points,
    stroke: hues[k].line,
    text: hues[k].text,
    strokeWidth: 1.75,
  }));
  if (props.derated && props.derated.factor < 1) {
    sortByDuration(props.derated.curves).forEach((c, k) => {
      const hue = hueOf(c.duration);
      lines.push({
        key: `derated-${k}`,
        kind: "derated",
        duration: c.duration,
        name: `${durationName(c.duration)} at ${q(props.derated!.caseTemp, "°C")}`,
        label: durationName(c.duration),
        points: c.points,
        stroke: hue?.line ?? colours.accent,
        text: hue?.text ?? colours.accent,
        dash: DERATED_DASH,
        strokeWidth: 1.5,
      });
    });
  }
  if (props.interpolated && props.interpolated.points.length > 1) {
    const note = props.interpolated.note ?? "interpolated";
    lines.push({
      key: "interpolated",
      kind: "interpolated",
      duration: props.interpolated.width,
      name: `${durationName(props.interpolated.width)}, ${note}`,
      label: `${durationName(props.interpolated.width)}${note.includes("interpolated") ? " interp." : ""}`,
      points: props.interpolated.points,
      stroke: colours.ink,
      text: colours.ink,
      dash: INTERPOLATED_DASH,
      strokeWidth: 1.75,
    });
  }
  if (props.instability && props.instability.points.length > 1) {
    lines.push({
      key: "instability",
      kind: "instability",
      duration: props.instability.width,
      name: `Instability boundary, ${durationName(props.instability.width)}`,
      label: "unstable",
      points: props.instability.points,
      stroke: colours.ink,
      text: colours.ink,
      dash: INSTABILITY_DASH,
      strokeWidth: 2.5,
    });
  }
  return lines;
}

/** How far beyond the curves' decades a pulse may stretch the axes; further out it is drawn off scale. */
export const PULSE_REACH_DECADES = 1;

function within(value: number, [lo, hi]: readonly [number, number], decades: number): boolean {
  const margin = 10 ** decades;
  return value >= lo / margin && value <= hi * margin;
}

/**
 * Whole decades around the curves, stretched for pulses up to PULSE_REACH_DECADES beyond them: the axes stay on
 * the data's decades, and a pulse further out is marked at the edge (see `placePulse`) instead of stretching every
 * chart to eight decades. Without curves the pulses set the decades. Derated lines are clipped.
 */
export function chartDomains(props: {
  curves: readonly Pick<ChartCurve, "points">[];
  pulses?: readonly { v: number; i: number }[];
}) {
  const points = props.curves.flatMap((c) => c.points);
  const pulses = props.pulses ?? [];
  const base = {
    x: decadeDomain(
      points.map(([v]) => v),
      [0.1, 100],
      2,
    ),
    y: decadeDomain(
      points.map(([, i]) => i),
      [0.1, 1000],
      2,
    ),
  };
  const near =
    points.length === 0
      ? pulses
      : pulses.filter(
          (p) => within(p.v, base.x, PULSE_REACH_DECADES) && within(p.i, base.y, PULSE_REACH_DECADES),
        );
  const anchor = points.length === 0 && near.length > 0 ? [] : points;
  return {
    x: decadeDomain([...anchor.map(([v]) => v), ...near.map((p) => p.v)], [0.1, 100], 2),
    y: decadeDomain([...anchor.map(([, i]) => i), ...near.map((p) => p.i)], [0.1, 1000], 2),
  };
}

/**
 * Where a pulse is drawn: at its V and I, or held at the edge of the axes it lies beyond (`off` says which, and
 * `offScale` gives the values beyond them in words, "" when the pulse is on scale).
 */
export function placePulse(
  pulse: { v: number; i: number },
  domains: { x: [number, number]; y: [number, number] },
): { v: number; i: number; off: { v: boolean; i: boolean }; offScale: string } {
  const clamp = (value: number, [lo, hi]: [number, number]) =>
    Number.isFinite(value) && value > 0 ? Math.min(hi, Math.max(lo, value)) : lo;
  const v = clamp(pulse.v, domains.x);
  const i = clamp(pulse.i, domains.y);
  const off = { v: v !== pulse.v, i: i !== pulse.i };
  const offScale = [off.v ? q(pulse.v, "V") : null, off.i ? q(pulse.i, "A") : null]
    .filter(Boolean)
    .join(", ");
  return { v, i, off, offScale };
}

export interface ChartLayout {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
  plot: { left: number; top: number; width: number; height: number };
  decade: number;
  /** Where the legend starts; below the plot it may run in `columns` columns of `width / columns`. */
  legend: { x: number; y: number; width: number; columns: number };
}

const margin = { top: 14, left: 54, bottom: 50 };
const maxPlotHeight = 500;
const defaultLegendWidth = 200;
export const LEGEND_ROW = 17;

/** Pixel width of a label at the chart's 11 px text, generously estimated. */
export function textWidth(text: string): number {
  return text.length * 6.3 + 4;
}

/**
 * Square decades: one length per decade on both axes, as large as fits the width (the legend beside the plot
 * when there is room, else below it) and at most `maxPlotHeight` tall. With `flowLegend`, the legend goes below
 * whenever that gives larger decades, in as many columns of `legendWidth` as fit.
 */
export function chartLayout(
  available: number,
  domains: { x: [number, number]; y: [number, number] },
  gutter: number,
  legendRows: number,
  legendWidth = defaultLegendWidth,
  flowLegend = false,
): ChartLayout {
  const decadesX = Math.log10(domains.x[1] / domains.x[0]);
  const decadesY = Math.log10(domains.y[1] / domains.y[0]);
  const decadeFor = (room: number) => Math.max(44, Math.min(150, room / decadesX, maxPlotHeight / decadesY));
  const besideDecade = decadeFor(available - margin.left - gutter - legendWidth);
  const belowDecade = decadeFor(available - margin.left - gutter);
  const fits = available - margin.left - gutter - legendWidth >= decadesX * 70;
  const beside = fits && (!flowLegend || besideDecade >= belowDecade * 0.97);
  const decade = beside ? besideDecade : belowDecade;
  const plot = { left: margin.left, top: margin.top, width: decade * decadesX, height: decade * decadesY };
  const plotBottom = plot.top + plot.height + margin.bottom;
  const width = beside
    ? plot.left + plot.width + gutter + legendWidth
    : Math.max(available, plot.left + plot.width + gutter);
  const columns = beside || !flowLegend ? 1 : Math.max(1, Math.floor((width - plot.left) / legendWidth));
  const legendHeight = Math.ceil(legendRows / columns) * LEGEND_ROW + 8;
  const height = beside ? Math.max(plotBottom, plot.top + legendHeight) : plotBottom + legendHeight;
  return {
    width: Math.round(width),
    height: Math.round(height),
    margin: {
      top: plot.top,
      left: plot.left,
      right: width - plot.left - plot.width,
      bottom: height - plot.top - plot.height,
    },
    plot,
    decade,
    legend: beside
      ? { x: plot.left + plot.width + gutter + 8, y: plot.top, width: legendWidth - 8, columns }
      : { x: plot.left, y: plotBottom, width: width - plot.left, columns },
  };
}
