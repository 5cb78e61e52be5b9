"use client";

import { useMemo } from "react";
import { decadeDomain } from "@/lib/chart/log-axis";
import { type FosterTerm, zth } from "@/lib/soa/foster";
import { useChartColours } from "./chart-colours";
import { ChartFrame, PlotArea } from "./chart-frame";
import { linePath, plotAxes } from "./frame-model";

const samplesPerDecade = 30;
const margin = { top: 10, left: 52, bottom: 44, right: 16 };

/** The Foster network's Z_th sampled evenly in log t over whole decades around its time constants or points. */
function zthSeries(terms: FosterTerm[], points: [number, number][]) {
  const taus = terms.map((t) => t.tau).filter((t) => t > 0);
  const ts = points.length ? points.map(([t]) => t) : [Math.min(...taus) / 10, Math.max(...taus) * 10];
  const tDomain = decadeDomain(ts, [1e-6, 10], 2);
  const decades = Math.log10(tDomain[1] / tDomain[0]);
  const line: [number, number][] = [];
  for (let k = 0; k <= decades * samplesPerDecade; k++) {
    const t = tDomain[0] * 10 ** (k / samplesPerDecade);
    line.push([t, zth(terms, t)]);
  }
  const zs = [...points.map(([, z]) => z), ...line.map(([, z]) => z).filter((z) => z > 0)];
  const top = Math.max(...zs);
  // Z_th spans many decades at tiny t; two decades below the steady state is what a reader needs.
  const zDomain = decadeDomain(
    zs.filter((z) => z >= top / 300),
    [0.001, 1],
    2,
  );
  return { tDomain, zDomain, line: line.filter(([, z]) => z > 0) };
}

/**
 * The thermal model's Z_th(t) on log-log axes (square decades, like the SOA chart): the Foster network as a
 * line, and the points it was fitted to, if any, as rings.
 */
export function ZthChart({
  terms,
  points = [],
  maxWidth = 420,
}: {
  terms: FosterTerm[];
  points?: [number, number][];
  maxWidth?: number;
}) {
  const colours = useChartColours();
  const { tDomain, zDomain, line } = useMemo(() => zthSeries(terms, points), [terms, points]);
  const decadesT = Math.log10(tDomain[1] / tDomain[0]);
  const decadesZ = Math.log10(zDomain[1] / zDomain[0]);
  const decade = Math.min(56, (maxWidth - margin.left - margin.right) / decadesT);
  const plot = { left: margin.left, top: margin.top, width: decade * decadesT, height: decade * decadesZ };
  const { x, y } = plotAxes(
    plot,
    { kind: "log", domain: tDomain, plainFrom: 1 },
    { kind: "log", domain: zDomain, plainFrom: 0.001, clamp: true },
  );
  return (
    <ChartFrame
      width={plot.left + plot.width + margin.right}
      height={plot.top + plot.height + margin.bottom}
      label="Thermal impedance Z_th against time, log-log"
      testId="zth-chart"
      scalable
    >
      <PlotArea
        plot={plot}
        x={x}
        y={y}
        xTitle="t (s)"
        yTitle={
          <>
            Z
            <tspan dy={3} fontSize="0.78em">
              th
            </tspan>
            <tspan dy={-3}> (K/W)</tspan>
          </>
        }
        clipped={
          <>
            {points.map(([t, z]) => (
              <circle
                key={t}
                cx={x.scale(t)}
                cy={y.scale(z)}
                r={3}
                fill={colours.panel}
                stroke={colours.inkMuted}
                strokeWidth={1.2}
              />
            ))}
            <path
              d={linePath(line, x.scale, y.scale)}
              fill="none"
              stroke={colours.accentStrong}
              strokeWidth={1.75}
              data-series="foster"
            />
          </>
        }
      />
    </ChartFrame>
  );
}
