// What is wrong or suspicious in a part's transfer characteristics before anyone relies on them (METHODS.md §12).
// Blocking ("error"): the engine reads each curve in the order given and needs V_GS and I_D strictly ascending,
// two points per curve and two different temperatures. Advisory ("warning"): below the zero-temperature-coefficient
// point the hotter curve carries more current, above it less, so two curves digitised from one figure cross once
// with the hotter curve passing from above to below; anything else is worth a second look at the figure.

import type { TransferCurveRead } from "@/lib/csv/transfer";
import { inUnit } from "@/lib/format";
import { prepareTransfer } from "@/lib/soa/stability";
import type { TransferData } from "@/lib/soa/types";
import { type TransferCrossing, transferCrossings } from "@/lib/soa/zero-tc";

export interface TransferFinding {
  key:
    | "temperatures-equal"
    | "too-few-points"
    | "vgs-not-ascending"
    | "id-not-ascending"
    | "no-common-range"
    | "no-crossing-hot-above"
    | "no-crossing-hot-below"
    | "crosses-wrong-way"
    | "crosses-more-than-once";
  severity: "error" | "warning";
  /** The spreadsheet row the finding points at, where it is one row. */
  row: number | null;
  message: string;
}

export interface TransferReview {
  findings: TransferFinding[];
  /** The engine's data, when no finding blocks it. */
  data: TransferData | null;
  /** The zero-temperature-coefficient point, when the curves cross the usual way. */
  zeroTc: TransferCrossing | null;
}

const fmt = (x: number) => inUnit(x, 1, 4);

export function reviewTransfer(curves: TransferCurveRead[]): TransferReview {
  const findings: TransferFinding[] = [];
  if (curves.length < 2) {
    const temp = curves[0]?.temp;
    findings.push({
      key: "temperatures-equal",
      severity: "error",
      row: null,
      message:
        temp === undefined
          ? "No curves."
          : `Every point is at ${fmt(temp)} °C: give a second curve at another junction temperature (e.g. 25 °C and 150 °C).`,
    });
  }
  for (const curve of curves) {
    if (curve.points.length < 2) {
      findings.push({
        key: "too-few-points",
        severity: "error",
        row: curve.points[0]?.row ?? null,
        message: `The ${fmt(curve.temp)} °C curve has ${curve.points.length} point; it needs at least two.`,
      });
    }
    for (let k = 1; k < curve.points.length; k++) {
      const [p, q] = [curve.points[k - 1], curve.points[k]];
      if (!(q.vgs > p.vgs)) {
        findings.push({
          key: "vgs-not-ascending",
          severity: "error",
          row: q.row,
          message: `Row ${q.row}: V_GS ${fmt(q.vgs)} V does not rise from ${fmt(p.vgs)} V (row ${p.row}) on the ${fmt(curve.temp)} °C curve; give each curve's points in ascending V_GS.`,
        });
      } else if (!(q.id > p.id)) {
        findings.push({
          key: "id-not-ascending",
          severity: "error",
          row: q.row,
          message: `Row ${q.row}: I_D ${fmt(q.id)} A does not rise from ${fmt(p.id)} A (row ${p.row}) on the ${fmt(curve.temp)} °C curve; a transfer characteristic rises with V_GS.`,
        });
      }
    }
  }
  if (findings.length > 0) return { findings, data: null, zeroTc: null };
  const data: TransferData = {
    temps: [curves[0].temp, curves[1].temp],
    curves: [curves[0].points.map((p) => [p.vgs, p.id]), curves[1].points.map((p) => [p.vgs, p.id])],
  };
  const [ta, tb] = data.temps.map(fmt);
  const crossing = transferCrossings(prepareTransfer(data));
  let zeroTc: TransferCrossing | null = null;
  if (crossing === null) {
    findings.push({
      key: "no-common-range",
      severity: "warning",
      row: null,
      message: `The ${ta} °C and ${tb} °C curves share no V_GS range, so no current has a temperature coefficient: every stability check of this part says no data.`,
    });
  } else if (crossing.crossings.length === 0) {
    findings.push(
      crossing.first > 0
        ? {
            key: "no-crossing-hot-above",
            severity: "warning",
            row: null,
            message: `The curves do not cross within the data: the ${tb} °C curve carries more current at every V_GS, so the zero-temperature-coefficient point lies above the highest current given and every current read is in the unstable region. Check the figure if it shows a crossing.`,
          }
        : {
            key: "no-crossing-hot-below",
            severity: "warning",
            row: null,
            message: `The ${tb} °C curve lies below the ${ta} °C curve everywhere: below the zero-temperature-coefficient point the hotter curve should carry more current. Are the temperatures swapped, or does the data start above the crossing?`,
          },
    );
  } else {
    const falling = crossing.crossings.filter((c) => c.falling);
    if (crossing.crossings.length > 1) {
      findings.push({
        key: "crosses-more-than-once",
        severity: "warning",
        row: null,
        message: `The curves cross ${crossing.crossings.length} times (at ${crossing.crossings.map((c) => `${fmt(c.gate)} V`).join(", ")}); transfer curves of one figure cross once. Check the digitised points near the crossings.`,
      });
    }
    if (falling.length === 0) {
      findings.push({
        key: "crosses-wrong-way",
        severity: "warning",
        row: null,
        message: `The ${tb} °C curve passes from below to above the ${ta} °C curve at ${fmt(crossing.crossings[0].gate)} V: the other way round from a zero-temperature-coefficient point. Are the temperatures swapped?`,
      });
    }
    zeroTc = falling[0] ?? null;
  }
  return { findings, data, zeroTc };
}
