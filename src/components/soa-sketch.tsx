"use client";

import { decadeDomain } from "@/lib/chart/log-axis";
import { ChartFrame, SoaPlotArea } from "./soa-chart/chart-frame";
import { linePath, type PlotBox, plotAxes } from "./soa-chart/frame-model";
import { type Verdict, VerdictGlyph } from "./verdict-shape";

/**
 * A static log-log SOA sketch for the landing page: limit lines of an invented part (R_DS(on) line, package limit,
 * constant-power lines per pulse width, V_DSS) and three pulses in verdict shapes. Illustration only, drawn through
 * the one chart frame (axes, decades and minor grid from the shared log-axis module).
 */
const size = { w: 360, h: 310 };
const plot: PlotBox = { left: 52, top: 12, width: 292, height: 254 };

const rdsOn = 0.004;
const iPackage = 300;
const vdss = 80;
const widths: { label: string; power: number }[] = [
  { label: "100 µs", power: 3000 },
  { label: "1 ms", power: 900 },
  { label: "10 ms", power: 260 },
  { label: "DC", power: 75 },
];
const shades = ["#0a4558", "#1d6f8a", "#4a95ad", "#8bbccb"];

/** One width's limit line from 1 V to V_DSS: the least of the R_DS(on) line, the package limit and its power. */
function limitPoints(power: number): [number, number][] {
  const points: [number, number][] = [];
  for (let k = 0; k <= 60; k++) {
    const v = 10 ** ((k / 60) * Math.log10(vdss));
    points.push([v, Math.min(v / rdsOn, iPackage, power / v)]);
  }
  return points;
}

const pulses: { v: number; i: number; verdict: Verdict; label: string }[] = [
  { v: 48, i: 3, verdict: "pass", label: "pre-charge, 40 ms" },
  { v: 40, i: 16, verdict: "marginal", label: "overload, 1 ms" },
  { v: 52, i: 60, verdict: "fail", label: "short, 1 ms" },
];

const lines = widths.map((w) => limitPoints(w.power));
const all = lines.flat();
const vDomain = decadeDomain(
  all.map((p) => p[0]),
  [1, 100],
);
const iDomain = decadeDomain(
  all.map((p) => p[1]),
  [0.1, 1000],
);
const axes = plotAxes(plot, { kind: "log", domain: vDomain }, { kind: "log", domain: iDomain });

export function SoaSketch() {
  const { x, y } = axes;
  return (
    <ChartFrame
      width={size.w}
      height={size.h}
      scalable
      className="w-full"
      label="Sketch of a log-log SOA chart: limit lines for 100 µs, 1 ms, 10 ms and DC, with three pulses marked pass, marginal and fail."
      testId="soa-sketch"
    >
      <SoaPlotArea
        plot={plot}
        x={x}
        y={y}
        clipped={widths.map((w, k) => (
          <path
            key={w.label}
            // Each line falls to the bottom of the plot at V_DSS.
            d={linePath([...lines[k], [vdss, iDomain[0]]], x.scale, y.scale)}
            fill="none"
            stroke={shades[k]}
            strokeWidth={1.6}
          />
        ))}
        above={
          <>
            {widths.map((w, k) => {
              const v = Math.min(vdss * 0.62, w.power / 40);
              return (
                <text
                  key={`l${w.label}`}
                  x={x.scale(v) + 4}
                  y={y.scale(w.power / v) - 4}
                  fontSize={10}
                  fill={shades[k]}
                >
                  {w.label}
                </text>
              );
            })}
            {pulses.map((p) => (
              <VerdictGlyph key={p.label} verdict={p.verdict} x={x.scale(p.v)} y={y.scale(p.i)} size={9} />
            ))}
          </>
        }
      />
    </ChartFrame>
  );
}
