import { verdictWords } from "@/lib/vocabulary";

export type Verdict = "pass" | "marginal" | "fail" | "no-data";

const colour: Record<Verdict, string> = {
  pass: "var(--color-pass)",
  marginal: "var(--color-marginal)",
  fail: "var(--color-fail)",
  "no-data": "var(--color-nodata)",
};

/** A verdict's shape in SVG coordinates: pass filled circle, marginal filled triangle, fail filled square, no data hollow diamond. */
export function VerdictGlyph({
  verdict,
  x,
  y,
  size = 10,
}: {
  verdict: Verdict;
  x: number;
  y: number;
  size?: number;
}) {
  const r = size / 2;
  const fill = colour[verdict];
  switch (verdict) {
    case "pass":
      return <circle cx={x} cy={y} r={r} fill={fill} />;
    case "marginal":
      return (
        <polygon
          points={`${x},${y - r * 1.1} ${x + r * 1.1},${y + r * 0.9} ${x - r * 1.1},${y + r * 0.9}`}
          fill={fill}
        />
      );
    case "fail":
      return <rect x={x - r * 0.9} y={y - r * 0.9} width={r * 1.8} height={r * 1.8} fill={fill} />;
    case "no-data":
      return (
        <polygon
          points={`${x},${y - r * 1.2} ${x + r * 1.2},${y} ${x},${y + r * 1.2} ${x - r * 1.2},${y}`}
          fill="none"
          stroke={fill}
          strokeWidth={1.5}
        />
      );
  }
}

/** A verdict as a word with its shape: never colour alone. */
export function VerdictBadge({ verdict }: { verdict: Verdict }) {
  return (
    <span className="inline-flex items-center gap-1.5 text-sm" style={{ color: colour[verdict] }}>
      <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true">
        <VerdictGlyph verdict={verdict} x={6} y={6} size={9} />
      </svg>
      <span className="font-medium">{verdictWords[verdict]}</span>
    </span>
  );
}
