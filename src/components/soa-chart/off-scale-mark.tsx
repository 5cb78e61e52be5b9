import { textWidth } from "./chart-model";

/** A 12 px arrow starting 7 px from (x, y) in the direction (dx, dy), with a 4 px head. */
function arrow(x: number, y: number, dx: number, dy: number): string {
  const length = Math.hypot(dx, dy) || 1;
  const [ux, uy] = [dx / length, dy / length];
  const [sx, sy] = [x + ux * 7, y + uy * 7];
  const [ex, ey] = [sx + ux * 12, sy + uy * 12];
  const [px, py] = [-uy, ux];
  const head = (side: number) =>
    `M${ex},${ey} L${ex - ux * 4 + px * 4 * side},${ey - uy * 4 + py * 4 * side}`;
  return `M${sx},${sy} L${ex},${ey} ${head(1)} ${head(-1)}`;
}

/** An arrow from a pulse held at the edge toward where it really lies, with its value, kept inside the plot. */
export function OffScaleMark({
  x,
  y,
  right,
  up,
  horizontal,
  vertical,
  text,
  plot,
  colour,
}: {
  x: number;
  y: number;
  right: boolean;
  up: boolean;
  horizontal: boolean;
  vertical: boolean;
  text: string;
  plot: { left: number; top: number; width: number; height: number };
  colour: string;
}) {
  const dx = horizontal ? (right ? 1 : -1) : 0;
  const dy = vertical ? (up ? -1 : 1) : 0;
  const width = textWidth(text);
  const labelX = Math.min(plot.left + plot.width - width - 2, Math.max(plot.left + 2, x - width / 2));
  const labelY = Math.min(
    plot.top + plot.height - 6,
    Math.max(plot.top + 12, y + (dy === 0 ? -12 : -dy * 16)),
  );
  return (
    <g data-off-scale-mark>
      <path d={arrow(x, y, dx, dy)} stroke={colour} strokeWidth={1.5} fill="none" />
      <text
        x={labelX}
        y={labelY}
        fontSize={11}
        fill={colour}
        stroke="var(--color-panel)"
        strokeWidth={3}
        paintOrder="stroke"
      >
        {text}
      </text>
    </g>
  );
}
