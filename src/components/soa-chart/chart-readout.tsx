import type { ReactNode } from "react";
import { q } from "@/lib/format";
import { type Axis, snapToLine } from "./frame-model";

export interface Readout {
  /** Pointer position inside the chart's frame, in px. */
  left: number;
  top: number;
  title?: string;
  rows: { label: ReactNode; value: string }[];
}

/** The hover box: what lies under the pointer, in engineering units. Not part of an export. */
export function ReadoutBox({ readout, frameWidth }: { readout: Readout; frameWidth: number }) {
  const flip = readout.left > frameWidth - 200;
  return (
    <div
      role="status"
      aria-live="polite"
      data-testid="chart-readout"
      className="pointer-events-none absolute z-10 min-w-36 rounded-md border border-line-strong bg-panel px-2.5 py-1.5 text-xs shadow-sm"
      style={{
        top: readout.top + 14,
        left: flip ? undefined : readout.left + 14,
        right: flip ? frameWidth - readout.left + 14 : undefined,
      }}
    >
      {readout.title ? <p className="mb-0.5 max-w-64 font-medium text-ink">{readout.title}</p> : null}
      <dl className="grid grid-cols-[auto_auto] gap-x-3">
        {readout.rows.map((row, k) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: rows of one readout, rebuilt on every move
          <div key={k} className="contents">
            <dt className="text-ink-muted">{row.label}</dt>
            <dd className="num text-right font-mono text-ink">{row.value}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

export const Sym = {
  vds: (
    <>
      V<sub>DS</sub>
    </>
  ),
  id: (
    <>
      I<sub>D</sub>
    </>
  ),
  p: <>P = V·I</>,
};

/**
 * The readout at pixel (px, py) of a chart of drain current against drain-source voltage: V and I there, the
 * current read off the limit line within snapping distance (named in the title), and with `power` their product.
 */
export function limitReadout<L extends { name: string; points: [number, number][] }>(
  lines: readonly L[],
  { px, py }: { px: number; py: number },
  x: Axis,
  y: Axis,
  power: boolean,
): Readout {
  const v = x.scale.invert(px);
  const nearest = snapToLine(lines, v, py, y.scale);
  const i = nearest ? nearest.current : y.scale.invert(py);
  return {
    left: px,
    top: nearest ? y.scale(nearest.current) : py,
    title: nearest ? `${nearest.line.name} limit` : undefined,
    rows: [
      { label: Sym.vds, value: q(v, "V") },
      { label: Sym.id, value: q(i, "A") },
      ...(power ? [{ label: Sym.p, value: q(v * i, "W") }] : []),
    ],
  };
}
