import path from "node:path";
import PDFDocument from "pdfkit";
import { engineeringTick, logTicks } from "@/lib/chart/log-axis";
import { computeLimits } from "@/lib/library/limits";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import { CAUTION, explainFlag, VERDICT_EXPLANATIONS } from "@/lib/soa/explain";
import { revisionOf } from "@/lib/soa/revision";
import { formatTemperature } from "@/lib/soa/sanity";
import type { PulseResult, Verdict } from "@/lib/soa/types";
import { formatQuantity } from "@/lib/soa/units";

const BETWEEN_WORDS = {
  loglog: "log-log interpolation between the neighbouring curves (may overstate by a few per cent)",
  "next-longer": "the next longer curve",
  thermal: "the next shorter curve scaled by the thermal model, Zth(tk)/Zth(t) (next longer without one)",
} as const;

// The decision report: one PDF, drawn from the decision's frozen snapshot only, so the record reads the same
// however the library or the project change later. Fonts ship with the app (no system font is assumed).

const fontDir = path.join(process.cwd(), "src/lib/report/fonts");
const fonts = {
  regular: path.join(fontDir, "Geist-Regular.ttf"),
  bold: path.join(fontDir, "Geist-SemiBold.ttf"),
  mono: path.join(fontDir, "GeistMono-Regular.ttf"),
};

const ink = "#23272b";
const muted = "#5d656d";
const line = "#c5cacd";
const accent = "#0f5a73";
const verdictColour: Record<Verdict, string> = {
  pass: "#1f7a3d",
  marginal: "#b26a00",
  fail: "#b3261e",
  "no-data": "#6b7278",
};
const verdictWord: Record<Verdict, string> = {
  pass: "pass",
  marginal: "marginal",
  fail: "fail",
  "no-data": "no data",
};

export interface ReportDecision {
  chosenLabel: string;
  chosenPartId: string | null;
  rationale: string;
  signedByName: string;
  signedAt: Date;
  supersededAt: Date | null;
}

type Doc = PDFKit.PDFDocument;

const pct = (u: number | null) => (u === null ? "—" : `${(u * 100).toFixed(0)} %`);
// The shipped font has no thin space (U+2009): the PDF sets a plain space between number and unit.
const fq = (v: number, unit: Parameters<typeof formatQuantity>[1]) =>
  (unit === "°C" ? formatTemperature(v) : formatQuantity(v, unit)).replace(/\u2009/g, " ");
const q = (v: number | null | undefined, unit: Parameters<typeof formatQuantity>[1]) =>
  v === null || v === undefined ? "—" : fq(v, unit);
const stamp = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

