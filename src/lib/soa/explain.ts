// Plain words for every flag and verdict, for the explanation panel beside each result. The wording is our
// own; the facts behind it are METHODS.md §2–§8 (revision 2). Each text says what the rule assumes and never
// promises more than the rule gives.
import type { Flag, PulseResult, Verdict } from "./types";
import { formatQuantity } from "./units";

export const FLAG_EXPLANATIONS: Readonly<Record<Flag, string>> = {
  "over-voltage":
    "The pulse's largest voltage exceeds the part's maximum drain-source voltage. That is a fail whatever the " +
    "SOA curves say.",
  "over-current":
    "The pulse's largest current exceeds the part's maximum pulsed drain current. That is a fail whatever the " +
    "SOA curves say.",
  "voltage-margin":
    "The pulse's largest voltage is above the margin policy's voltage limit (a share of the maximum " +
    "drain-source voltage) but not above the rating itself, so the curve verdict is at best marginal.",
  "shorter-than-shortest-curve":
    "The pulse is shorter than the shortest curve on the datasheet, so the shortest curve was used unchanged. " +
    "This assumes that a shorter pulse is allowed at least as much current as a longer one, which holds for " +
    "the thermally limited part of the curves.",
  interpolated:
    "The pulse width lies between two datasheet curves; the limit was interpolated on log-log axes between " +
    "them. This is exact where the thermal impedance grows as the square root of time, but it can overstate " +
    "the limit (by up to about 27 % within a decade for a single-term thermal model, typically 2–7 %) where " +
    "the impedance flattens toward its steady-state value. The utilisation limit and, where the part has a " +
    "thermal model, the junction-temperature check are meant to cover that; the strict or thermal reading " +
    "between widths avoids it.",
  "next-longer-curve":
    "The pulse width lies between two datasheet curves; the next longer curve was read. That assumes the " +
    "curves are ordered by width at this voltage (a longer pulse never allowed more), which the cap by " +
    "shorter curves enforces.",
  "thermal-scaled":
    "The limit was read on the next shorter curve and scaled by the thermal model: I = I_k·Z_th(t_k)/Z_th(t). " +
    "This is exact where that curve is thermally limited; it assumes the part's thermal model matches the " +
    "datasheet's own impedance.",
  "thermal-scaling-unavailable":
    "The margin policy asks for a thermal reading between widths, but the part has no thermal model; the next " +
    "longer curve (or the DC curve) was read instead.",
  "dc-curve-used":
    "The width is longer than every pulse curve on the datasheet, so the DC curve was read, capped by every " +
    "pulse curve.",
  "longer-than-longest-curve":
    "The width is longer than every curve on the datasheet and there is no DC curve, so the curves say nothing " +
    "about it.",
  "capped-by-shorter-curve":
    "The reading was lowered to a curve of a shorter pulse width, which allows less current at this voltage: " +
    "a longer pulse is never allowed more than a shorter one. The datasheet's curves cross here; check the " +
    "digitising.",
  "below-curve-range":
    "The voltage lies below the lowest point of a curve read; that curve's lowest-voltage current was used. " +
    "This assumes the current limit there is the on-resistance or package line, which the curve does not " +
    "draw at lower voltage.",
  "above-curve-range":
    "The voltage lies above the highest point of a curve read, so that curve gives no allowed current there.",
  "equivalent-rectangle":
    "The pulse is not rectangular. Its width on the curves is its energy divided by its peak power (for a " +
    "capture, over the whole record; each capture sample is read at its own width, energy over its own power, " +
    "at most the record's length). With a thermal model whose terms are positive this never understates the " +
    "peak heating of a record that starts from rest; it says nothing about limits the curves do not show.",
  "negative-power-clamped":
    "Some samples have negative power (probe skew or current flowing back). They were taken as zero power: " +
    "power flowing back is never allowed to cool the junction in a check. Check the probes' deskew.",
  "no-power":
    "The capture never dissipates positive power (the product of voltage and current), so there is nothing to " +
    "read on the curves.",
  "starts-mid-pulse":
    "The record's first sample already carries at least 1 % of its peak power: the pulse was under way before " +
    "the record began. The check takes the first level as settled (heated to its steady state and read on the " +
    "DC curve); unless the upload stated what came before, the verdict is at best marginal, because the record " +
    "may miss part of the heating.",
  "ends-mid-pulse":
    "The record's last sample still carries at least 1 % of its peak power: the pulse may go on after the " +
    "record ends, so the verdict is at best marginal. Capture the whole pulse.",
  "repetition-applied":
    "The pulse repeats. The single-pulse limit was multiplied by the repetition scale, the ratio of the " +
    "single-pulse thermal impedance to the impedance of the train (exact with a thermal model; from the curves " +
    "otherwise, by superposition or the duty-cycle approximation).",
  "repetition-outside-data":
    "The pulse repeats, but the thermal data do not reach the times needed to work out how the repetitions " +
    "add up. Add a thermal model (Foster network) to the part, or curves that span the period.",
  "thermal-instability":
    "The stability factor S = V·α·Z_th is 1 or more: at this voltage and current, where the current rises with " +
    "temperature (below the transfer characteristic's zero-temperature-coefficient point), heating feeds more " +
    "current faster than the junction sheds it, and a hot spot can run away. Many datasheet SOA curves do not " +
    "show this limit. The factor rests on the typical transfer curves entered; parts vary.",
  "stability-outside-data":
    "The stability factor needs the transfer characteristics at this current, and the curves entered do not " +
    "reach it (or not at both temperatures), so nothing is said about electro-thermal stability here.",
  avalanche:
    "An unclamped inductive turn-off: the inductor's energy is dumped in the transistor at breakdown. It is " +
    "checked against the avalanche energy rating derated linearly to zero at Tj,max for the starting " +
    "temperature; where the part gives no breakdown voltage, V_DSS is used, which overstates the energy.",
  "over-avalanche-current":
    "The current cut exceeds the part's avalanche current rating. That is a fail whatever the energy.",
  "case-heating":
    "The case heats during the pulse through the case path given. The curves are derated at the hottest case " +
    "temperature the pulse reaches, and the junction temperature adds the case rise. Both networks are driven " +
    "by the full power, which overstates the case rise; that is on the safe side.",
};

