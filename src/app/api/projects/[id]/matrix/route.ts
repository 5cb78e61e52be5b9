import Papa from "papaparse";
import { route } from "@/lib/auth/guard";
import { checkProject } from "@/lib/projects/check";
import { rankCandidates } from "@/lib/projects/matrix";
import { loadProject } from "@/lib/projects/projects";
import { attachmentDisposition } from "@/lib/report/file-name";

/**
 * GET /api/projects/:id/matrix: the comparison matrix as CSV (one row per candidate × pulse, plain symbols and SI
 * units, so a spreadsheet can sort and filter it), named after the project and the date.
 */
export const GET = route<{ id: string }>({ action: "workspace.read" }, async (_req, caller, { id }) => {
  const project = await loadProject(caller, id);
  // A download is a record: captures' stale results are recomputed before it is written, not left out.
  const checked = await checkProject(project, { staleCaptures: "recompute" });
  const ranking = rankCandidates(
    checked.candidates,
    checked.pulses.map((p) => p.id),
    checked.results,
  );
  const rows = checked.candidates.flatMap((c) => {
    const rank = ranking.find((r) => r.partId === c.partId);
    return checked.pulses.map((p) => {
      const r = checked.results[c.partId]?.[p.id];
      return {
        rank: rank?.rank ?? "",
        part: c.partNumber,
        maker: c.maker,
        unit_cost: c.unitCost ?? "",
        currency: c.currency ?? "",
        pulse: p.name,
        source: p.source,
        V_DS_V: p.v ?? "",
        I_D_A: p.i ?? "",
        width_s: p.duration ?? "",
        case_temp_C: p.caseTemp,
        verdict: r?.verdict ?? "no-data",
        utilisation: r?.utilisation ?? "",
        allowed_current_A: r?.allowedCurrent ?? "",
        Tj_peak_C: r?.tjPeak ?? "",
        derating: r?.derating ?? "",
        curve_verdict: r?.curveVerdict ?? "",
        thermal_verdict: r?.thermalVerdict ?? "",
        stability_verdict: r?.stabilityVerdict ?? "",
        stability_factor: r?.stability ?? "",
        flags: r?.flags.join(" ") ?? "no curves",
        worst_verdict: rank?.worstVerdict ?? "",
        worst_utilisation: rank?.worstUtilisation ?? "",
      };
    });
  });
  // Cells a spreadsheet would run as a formula (=, +, -, @ at the start of text) are prefixed with a quote.
  const csv = Papa.unparse(rows, { newline: "\r\n", escapeFormulae: true });
  return new Response(csv, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": attachmentDisposition(project.name, new Date(), "csv"),
      "cache-control": "no-store",
    },
  });
});
