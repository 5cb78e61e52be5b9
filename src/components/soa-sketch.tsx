import { type Verdict, VerdictGlyph } from "./verdict-shape";

/**
 * A static log-log SOA sketch for the landing page: limit lines of an invented part (R_DS(on) line, package limit,
 * constant-power lines per pulse width, V_DSS) and three pulses in verdict shapes. Illustration only.
 */
const size = { w: 360, h: 300, left: 44, bottom: 34, top: 12, right: 16 };
const vDecades = [1, 100] as const; // 1 V … 100 V
const iDecades = [0.1, 1000] as const; // 0.1 A … 1 kA

const plotW = size.w - size.left - size.right;
const plotH = size.h - size.top - size.bottom;
const x = (v: number) =>
  size.left + (Math.log10(v / vDecades[0]) / Math.log10(vDecades[1] / vDecades[0])) * plotW;
const y = (i: number) =>
  size.top + plotH - (Math.log10(i / iDecades[0]) / Math.log10(iDecades[1] / iDecades[0])) * plotH;

const rdsOn = 0.004;
const iPackage = 300;
const vdss = 80;
const widths: { label: string; power: number }[] = [
  { label: "100 µs", power: 3000 },
  { label: "1 ms", power: 900 },
  { label: "10 ms", power: 260 },
  { label: "DC", power: 75 },
];

function limitPath(power: number): string {
  const points: [number, number][] = [];
  for (let k = 0; k <= 60; k++) {
    const v = 10 ** (Math.log10(vDecades[0]) + (k / 60) * Math.log10(vdss / vDecades[0]));
    points.push([v, Math.min(v / rdsOn, iPackage, power / v)]);
  }
  points.push([vdss, iDecades[0]]);
  return points.map(([v, i], k) => `${k === 0 ? "M" : "L"}${x(v).toFixed(1)},${y(i).toFixed(1)}`).join(" ");
}

const pulses: { v: number; i: number; verdict: Verdict; label: string }[] = [
  { v: 48, i: 3, verdict: "pass", label: "pre-charge, 40 ms" },
  { v: 40, i: 16, verdict: "marginal", label: "overload, 1 ms" },
  { v: 52, i: 60, verdict: "fail", label: "short, 1 ms" },
];

export function SoaSketch() {
  const vTicks = [1, 10, 100];
  const iTicks = [0.1, 1, 10, 100, 1000];
  const minor = (decades: readonly [number, number]) => {
    const out: number[] = [];
    for (let d = decades[0]; d < decades[1]; d *= 10) for (let m = 2; m <= 9; m++) out.push(d * m);
    return out;
  };
  const shades = ["#0a4558", "#1d6f8a", "#4a95ad", "#8bbccb"];
  return (
    <svg
      viewBox={`0 0 ${size.w} ${size.h}`}
      className="h-auto w-full"
      role="img"
      aria-labelledby="soa-sketch-title"
    >
      <title id="soa-sketch-title">
        Sketch of a log-log SOA chart: limit lines for 100 µs, 1 ms, 10 ms and DC, with three pulses marked
        pass, marginal and fail.
      </title>
      <rect x={size.left} y={size.top} width={plotW} height={plotH} fill="var(--color-panel)" />
      {minor(vDecades).map((v) => (
        <line
          key={`vm${v}`}
          x1={x(v)}
          x2={x(v)}
          y1={size.top}
          y2={size.top + plotH}
          stroke="var(--color-line)"
          strokeWidth={0.5}
        />
      ))}
      {minor(iDecades).map((i) => (
        <line
          key={`im${i}`}
          x1={size.left}
          x2={size.left + plotW}
          y1={y(i)}
          y2={y(i)}
          stroke="var(--color-line)"
          strokeWidth={0.5}
        />
      ))}
      {vTicks.map((v) => (
        <g key={`v${v}`}>
          <line x1={x(v)} x2={x(v)} y1={size.top} y2={size.top + plotH} stroke="var(--color-line-strong)" />
          <text
            x={x(v)}
            y={size.top + plotH + 14}
            textAnchor="middle"
            fontSize={10}
            fill="var(--color-ink-muted)"
          >
            {v}
          </text>
        </g>
      ))}
      {iTicks.map((i) => (
        <g key={`i${i}`}>
          <line x1={size.left} x2={size.left + plotW} y1={y(i)} y2={y(i)} stroke="var(--color-line-strong)" />
          <text x={size.left - 6} y={y(i) + 3} textAnchor="end" fontSize={10} fill="var(--color-ink-muted)">
            {i >= 1000 ? `${i / 1000}k` : i}
          </text>
        </g>
      ))}
      <text
        x={size.left + plotW / 2}
        y={size.h - 4}
        textAnchor="middle"
        fontSize={10}
        fill="var(--color-ink-muted)"
      >
        V_DS (V)
      </text>
      <text
        x={10}
        y={size.top + plotH / 2}
        textAnchor="middle"
        fontSize={10}
        fill="var(--color-ink-muted)"
        transform={`rotate(-90 10 ${size.top + plotH / 2})`}
      >
        I_D (A)
      </text>
      <clipPath id="soa-sketch-clip">
        <rect x={size.left} y={size.top} width={plotW} height={plotH} />
      </clipPath>
      <g clipPath="url(#soa-sketch-clip)">
        {widths.map((w, k) => (
          <path key={w.label} d={limitPath(w.power)} fill="none" stroke={shades[k]} strokeWidth={1.6} />
        ))}
      </g>
      {widths.map((w, k) => {
        const v = Math.min(vdss * 0.62, w.power / 40);
        return (
          <text key={`l${w.label}`} x={x(v) + 4} y={y(w.power / v) - 4} fontSize={9} fill={shades[k]}>
            {w.label}
          </text>
        );
      })}
      {pulses.map((p) => (
        <VerdictGlyph key={p.label} verdict={p.verdict} x={x(p.v)} y={y(p.i)} size={9} />
      ))}
    </svg>
  );
}