/** Renders the decision record as a PDF and resolves to its bytes. */
export function renderDecisionPdf(input: {
  decision: ReportDecision;
  snapshot: DecisionSnapshot;
}): Promise<Buffer> {
  const { decision, snapshot } = input;
  const doc = new PDFDocument({
    size: "A4",
    bufferPages: true,
    margins: { top: 48, bottom: 56, left: 48, right: 48 },
    font: fonts.regular,
    info: {
      Title: `Decision record: ${snapshot.project.name}`,
      Author: decision.signedByName,
      Creator: "Pulsefence",
    },
  });
  doc.registerFont("regular", fonts.regular);
  doc.registerFont("bold", fonts.bold);
  doc.registerFont("mono", fonts.mono);
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  header(doc, snapshot, decision);
  section(doc, "Decision");
  doc.font("bold").fontSize(11).fillColor(ink).text(`Chosen: ${decision.chosenLabel}`);
  doc
    .moveDown(0.2)
    .font("regular")
    .fontSize(9.5)
    .text(decision.rationale, { width: contentWidth(doc) });
  doc
    .moveDown(0.3)
    .fillColor(muted)
    .fontSize(8.5)
    .text(`Signed by ${decision.signedByName} on ${stamp(decision.signedAt)}.`)
    .text(decision.supersededAt ? `Superseded on ${stamp(decision.supersededAt)}.` : "Standing decision.");

  libraryStatus(doc, snapshot);

  // The caution stands on the first page, where a reader of the decision sees it.
  section(doc, "Caution");
  doc
    .font("regular")
    .fontSize(9)
    .fillColor(ink)
    .text(CAUTION, { width: contentWidth(doc) });

  section(doc, "Assumptions");
  keyValues(doc, [
    ["Case temperature", q(snapshot.policy.caseTemp, "°C")],
    ["Utilisation limit", pct(snapshot.policy.utilisationLimit)],
    ["Junction guard", `${snapshot.policy.tjGuard} K below Tj,max (where a part has a thermal model)`],
    [
      "Voltage limit",
      snapshot.policy.voltageLimit === undefined
        ? "none (checked before the voltage limit existed)"
        : `${pct(snapshot.policy.voltageLimit)} of V_DSS; above it a pulse is at best marginal`,
    ],
    ["Between datasheet widths", BETWEEN_WORDS[snapshot.policy.betweenCurves]],
    [
      "Longer pulses",
      "never allowed more current than a shorter pulse at the same voltage (crossing curves are capped)",
    ],
    ["Methods", `revision ${revisionOf(snapshot)} of the check's methods`],
    ["Evaluated", stamp(new Date(snapshot.takenAt))],
  ]);

  section(doc, "Candidates");
  candidatesTable(doc, snapshot);

  section(doc, "Comparison matrix (utilisation and verdict per pulse)");
  matrix(doc, snapshot);

  const chosen = snapshot.candidates.find((c) => c.partId === decision.chosenPartId);
  if (chosen?.limits) {
    ensureSpace(doc, 470);
    section(
      doc,
      `SOA of ${chosen.partNumber} at ${q(snapshot.policy.caseTemp, "°C")} case, with every pulse`,
    );
    soaChart(doc, snapshot, chosen.partId);
  }

  section(doc, "Fault cases");
  pulseDetails(doc, snapshot, "fault-case");
  section(doc, "Measured evidence");
  pulseDetails(doc, snapshot, "measured");
  pulseDetails(doc, snapshot, "capture");

  footer(doc, snapshot);
  doc.end();
  return done;
}

/** Each candidate's library status as frozen; a warning when any was an unverified draft. */
function libraryStatus(doc: Doc, snapshot: DecisionSnapshot): void {
  const drafts = snapshot.candidates.filter((c) => c.status !== "verified");
  doc.moveDown(0.4).font("bold").fontSize(9.5).fillColor(ink);
  if (drafts.length === 0) doc.text("Library status: every candidate was verified when signed.");
  else
    doc.text(
      drafts.length === snapshot.candidates.length
        ? "Warning: every candidate was an unverified library draft when signed (no second check against the datasheet)."
        : `Warning: ${drafts.map((c) => c.partNumber).join(", ")} ${drafts.length === 1 ? "was an unverified library draft" : "were unverified library drafts"} when signed (no second check against the datasheet).`,
      { width: contentWidth(doc) },
    );
  doc.font("regular").fontSize(8.5).fillColor(muted);
  for (const c of snapshot.candidates)
    doc.text(
      `${c.partNumber}: ${c.status === "verified" ? `verified${c.verifiedByName ? ` by ${c.verifiedByName}` : ""}` : "draft, unverified"}`,
    );
}

function contentWidth(doc: Doc): number {
  return doc.page.width - doc.page.margins.left - doc.page.margins.right;
}

