import { scaleLinear, scaleLog } from "d3-scale";
import { engineeringTick, logTicks } from "@/lib/chart/log-axis";
import { interpolateCurve } from "@/lib/soa/interpolate-curve";

// The pure part of the one chart frame (chart-frame.tsx): an axis as data, its d3 scale and its ticks, the path of
// a line through its points, and which line the pointer is on. Every log-log and time chart goes through these.

export type Scale = ((value: number) => number) & { invert(pixel: number): number };

export interface PlotBox {
  left: number;
  top: number;
  width: number;
  height: number;
}

export interface AxisSpec {
  /** A log axis has majors at decades and minors at 2…9 of each; a linear one its d3 ticks, all minor-weight. */
  kind: "log" | "linear";
  domain: [number, number];
  /** Log labels: values from here up to 1000 written plainly ("0.1", "1", "100"), prefixed beyond. */
  plainFrom?: number;
  /** Linear labels (the tick value as it is when absent). */
  format?: (value: number) => string;
  /** About how many linear ticks. */
  count?: number;
  /** Linear: widen the domain to round tick values. */
  nice?: boolean;
  /** Hold values outside the domain at its edge. */
  clamp?: boolean;
  /** Draw no tick labels on this axis (a panel stacked above another that labels the shared axis). */
  unlabelled?: boolean;
}

export interface Axis extends AxisSpec {
  scale: Scale;
}

export interface AxisTicks {
  /** Drawn as strong grid lines with a 5 px tick outside, labelled. */
  major: { value: number; label: string }[];
  /** Drawn as faint grid lines (with a 3 px tick outside on a log axis). */
  minor: number[];
}

/** The axis with its d3 scale over a pixel range (x: left to right; y: bottom to top). */
export function makeAxis(spec: AxisSpec, range: [number, number]): Axis {
  const scale =
    spec.kind === "log"
      ? scaleLog()
          .domain(spec.domain)
          .range(range)
          .clamp(spec.clamp === true)
      : scaleLinear()
          .domain(spec.domain)
          .range(range)
          .clamp(spec.clamp === true);
  if (spec.kind === "linear" && spec.nice) (scale as ReturnType<typeof scaleLinear<number>>).nice();
  return { ...spec, domain: scale.domain() as [number, number], scale };
}

/** x across the plot and y up it, for one plot box. */
export function plotAxes(plot: PlotBox, x: AxisSpec, y: AxisSpec): { x: Axis; y: Axis } {
  return {
    x: makeAxis(x, [plot.left, plot.left + plot.width]),
    y: makeAxis(y, [plot.top + plot.height, plot.top]),
  };
}

/**
 * Where an axis is ticked and what its labels say: decades and 2…9 of each from the log-axis module on a log axis;
 * on a linear axis d3's round ticks, drawn faint like a log axis's minor lines but labelled.
 */
export function axisTicks(spec: AxisSpec): AxisTicks {
  if (spec.kind === "log") {
    const { major, minor } = logTicks(spec.domain);
    return { major: major.map((value) => ({ value, label: engineeringTick(value, spec.plainFrom) })), minor };
  }
  const values = scaleLinear()
    .domain(spec.domain)
    .ticks(spec.count ?? 10);
  const format = spec.format ?? ((value: number) => String(value));
  return { major: values.map((value) => ({ value, label: format(value) })), minor: [] };
}

/** An SVG path through the points, to a tenth of a pixel. */
export function linePath(points: readonly (readonly [number, number])[], x: Scale, y: Scale): string {
  return points.map(([a, b], k) => `${k ? "L" : "M"}${x(a).toFixed(1)},${y(b).toFixed(1)}`).join("");
}

/** How close (px, vertically) the pointer must be to a limit line for the readout to read that line. */
export const SNAP_DISTANCE = 10;

/**
 * The limit line under the pointer: of the lines defined at voltage `v` (read between their points, never beyond
 * their ends), the one whose current lies nearest to pixel row `py`, if within `SNAP_DISTANCE`.
 */
export function snapToLine<L extends { points: [number, number][] }>(
  lines: readonly L[],
  v: number,
  py: number,
  y: Scale,
): { line: L; current: number } | null {
  let nearest: { line: L; current: number; distance: number } | null = null;
  for (const line of lines) {
    const read = interpolateCurve(line.points, v);
    if (read.current === null || read.flag !== null) continue;
    const distance = Math.abs(y(read.current) - py);
    if (distance <= SNAP_DISTANCE && (!nearest || distance < nearest.distance)) {
      nearest = { line, current: read.current, distance };
    }
  }
  return nearest ? { line: nearest.line, current: nearest.current } : null;
}
