import { VerdictGlyph } from "@/components/verdict-shape";
import { factor, q } from "@/lib/format";
import type { Verdict } from "@/lib/soa/types";
import { verdictWords } from "@/lib/vocabulary";
import type { ChartColours } from "./chart-colours";
import { type ChartLine, DERATED_DASH, LEGEND_ROW } from "./chart-model";
import type { SoaChartProps } from "./types";

export interface LegendRow {
  key: string;
  text: string;
  swatch:
    | { kind: "line"; stroke: string; dash?: string; width: number }
    | { kind: "finding" }
    | { kind: "verdict"; verdict: Verdict }
    | { kind: "heading" };
}

/** The legend in words, row by row: every line, the dashed and interpolated lines, findings and verdicts. */
export function legendRows(props: SoaChartProps, lines: ChartLine[], colours: ChartColours): LegendRow[] {
  const ref = q(props.refCaseTemp ?? 25, "°C");
  const rows: LegendRow[] = [{ key: "h", text: `Single pulse, T_C = ${ref}`, swatch: { kind: "heading" } }];
  for (const line of lines.filter((l) => l.kind === "curve")) {
    rows.push({
      key: line.key,
      text: line.duration === "DC" ? "DC (continuous)" : line.name,
      swatch: { kind: "line", stroke: line.stroke, width: line.strokeWidth },
    });
  }
  if (lines.some((l) => l.kind === "derated") && props.derated) {
    rows.push({
      key: "derated",
      text: `Dashed: at T_C = ${q(props.derated.caseTemp, "°C")} (×${factor(props.derated.factor)})`,
      swatch: { kind: "line", stroke: colours.inkMuted, dash: DERATED_DASH, width: 1.5 },
    });
  }
  const interpolated = lines.find((l) => l.kind === "interpolated");
  if (interpolated) {
    rows.push({
      key: "interpolated",
      text: interpolated.name,
      swatch: {
        kind: "line",
        stroke: interpolated.stroke,
        dash: interpolated.dash,
        width: interpolated.strokeWidth,
      },
    });
  }
  const instability = lines.find((l) => l.kind === "instability");
  if (instability) {
    rows.push({
      key: "instability",
      text: `${instability.name}: S = 1`,
      swatch: {
        kind: "line",
        stroke: instability.stroke,
        dash: instability.dash,
        width: instability.strokeWidth,
      },
    });
  }
  if (props.findings?.length) {
    rows.push({ key: "finding", text: "Finding (numbered as listed)", swatch: { kind: "finding" } });
  }
  const verdicts = new Set((props.pulses ?? []).map((p) => p.verdict));
  for (const verdict of ["pass", "marginal", "fail", "no-data"] as const) {
    if (verdicts.has(verdict)) {
      rows.push({
        key: verdict,
        text: `Pulse: ${verdictWords[verdict]}`,
        swatch: { kind: "verdict", verdict },
      });
    }
  }
  return rows;
}

/** "T_C" in a legend text becomes T with a subscript C. */
function LegendText({ text }: { text: string }) {
  const parts = text.split("T_C");
  return (
    <>
      {parts.map((part, k) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: the pieces of one fixed string, never reordered
        <tspan key={k}>
          {k > 0 ? (
            <>
              T
              <tspan dy={3} fontSize="0.78em">
                C
              </tspan>
              <tspan dy={-3}>{part}</tspan>
            </>
          ) : (
            part
          )}
        </tspan>
      ))}
    </>
  );
}

export function ChartLegend({
  rows,
  x,
  y,
  colours,
  columns = 1,
  columnWidth = 0,
}: {
  rows: LegendRow[];
  x: number;
  y: number;
  colours: ChartColours;
  columns?: number;
  columnWidth?: number;
}) {
  const perColumn = Math.ceil(rows.length / Math.max(1, columns));
  return (
    <g data-layer="legend" fontSize={11} transform={`translate(${x} ${y})`}>
      {rows.map((row, k) => {
        const cy = (k % perColumn) * LEGEND_ROW + 9;
        const s = row.swatch;
        return (
          <g
            key={row.key}
            transform={k >= perColumn ? `translate(${Math.floor(k / perColumn) * columnWidth} 0)` : undefined}
          >
            {s.kind === "line" ? (
              <line
                x1={0}
                x2={22}
                y1={cy}
                y2={cy}
                stroke={s.stroke}
                strokeWidth={s.width}
                strokeDasharray={s.dash}
              />
            ) : null}
            {s.kind === "finding" ? <FindingMark x={11} y={cy} label="1" colours={colours} /> : null}
            {s.kind === "verdict" ? <VerdictGlyph verdict={s.verdict} x={11} y={cy} size={8} /> : null}
            <text
              x={s.kind === "heading" ? 0 : 30}
              y={cy + 4}
              fill={s.kind === "heading" ? colours.ink : colours.inkMuted}
              fontWeight={s.kind === "heading" ? 600 : 400}
            >
              <LegendText text={row.text} />
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** A finding's marker: a numbered ring, unlike any verdict shape. */
export function FindingMark({
  x,
  y,
  label,
  colours,
}: {
  x: number;
  y: number;
  label: string;
  colours: ChartColours;
}) {
  return (
    <g>
      <circle cx={x} cy={y} r={7} fill={colours.panel} stroke={colours.ink} strokeWidth={1.3} />
      <text x={x} y={y + 3.2} textAnchor="middle" fontSize={9} fontWeight={600} fill={colours.ink}>
        {label}
      </text>
    </g>
  );
}