function ensureSpace(doc: Doc, height: number): void {
  if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

function header(doc: Doc, snapshot: DecisionSnapshot, decision: ReportDecision): void {
  doc
    .font("bold")
    .fontSize(9)
    .fillColor(accent)
    .text("PULSEFENCE · DECISION RECORD", { characterSpacing: 1 });
  doc.moveDown(0.3).font("bold").fontSize(18).fillColor(ink).text(snapshot.project.name);
  if (snapshot.project.description) {
    doc
      .font("regular")
      .fontSize(9.5)
      .fillColor(muted)
      .text(snapshot.project.description, { width: contentWidth(doc) });
  }
  doc
    .moveDown(0.2)
    .fontSize(8.5)
    .fillColor(muted)
    .text(`Signed ${stamp(decision.signedAt)} by ${decision.signedByName}`);
}

function section(doc: Doc, title: string): void {
  ensureSpace(doc, 60);
  doc.moveDown(0.9);
  const y = doc.y;
  doc
    .moveTo(doc.page.margins.left, y)
    .lineTo(doc.page.width - doc.page.margins.right, y)
    .lineWidth(0.5)
    .strokeColor(line)
    .stroke();
  doc.moveDown(0.4).font("bold").fontSize(11).fillColor(ink).text(title, doc.page.margins.left);
  doc.moveDown(0.3);
}

function keyValues(doc: Doc, rows: [string, string][]): void {
  const x = doc.page.margins.left;
  for (const [k, v] of rows) {
    const y = doc.y;
    doc.font("regular").fontSize(9).fillColor(muted).text(k, x, y, { width: 150 });
    doc
      .font("regular")
      .fillColor(ink)
      .text(v, x + 160, y);
  }
}

interface Column {
  title: string;
  width: number;
  align?: "left" | "right";
}

function table(
  doc: Doc,
  columns: Column[],
  rows: {
    cells: string[];
    colours?: (string | undefined)[];
    /** A verdict per cell: its shape is drawn before the text, so a verdict never rests on colour alone. */
    verdicts?: (Verdict | undefined)[];
  }[],
): void {
  const x0 = doc.page.margins.left;
  const rowHeight = 15;
  const drawHeader = () => {
    let x = x0;
    const y = doc.y;
    doc.font("bold").fontSize(7.5).fillColor(muted);
    for (const c of columns) {
      doc.text(c.title, x + 2, y, {
        width: c.width - 4,
        align: c.align ?? "left",
        lineBreak: false,
        ellipsis: true,
      });
      x += c.width;
    }
    doc.y = y + rowHeight;
    doc
      .moveTo(x0, doc.y - 3)
      .lineTo(x, doc.y - 3)
      .lineWidth(0.5)
      .strokeColor(line)
      .stroke();
  };
  ensureSpace(doc, rowHeight * 3);
  drawHeader();
  for (const row of rows) {
    if (doc.y + rowHeight > doc.page.height - doc.page.margins.bottom) {
      doc.addPage();
      drawHeader();
    }
    let x = x0;
    const y = doc.y;
    row.cells.forEach((cell, k) => {
      const c = columns[k];
      const verdict = row.verdicts?.[k];
      if (verdict) marker(doc, x + 6, y + 4, verdict, 2.6);
      const indent = verdict ? 10 : 0;
      doc
        .font(c.align === "right" ? "mono" : "regular")
        .fontSize(8)
        .fillColor(row.colours?.[k] ?? ink)
        .text(cell, x + 2 + indent, y, {
          width: c.width - 4 - indent,
          height: 11,
          align: c.align ?? "left",
          lineBreak: false,
          ellipsis: true,
        });
      x += c.width;
    });
    doc.y = y + rowHeight;
  }
  doc.x = x0;
}

function candidatesTable(doc: Doc, snapshot: DecisionSnapshot): void {
  const rankOf = (id: string) => snapshot.ranking.find((r) => r.partId === id);
  table(
    doc,
    [
      { title: "Rank", width: 26, align: "right" },
      { title: "Part", width: 78 },
      { title: "Maker", width: 112 },
      { title: "V_DSS", width: 45, align: "right" },
      { title: "R_DS(on)", width: 50, align: "right" },
      { title: "Tj,max", width: 45, align: "right" },
      { title: "Cost", width: 45, align: "right" },
      { title: "Worst", width: 40, align: "right" },
      { title: "Verdict", width: 58 },
    ],
    byRank(snapshot).map((c) => {
      const r = rankOf(c.partId);
      const verdict = r?.worstVerdict ?? "no-data";
      return {
        cells: [
          String(r?.rank ?? "—"),
          c.partNumber,
          c.maker,
          q(c.part.vdsMax, "V"),
          q(c.part.rdsOn, "Ω"),
          q(c.part.tjMax, "°C"),
          c.unitCost === null ? "—" : `${c.unitCost.toFixed(2)} ${c.currency ?? ""}`,
          pct(r?.worstUtilisation ?? null),
          verdictWord[verdict],
        ],
        colours: [
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          verdictColour[verdict],
        ],
        verdicts: [
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          undefined,
          verdict,
        ],
      };
    }),
  );
}

function cell(result: PulseResult | undefined): { text: string; colour: string; verdict: Verdict } {
  if (!result) return { text: "no data", colour: verdictColour["no-data"], verdict: "no-data" };
  const u = result.utilisation === null ? "" : ` ${pct(result.utilisation)}`;
  return {
    text: `${verdictWord[result.verdict]}${u}`,
    colour: verdictColour[result.verdict],
    verdict: result.verdict,
  };
}

/** The candidates in the order of the ranking frozen with the decision. */
function byRank(snapshot: DecisionSnapshot) {
  const rank = (id: string) =>
    snapshot.ranking.find((r) => r.partId === id)?.rank ?? Number.POSITIVE_INFINITY;
  return [...snapshot.candidates].sort((a, b) => rank(a.partId) - rank(b.partId));
}

function matrix(doc: Doc, snapshot: DecisionSnapshot): void {
  const perTable = 5;
  if (snapshot.pulses.length === 0) {
    doc
      .font("regular")
      .fontSize(9)
      .fillColor(muted)
      .text("The project had no pulses when the decision was signed.");
    return;
  }
  for (let start = 0; start < snapshot.pulses.length; start += perTable) {
    const pulses = snapshot.pulses.slice(start, start + perTable);
    const width = (contentWidth(doc) - 100) / pulses.length;
    table(
      doc,
      [{ title: "Candidate", width: 100 }, ...pulses.map((p) => ({ title: p.name, width }))],
      byRank(snapshot).map((c) => {
        const cells = pulses.map((p) => cell(snapshot.results[c.partId]?.[p.id]));
        return {
          cells: [c.partNumber, ...cells.map((x) => x.text)],
          colours: [undefined, ...cells.map((x) => x.colour)],
          verdicts: [undefined, ...cells.map((x) => x.verdict)],
        };
      }),
    );
    doc.moveDown(0.6);
  }
}

function pulseFigures(p: DecisionSnapshot["pulses"][number]): string {
  const parts = [
    q(p.v, "V"),
    q(p.i, "A"),
    q(p.duration, "s"),
    p.kind === "triangle" ? "falling triangle" : p.kind,
  ];
  if (p.repeat)
    parts.push(
      `every ${q(p.repeat.period, "s")}${p.repeat.count ? `, ${p.repeat.count} pulses` : ", continuous"}`,
    );
  return parts.join(" · ");
}

function pulseDetails(
  doc: Doc,
  snapshot: DecisionSnapshot,
  source: DecisionSnapshot["pulses"][number]["source"],
): void {
  const pulses = snapshot.pulses.filter((p) => p.source === source);
  if (pulses.length === 0) {
    if (source !== "capture")
      doc
        .font("regular")
        .fontSize(9)
        .fillColor(muted)
        .text(source === "fault-case" ? "No fault cases." : "No measured pulses.");
    return;
  }
  for (const p of pulses) {
    ensureSpace(doc, 40 + 12 * snapshot.candidates.length);
    doc.moveDown(0.4).font("bold").fontSize(9.5).fillColor(ink).text(`${p.name}  `, { continued: true });
    doc
      .font("regular")
      .fontSize(8.5)
      .fillColor(muted)
      .text(`${pulseFigures(p)} · case ${q(p.caseTemp, "°C")}`);
    for (const c of snapshot.candidates) {
      const r = snapshot.results[c.partId]?.[p.id];
      const verdict = r?.verdict ?? "no-data";
      doc
        .font("regular")
        .fontSize(8.5)
        .fillColor(verdictColour[verdict])
        .text(`${c.partNumber}: ${verdictWord[verdict]}`, doc.page.margins.left + 10, doc.y, {
          continued: true,
        });
      const figures = r
        ? ` — utilisation ${pct(r.utilisation)}, allowed ${q(r.allowedCurrent, "A")}, Tj peak ${q(r.tjPeak, "°C")}, derating ${r.derating.toFixed(3)}${
            r.stability != null
              ? `, stability factor S ${r.stability.toFixed(3)} (${verdictWord[r.stabilityVerdict ?? "no-data"]})`
              : ""
          }`
        : " — the part had no SOA curves";
      doc.fillColor(ink).text(figures);
      const why = r ? [VERDICT_EXPLANATIONS[verdict], ...r.flags.map(explainFlag)] : [];
      for (const sentence of why) {
        doc
          .fontSize(7.5)
          .fillColor(muted)
          .text(sentence, doc.page.margins.left + 20, doc.y, { width: contentWidth(doc) - 20 });
      }
    }
  }
  doc.x = doc.page.margins.left;
}

function soaChart(doc: Doc, snapshot: DecisionSnapshot, partId: string): void {
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
  const decade = (v: number, up: boolean) =>
    10 ** (up ? Math.ceil(Math.log10(v)) : Math.floor(Math.log10(v)));
  const vMin = decade(Math.min(...all.map((p) => p[0])), false);
  const vMax = decade(Math.max(...all.map((p) => p[0])), true);
  const iMin = decade(Math.min(...all.map((p) => p[1])), false);
  const iMax = decade(Math.max(...all.map((p) => p[1])), true);
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
  for (const [ticks, major] of [
    [vTicks.minor, false],
    [vTicks.major, true],
  ] as const) {
    for (const v of ticks) {
      doc
        .moveTo(x(v), y0)
        .lineTo(x(v), y0 + h)
        .lineWidth(major ? 0.6 : 0.2)
        .strokeColor(line)
        .stroke();
    }
  }
  for (const [ticks, major] of [
    [iTicks.minor, false],
    [iTicks.major, true],
  ] as const) {
    for (const i of ticks) {
      doc
        .moveTo(x0, y(i))
        .lineTo(x0 + w, y(i))
        .lineWidth(major ? 0.6 : 0.2)
        .strokeColor(line)
        .stroke();
    }
  }
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
    const label = curve.duration === "DC" ? "DC" : fq(curve.duration, "s");
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
      `Solid lines: datasheet curves at ${q(limits.refCaseTemp, "°C")} case. Dashed: derated by ${limits.derating.toFixed(3)} for ${q(snapshot.policy.caseTemp, "°C")} case. Markers: pulses by verdict (circle pass, triangle marginal, square fail, hollow diamond no data).`,
      { width: contentWidth(doc) },
    );
}

