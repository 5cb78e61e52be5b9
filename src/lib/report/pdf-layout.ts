import { dateText, percent, plainSpaces, q as quantity, settingPercent } from "@/lib/format";
import type { Verdict } from "@/lib/soa/types";
import type { Unit } from "@/lib/soa/units";

// The decision report's page furniture (pdfkit): colours, quantities as the PDF sets them, sections, key-value
// rows, tables that carry over pages, and the verdict markers drawn beside verdicts (shape, never colour alone).

export const ink = "#23272b";
export const muted = "#5d656d";
export const line = "#c5cacd";
export const accent = "#0f5a73";
export const verdictColour: Record<Verdict, string> = {
  pass: "#1f7a3d",
  marginal: "#b26a00",
  fail: "#b3261e",
  "no-data": "#6b7278",
};

export type Doc = PDFKit.PDFDocument;

// The figures as lib/format.ts writes them everywhere; the shipped font has no thin space (U+2009), so the PDF
// sets a plain space between number and unit.
export const pct = (u: number | null) => plainSpaces(percent(u));
export const settingPct = (u: number | null) => plainSpaces(settingPercent(u));
export const q = (v: number | null | undefined, unit: Unit) => plainSpaces(quantity(v, unit));
export const stamp = (d: Date) => dateText(d, true);

export function contentWidth(doc: Doc): number {
  return doc.page.width - doc.page.margins.left - doc.page.margins.right;
}

export function ensureSpace(doc: Doc, height: number): void {
  if (doc.y + height > doc.page.height - doc.page.margins.bottom) doc.addPage();
}

export function section(doc: Doc, title: string): void {
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

export function keyValues(doc: Doc, rows: [string, string][]): void {
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

export interface Column {
  title: string;
  width: number;
  align?: "left" | "right";
}

export function table(
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

export function marker(doc: Doc, cx: number, cy: number, verdict: Verdict, r = 3.5): void {
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
