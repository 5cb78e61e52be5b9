// Plain words for every flag and verdict, for the explanation panel beside each result. The wording is our
// own; the facts behind it are METHODS.md §2–§8.
import type { Flag, Verdict } from "./types";

export const FLAG_EXPLANATIONS: Readonly<Record<Flag, string>> = {
  "over-voltage":
    "The pulse's voltage exceeds the part's maximum drain-source voltage. That is a fail whatever the SOA " +
    "curves say.",
  "over-current":
    "The pulse's current exceeds the part's maximum pulsed drain current. That is a fail whatever the SOA " +
    "curves say.",
  "case-at-or-above-tj-max":
    "The case temperature is at or above the maximum junction temperature, so the derated curves allow no " +
    "current at all.",
  "shorter-than-shortest-curve":
    "The pulse is shorter than the shortest curve on the datasheet, so the shortest curve was used " +
    "unchanged. A shorter pulse would be allowed at least this much, so the reading is on the safe side.",
  interpolated:
    "The pulse width lies between two datasheet curves; the limit was interpolated on log-log axes between " +
    "them. This is exact where the thermal impedance grows as the square root of time, but it can " +
    "overstate the limit (by up to about 27 % within a decade) where the impedance flattens toward its " +
    "steady-state value. The thermal check and the utilisation limit are there to cover that.",
  "next-longer-curve":
    "The pulse width lies between two datasheet curves; the margin policy reads the next longer curve, " +
    "which never allows more than the true limit.",
  "dc-curve-used":
    "The pulse is longer than every pulse curve on the datasheet, so the DC curve was used. That is on the " +
    "safe side.",
  "longer-than-longest-curve":
    "The pulse is longer than every curve on the datasheet and there is no DC curve, so the curves say " +
    "nothing about it.",
  "below-curve-range":
    "The voltage lies below the lowest point of the curve; the curve's lowest-voltage current was used. In " +
    "that region the on-resistance or the package limits the current, not heating.",
  "above-curve-range":
    "The voltage lies above the highest point of the curve, so the curve gives no allowed current there.",
  "equivalent-rectangle":
    "The pulse is not rectangular. It was read on the curves as a rectangle of the same energy at its peak " +
    "power, which never understates the heating.",
  "pulse-too-short":
    "Only one sample of the capture lies near its peak power, so the pulse has no measurable width. " +
    "Capture it with a finer time step.",
  "no-power":
    "The capture never dissipates positive power (the product of voltage and current), so there is nothing " +
    "to read on the curves.",
  "repetition-outside-data":
    "The pulse repeats, but the thermal data do not reach the times needed to work out how the repetitions " +
    "add up. Add a thermal model (Foster network) to the part, or curves that span the period.",
};

export const VERDICT_EXPLANATIONS: Readonly<Record<Verdict, string>> = {
  pass:
    "Within the allowed current with the margin the policy asks for, and the junction stays below its " +
    "guard band.",
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
