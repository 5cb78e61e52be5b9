import { ScrollRegion } from "@/components/scroll-region";
import { formatQuantity } from "@/lib/soa/units";
import { durationName, sortByDuration } from "./chart-model";
import type { ChartCurve, SoaChartProps } from "./types";

const verdictWords = { pass: "pass", marginal: "marginal", fail: "fail", "no-data": "no data" } as const;

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
        name: `${durationName(c.duration)} at ${formatQuantity(derated.caseTemp, "°C")}`,
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
  return (
    <details className="group min-w-0 flex-1 text-sm">
      <summary className="cursor-pointer text-ink-muted select-none hover:text-ink">
        Show the chart as a table ({groups.length} lines
        {pulses?.length ? `, ${pulses.length} pulses` : ""})
      </summary>
      <ScrollRegion className="mt-2 max-h-80 overflow-auto rounded-md border border-line bg-panel">
        <table
          className="w-full border-separate border-spacing-0 text-xs"
          aria-label={`SOA points of ${title}`}
        >
          <thead>
            <tr>
              {["Line", "V_DS (V)", "I_D (A)", "P (W)"].map((h, k) => (
                <th
                  key={h}
                  scope="col"
                  className={`sticky top-0 border-b border-line bg-sunken px-2 py-1.5 font-medium text-ink-muted ${k ? "text-right" : "text-left"}`}
                >
                  {h === "Line" ? h : <HeaderSymbol text={h} />}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {groups.flatMap((g) =>
              g.curve.points.map(([v, i], k) => (
                <tr key={`${g.name}-${v}`}>
                  <th scope="row" className="border-b border-line px-2 py-1 text-left font-normal">
                    {k === 0 ? g.name : <span className="sr-only">{g.name}</span>}
                  </th>
                  <Num value={v} />
                  <Num value={i} />
                  <Num value={v * i} />
                </tr>
              )),
            )}
            {(pulses ?? []).map((p) => (
              <tr key={p.id}>
                <th scope="row" className="border-b border-line px-2 py-1 text-left font-normal">
                  {p.label} ({verdictWords[p.verdict]})
                </th>
                <Num value={p.v} />
                <Num value={p.i} />
                <Num value={p.v * p.i} />
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </details>
  );
}

function Num({ value }: { value: number }) {
  return (
    <td className="num border-b border-line px-2 py-1 text-right font-mono">
      {Number(value.toPrecision(4))}
    </td>
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
