import path from "node:path";
import PDFDocument from "pdfkit";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import { CAUTION } from "@/lib/soa/explain";
import { revisionOf } from "@/lib/soa/revision";
import {
  accent,
  contentWidth,
  type Doc,
  ensureSpace,
  ink,
  keyValues,
  muted,
  q,
  section,
  settingPct,
  stamp,
} from "./pdf-layout";
import { candidatesTable, matrix, pulseDetails } from "./pdf-sections";
import { soaChart } from "./pdf-soa-chart";

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

export interface ReportDecision {
  chosenLabel: string;
  chosenPartId: string | null;
  rationale: string;
  signedByName: string;
  signedAt: Date;
  supersededAt: Date | null;
}

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
    ["Utilisation limit", settingPct(snapshot.policy.utilisationLimit)],
    ["Junction guard", `${snapshot.policy.tjGuard} K below Tj,max (where a part has a thermal model)`],
    [
      "Voltage limit",
      snapshot.policy.voltageLimit === undefined
        ? "none (checked before the voltage limit existed)"
        : `${settingPct(snapshot.policy.voltageLimit)} of V_DSS; above it a pulse is at best marginal`,
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
