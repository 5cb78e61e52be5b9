import { type Verdict, VerdictGlyph } from "@/components/verdict-shape";
import type { ChartColours } from "./chart-colours";
import { type LimitLine, placePulse, textWidth } from "./chart-model";
import type { Readout } from "./chart-readout";
import { type Axis, linePath, type PlotBox } from "./frame-model";
import { placeLabels } from "./label-layout";
import { OffScaleMark } from "./off-scale-mark";

// Layers that the SOA chart and the overlay chart both lay on the frame: limit lines, their labels at their ends,
// and pulses as verdict-shaped markers held at the edge when off scale.

/**
 * The limit lines as paths (drawn inside the plot's clip); `attributes` adds a line's data attributes. Round caps
 * make the SOA chart's dotted instability boundary a row of dots.
 */
export function LimitLines<L extends LimitLine>({
  lines,
  x,
  y,
  caps = "butt",
  attributes,
}: {
  lines: readonly L[];
  x: Axis;
  y: Axis;
  caps?: "butt" | "round";
  attributes?: (line: L) => Record<`data-${string}`, string | undefined>;
}) {
  return (
    <g fill="none" strokeLinejoin="round" strokeLinecap={caps}>
      {lines.map((line) => (
        <path
          key={line.key}
          d={linePath(line.points, x.scale, y.scale)}
          stroke={line.stroke}
          strokeWidth={line.strokeWidth ?? 1.75}
          strokeDasharray={line.dash}
          {...attributes?.(line)}
        />
      ))}
    </g>
  );
}

/**
 * Each line's label beside its last point, spread so that none overlaps another, with a leader line where a label
 * had to move; a halo in the panel's colour keeps it readable over the grid.
 */
export function EndLabels<L extends LimitLine>({
  lines,
  x,
  y,
  plot,
  colours,
  kindOf,
}: {
  lines: readonly L[];
  x: Axis;
  y: Axis;
  plot: PlotBox;
  colours: ChartColours;
  /** The `data-curve-label` of a line's text, if any. */
  kindOf?: (line: L) => string;
}) {
  const right = plot.left + plot.width;
  const end = (line: L) => line.points[line.points.length - 1];
  const labels = placeLabels(
    lines.map((line) => {
      const [v, i] = end(line);
      return {
        key: line.key,
        x: Math.min(x.scale(v), right) + 5,
        y: y.scale(i),
        width: textWidth(line.label),
      };
    }),
    plot.top + 4,
    plot.top + plot.height - 4,
  );
  return (
    <g data-layer="labels" fontSize={11}>
      {labels.map((label) => {
        const line = lines.find((l) => l.key === label.key)!;
        const [v, i] = end(line);
        const moved = Math.abs(label.placedY - y.scale(i)) > 3;
        return (
          <g key={label.key}>
            {moved ? (
              <line
                x1={Math.min(x.scale(v), right)}
                y1={y.scale(i)}
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
              data-curve-label={kindOf?.(line)}
            >
              {line.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}

export interface PulseMarkItem {
  id: string;
  v: number;
  i: number;
  verdict: Verdict;
}

/**
 * Pulses at (V, I) in their verdict's shape; a pulse beyond the axes is held at the edge with an arrow and its
 * value. Hovering one shows `readoutOf` its pulse at the place drawn.
 */
export function PulseMarks<P extends PulseMarkItem>({
  pulses,
  x,
  y,
  plot,
  colours,
  size,
  readoutOf,
  onReadout,
}: {
  pulses: readonly P[];
  x: Axis;
  y: Axis;
  plot: PlotBox;
  colours: ChartColours;
  size: number;
  readoutOf: (pulse: P, off: boolean) => Omit<Readout, "left" | "top">;
  onReadout: (readout: Readout | null) => void;
}) {
  const domains = { x: x.domain, y: y.domain };
  return (
    <g data-layer="pulses">
      {pulses.map((pulse) => {
        const at = placePulse(pulse, domains);
        const off = at.off.v || at.off.i;
        const px = x.scale(at.v);
        const py = y.scale(at.i);
        return (
          <g
            key={pulse.id}
            data-pulse={pulse.id}
            data-off-scale={off ? "true" : undefined}
            onPointerEnter={() => onReadout({ left: px, top: py, ...readoutOf(pulse, off) })}
            onPointerLeave={() => onReadout(null)}
          >
            <VerdictGlyph verdict={pulse.verdict} x={px} y={py} size={size} />
            {off ? (
              <OffScaleMark
                x={px}
                y={py}
                right={at.off.v && pulse.v > at.v}
                up={at.off.i && pulse.i > at.i}
                horizontal={at.off.v}
                vertical={at.off.i}
                text={`${at.offScale} off scale`}
                plot={plot}
                colour={colours.ink}
              />
            ) : null}
          </g>
        );
      })}
    </g>
  );
}