export const VERDICT_EXPLANATIONS: Readonly<Record<Verdict, string>> = {
  pass:
    "Within the allowed current with the margin the policy asks for and, where the part has a thermal model, " +
    "the junction stays below its guard band. It covers only what the part's data show.",
  marginal: "Within the limits, but closer to them than the margin policy asks for.",
  fail: "Outside the safe operating area, over a hard rating, or the junction gets hotter than its maximum.",
  "no-data": "The part's data do not cover this pulse, so no verdict can be given from them.",
};

/** Shown under every verdict area (PRODUCT.md, safety). */
export const CAUTION =
  "This check is an aid, not a guarantee. Datasheet SOA curves hold at 25 °C case temperature and for a " +
  "single pulse. Validate every design on hardware and follow the manufacturer's guidance, the applicable " +
  "safety standards, local codes and licensed practice.";

/** The plain-words explanation of a flag. */
export function explainFlag(flag: Flag): string {
  return FLAG_EXPLANATIONS[flag];
}

/** The plain-words explanations of a result's flags, in the result's order. */
export function explainFlags(flags: readonly Flag[]): string[] {
  return flags.map(explainFlag);
}

/** The views a verdict can come from (METHODS.md §8): the curves, a hard rating, the thermal model, stability,
 * and the record's own limits (a capture that may miss part of its pulse). */
export type View = "hard-limit" | "curves" | "thermal" | "stability" | "record";

export const VIEW_WORDS: Readonly<Record<View, string>> = {
  "hard-limit": "a hard rating (maximum voltage or pulsed current)",
  curves: "the SOA curves",
  thermal: "the junction temperature from the thermal model",
  stability: "the electro-thermal stability factor",
  record: "the record itself, which may miss part of the pulse",
};

/** Which views decided a result: every view whose own verdict equals the final one (pass: all views agree). */
export function decidingViews(
  result: Pick<PulseResult, "verdict" | "curveVerdict" | "thermalVerdict" | "stabilityVerdict"> & {
    flags: readonly Flag[];
  },
): View[] {
  const views: View[] = [];
  const hard = result.flags.includes("over-voltage") || result.flags.includes("over-current");
  if (result.curveVerdict === result.verdict)
    views.push(hard && result.verdict === "fail" ? "hard-limit" : "curves");
  if (result.thermalVerdict === result.verdict) views.push("thermal");
  if (result.stabilityVerdict === result.verdict) views.push("stability");
  const capped = result.flags.includes("ends-mid-pulse") || result.flags.includes("starts-mid-pulse");
  if (views.length === 0 && capped && result.verdict === "marginal") views.push("record");
  return views;
}

/**
 * Which datasheet curves a reading at `width` used (METHODS.md §3), in words: "the 1 ms curve", "the 1 ms and
 * 10 ms curves, log-log", "the 1 ms curve scaled by the thermal model", "the DC curve", or null when there is none.
 * `widths` are the curve set's durations; `thermal` says the part has a Foster network for the thermal reading.
 */
export function curvesRead(
  widths: readonly (number | "DC")[],
  width: number | null,
  policy: "loglog" | "next-longer" | "thermal",
  thermal: boolean,
): string | null {
  if (width === null || !(width > 0)) return widths.includes("DC") ? "the DC curve" : null;
  const finite = widths.filter((w): w is number => w !== "DC").sort((a, b) => a - b);
  const name = (t: number) => `the ${formatQuantity(t, "s")} curve`;
  const exact = finite.find((t) => Math.abs(width - t) <= 1e-9 * t);
  if (exact !== undefined) return name(exact);
  if (finite.length > 0 && width < finite[0]) return `${name(finite[0])}, unchanged`;
  const longer = finite.findIndex((t) => t > width);
  const scaled = policy === "thermal" && thermal;
  if (longer === -1) {
    if (scaled && finite.length > 0) return `${name(finite[finite.length - 1])} scaled by the thermal model`;
    return widths.includes("DC") ? "the DC curve" : null;
  }
  const shorter = finite[longer - 1];
  if (scaled) return `${name(shorter)} scaled by the thermal model`;
  if (policy === "loglog") {
    return `the ${formatQuantity(shorter, "s")} and ${formatQuantity(finite[longer], "s")} curves, log-log`;
  }
  return name(finite[longer]);
}
