import type { ColumnDef } from "@tanstack/react-table";
import type { ReactNode } from "react";
import { inUnit, q } from "@/lib/format";
import { verdictWords } from "@/lib/vocabulary";
import { durationName, sortByDuration } from "./chart-model";
import { ChartTable } from "./chart-table";
import type { ChartCurve, SoaChartProps } from "./types";

interface PointRow {
  id: string;
  line: ReactNode;
  v: number;
  i: number;
}

const figure = (value: number) => inUnit(value, 1, 4);

const pointColumns: ColumnDef<PointRow>[] = [
  { id: "line", header: "Line", cell: ({ row }) => row.original.line, meta: { rowHeader: true } },
  {
    id: "v",
    header: () => <HeaderSymbol text="V_DS (V)" />,
    cell: ({ row }) => figure(row.original.v),
    meta: { numeric: true },
  },
  {
    id: "i",
    header: () => <HeaderSymbol text="I_D (A)" />,
    cell: ({ row }) => figure(row.original.i),
    meta: { numeric: true },
  },
  {
    id: "p",
    header: "P (W)",
    cell: ({ row }) => figure(row.original.v * row.original.i),
    meta: { numeric: true },
  },
];

interface Group {
  name: string;
  curve: ChartCurve;
}

/** The chart's text alternative: every point it draws, in a table behind a disclosure. */
export function PointsTable({ title, curves, derated, interpolated, pulses }: SoaChartProps) {
  const groups: Group[] = sortByDuration(curves).map((c) => ({ name: durationName(c.duration), curve: c }));
  if (derated && derated.factor < 1) {
    for (const c of sortByDuration(derated.curves)) {
      groups.push({
        name: `${durationName(c.duration)} at ${q(derated.caseTemp, "°C")}`,
        curve: c,
      });
    }
  }
  if (interpolated) {
    groups.push({
      name: `${durationName(interpolated.width)}, ${interpolated.note ?? "interpolated"}`,
      curve: { duration: interpolated.width, points: interpolated.points },
    });
  }
  const rows: PointRow[] = [
    ...groups.flatMap((g) =>
      g.curve.points.map(([v, i], k) => ({
        id: `${g.name}-${v}`,
        line: k === 0 ? g.name : <span className="sr-only">{g.name}</span>,
        v,
        i,
      })),
    ),
    ...(pulses ?? []).map((p) => ({
      id: p.id,
      line: `${p.label} (${verdictWords[p.verdict]})`,
      v: p.v,
      i: p.i,
    })),
  ];
  return (
    <ChartTable
      className="group min-w-0 flex-1 text-sm"
      summary={
        <>
          Show the chart as a table ({groups.length} lines
          {pulses?.length ? `, ${pulses.length} pulses` : ""})
        </>
      }
      label={`SOA points of ${title}`}
      columns={pointColumns}
      data={rows}
      getRowId={(row) => row.id}
    />
  );
}

function HeaderSymbol({ text }: { text: string }) {
  const match = /^(\w)_(\w+) (.*)$/.exec(text);
  if (!match) return text;
  return (
    <>
      {match[1]}
      <sub>{match[2]}</sub> {match[3]}
    </>
  );
}
