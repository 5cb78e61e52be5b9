import { factor, money, plainSpaces } from "@/lib/format";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import { explainFlag, VERDICT_EXPLANATIONS } from "@/lib/soa/explain";
import type { PulseResult, Verdict } from "@/lib/soa/types";
import { verdictWords } from "@/lib/vocabulary";
import { contentWidth, type Doc, ensureSpace, ink, muted, pct, q, table, verdictColour } from "./pdf-layout";

// The decision report's tables (pdfkit): the candidates as ranked when signed, the verdict matrix, and each
// pulse's figures with the reasons of its verdicts, all from the frozen snapshot.

export function candidatesTable(doc: Doc, snapshot: DecisionSnapshot): void {
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
      return verdictRow(
        [
          String(r?.rank ?? "—"),
          c.partNumber,
          c.maker,
          q(c.part.vdsMax, "V"),
          q(c.part.rdsOn, "Ω"),
          q(c.part.tjMax, "°C"),
          plainSpaces(money(c.unitCost, c.currency)),
          pct(r?.worstUtilisation ?? null),
        ],
        [{ text: verdictWords[verdict], colour: verdictColour[verdict], verdict }],
      );
    }),
  );
}

interface VerdictCell {
  text: string;
  colour: string;
  verdict: Verdict;
}

/** A table row: plain cells first, then cells that carry a verdict (its colour and its marker). */
function verdictRow(plain: string[], verdicts: VerdictCell[]) {
  const none = plain.map(() => undefined);
  return {
    cells: [...plain, ...verdicts.map((x) => x.text)],
    colours: [...none, ...verdicts.map((x) => x.colour)],
    verdicts: [...none, ...verdicts.map((x) => x.verdict)],
  };
}

function cell(result: PulseResult | undefined): VerdictCell {
  if (!result) return { text: verdictWords["no-data"], colour: verdictColour["no-data"], verdict: "no-data" };
  const u = result.utilisation === null ? "" : ` ${pct(result.utilisation)}`;
  return {
    text: `${verdictWords[result.verdict]}${u}`,
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

/** A muted line where a table has nothing to show. */
function note(doc: Doc, text: string): void {
  doc.font("regular").fontSize(9).fillColor(muted).text(text);
}

export function matrix(doc: Doc, snapshot: DecisionSnapshot): void {
  const perTable = 5;
  if (snapshot.pulses.length === 0) {
    note(doc, "The project had no pulses when the decision was signed.");
    return;
  }
  for (let start = 0; start < snapshot.pulses.length; start += perTable) {
    const pulses = snapshot.pulses.slice(start, start + perTable);
    const width = (contentWidth(doc) - 100) / pulses.length;
    table(
      doc,
      [{ title: "Candidate", width: 100 }, ...pulses.map((p) => ({ title: p.name, width }))],
      byRank(snapshot).map((c) => {
        return verdictRow(
          [c.partNumber],
          pulses.map((p) => cell(snapshot.results[c.partId]?.[p.id])),
        );
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

export function pulseDetails(
  doc: Doc,
  snapshot: DecisionSnapshot,
  source: DecisionSnapshot["pulses"][number]["source"],
): void {
  const pulses = snapshot.pulses.filter((p) => p.source === source);
  if (pulses.length === 0) {
    if (source !== "capture") note(doc, source === "fault-case" ? "No fault cases." : "No measured pulses.");
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
        .text(`${c.partNumber}: ${verdictWords[verdict]}`, doc.page.margins.left + 10, doc.y, {
          continued: true,
        });
      const figures = r
        ? ` — utilisation ${pct(r.utilisation)}, allowed ${q(r.allowedCurrent, "A")}, Tj peak ${q(r.tjPeak, "°C")}, derating ×${factor(r.derating)}${
            r.stability != null
              ? `, stability factor S ${factor(r.stability)} (${verdictWords[r.stabilityVerdict ?? "no-data"]})`
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
