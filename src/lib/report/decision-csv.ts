import Papa from "papaparse";
import type { DecisionSnapshot } from "@/lib/projects/decisions";

/** Four significant figures: enough to audit a margin, without the 16 digits of a double. */
export function sensible(value: number | null | undefined): number | "" {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  return Number(value.toPrecision(4));
}

/**
 * The decision's frozen evaluation as CSV: one row per candidate × pulse, candidates in the rank order of the
 * moment it was signed, numbers rounded to four significant figures, plain symbols and SI units; each candidate's
 * library status as frozen. Later edits to the library or the project never change it.
 */
export function decisionCsv(snapshot: DecisionSnapshot): string {
  const rankOf = new Map(snapshot.ranking.map((r) => [r.partId, r]));
  const candidates = [...snapshot.candidates].sort(
    (a, b) => (rankOf.get(a.partId)?.rank ?? Infinity) - (rankOf.get(b.partId)?.rank ?? Infinity),
  );
  const rows = candidates.flatMap((c) => {
    const rank = rankOf.get(c.partId);
    return snapshot.pulses.map((p) => {
      const r = snapshot.results[c.partId]?.[p.id];
      return {
        rank: rank?.rank ?? "",
        part: c.partNumber,
        maker: c.maker,
        library_status: c.status === "verified" ? "verified" : "draft",
        verified_by: c.status === "verified" ? (c.verifiedByName ?? "") : "",
        unit_cost: c.unitCost ?? "",
        currency: c.currency ?? "",
        pulse: p.name,
        source: p.source,
        V_DS_V: sensible(p.v),
        I_D_A: sensible(p.i),
        width_s: sensible(p.duration),
        case_temp_C: sensible(p.caseTemp),
        verdict: r?.verdict ?? "no-data",
        utilisation: sensible(r?.utilisation),
        allowed_current_A: sensible(r?.allowedCurrent),
        Tj_peak_C: sensible(r?.tjPeak),
        flags: r?.flags.join(" ") ?? "no curves",
        worst_verdict: rank?.worstVerdict ?? "",
        worst_utilisation: sensible(rank?.worstUtilisation),
      };
    });
  });
  // Names are typed by people: a cell a spreadsheet would run as a formula (=, +, -, @, tab or CR at the start of
  // text) is prefixed with a quote. Numbers stay numbers, so a negative value is not touched.
  return Papa.unparse(rows, { newline: "\r\n", escapeFormulae: true });
}
