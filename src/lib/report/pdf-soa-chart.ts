import { decadeDomain, engineeringTick, logTicks } from "@/lib/chart/log-axis";
import { factor } from "@/lib/format";
import { computeLimits } from "@/lib/library/limits";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import { contentWidth, type Doc, line, marker, muted, q } from "./pdf-layout";

// The decision report's SOA chart of one candidate (pdfkit): the frozen curves and their derated copies on log-log
// axes with d3-scale's ticks (src/lib/chart/log-axis.ts, as the app's charts), and every pulse by its verdict.

export function soaChart(doc: Doc, snapshot: DecisionSnapshot, partId: string): void {
  const candidate = snapshot.candidates.find((c) => c.partId === partId)!;
  const limits = computeLimits(
    candidate.limits!.soa,
    { tjMax: candidate.limits!.tjMax },
    { caseTemp: snapshot.policy.caseTemp },
  );
  const size = Math.min(contentWidth(doc), 380);
  const x0 = doc.page.margins.left + 40;
  const y0 = doc.y + 6;
  const all = [
    ...limits.curves.flatMap((c) => c.points),
    ...snapshot.pulses.flatMap((p) => (p.v && p.i ? [[p.v, p.i] as [number, number]] : [])),
  ];
  const [vMin, vMax] = decadeDomain(
    all.map((p) => p[0]),
    [1, 100],
  );
  const [iMin, iMax] = decadeDomain(
    all.map((p) => p[1]),
    [0.1, 1000],
  );
  const vDecades = Math.log10(vMax / vMin);
  const iDecades = Math.log10(iMax / iMin);
  const unit = size / Math.max(vDecades, iDecades);
  const w = unit * vDecades;
  const h = unit * iDecades;
  const x = (v: number) => x0 + (Math.log10(v / vMin) / vDecades) * w;
  const y = (i: number) => y0 + h - (Math.log10(i / iMin) / iDecades) * h;
  doc.save();
  const vTicks = logTicks([vMin, vMax]);
  const iTicks = logTicks([iMin, iMax]);
  // One grid rule for both axes: minor lines thin, decades heavier.
  const grid = (ticks: typeof vTicks, ends: (t: number) => [number, number, number, number]) => {
    for (const [list, major] of [
      [ticks.minor, false],
      [ticks.major, true],
    ] as const) {
      for (const t of list) {
        const [ax, ay, bx, by] = ends(t);
        doc
          .moveTo(ax, ay)
          .lineTo(bx, by)
          .lineWidth(major ? 0.6 : 0.2)
          .strokeColor(line)
          .stroke();
      }
    }
  };
  grid(vTicks, (v) => [x(v), y0, x(v), y0 + h]);
  grid(iTicks, (i) => [x0, y(i), x0 + w, y(i)]);
  doc.font("mono").fontSize(7).fillColor(muted);
  for (const v of vTicks.major) {
    doc.text(engineeringTick(v, 1e-3), x(v) - 15, y0 + h + 4, { width: 30, align: "center" });
  }
  for (const i of iTicks.major)
    doc.text(engineeringTick(i, 1e-3), x0 - 34, y(i) - 3, { width: 30, align: "right" });
  doc
    .font("regular")
    .fontSize(8)
    .fillColor(muted)
    .text("V_DS (V)", x0, y0 + h + 16, { width: w, align: "center" });
  doc.text("I_D (A)", x0 - 40, y0 - 12);
  const path = (points: [number, number][]) => {
    points.forEach(([v, i], j) => {
      if (j === 0) doc.moveTo(x(v), y(i));
      else doc.lineTo(x(v), y(i));
    });
  };
  const shades = ["#0a4558", "#1d6f8a", "#3a86a0", "#6aa6ba", "#9cc4d1", "#bcd7df"];
  doc.rect(x0, y0, w, h).clip();
  limits.curves.forEach((curve, k) => {
    const colour = shades[Math.min(k, shades.length - 1)];
    path(curve.points);
    doc.lineWidth(1.2).strokeColor(colour).stroke();
    const derated = limits.derated[k];
    path(derated.points);
    doc.dash(3, { space: 2 }).lineWidth(1).strokeColor(colour).stroke().undash();
  });
  for (const p of snapshot.pulses) {
    if (!p.v || !p.i) continue;
    marker(doc, x(p.v), y(p.i), snapshot.results[partId]?.[p.id]?.verdict ?? "no-data");
  }
  doc.restore();
  // Labels and legend outside the clip.
  limits.curves.forEach((curve, k) => {
    const last = curve.points[curve.points.length - 1];
    const label = curve.duration === "DC" ? "DC" : q(curve.duration, "s");
    doc
      .font("regular")
      .fontSize(7)
      .fillColor(shades[Math.min(k, shades.length - 1)])
      .text(label, Math.min(x(last[0]) + 3, x0 + w + 2), Math.max(y0, Math.min(y(last[1]) - 4, y0 + h - 8)));
  });
  doc.y = y0 + h + 32;
  doc.x = doc.page.margins.left;
  doc
    .font("regular")
    .fontSize(8)
    .fillColor(muted)
    .text(
      `Solid lines: datasheet curves at ${q(limits.refCaseTemp, "°C")} case. Dashed: derated ×${factor(limits.derating)} for ${q(snapshot.policy.caseTemp, "°C")} case. Markers: pulses by verdict (circle pass, triangle marginal, square fail, hollow diamond no data).`,
      { width: contentWidth(doc) },
    );
}