function marker(doc: Doc, cx: number, cy: number, verdict: Verdict, r = 3.5): void {
  const colour = verdictColour[verdict];
  if (verdict === "pass") doc.circle(cx, cy, r).fill(colour);
  else if (verdict === "marginal")
    doc.polygon([cx, cy - r * 1.2], [cx + r * 1.2, cy + r], [cx - r * 1.2, cy + r]).fill(colour);
  else if (verdict === "fail") doc.rect(cx - r, cy - r, 2 * r, 2 * r).fill(colour);
  else
    doc
      .polygon([cx, cy - r * 1.3], [cx + r * 1.3, cy], [cx, cy + r * 1.3], [cx - r * 1.3, cy])
      .lineWidth(1)
      .stroke(colour);
}

function footer(doc: Doc, snapshot: DecisionSnapshot): void {
  const range = doc.bufferedPageRange();
  for (let k = range.start; k < range.start + range.count; k++) {
    doc.switchToPage(k);
    // Writing inside the bottom margin would make pdfkit start a new page: lift the margin while the footer is set.
    const margin = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const bottom = doc.page.height - 36;
    doc.font("regular").fontSize(7).fillColor(muted);
    doc.text(
      `${snapshot.project.name} · decision record · page ${k + 1} of ${range.count}`,
      doc.page.margins.left,
      bottom,
      {
        width: contentWidth(doc),
        align: "center",
        lineBreak: false,
      },
    );
    doc.page.margins.bottom = margin;
  }
}
