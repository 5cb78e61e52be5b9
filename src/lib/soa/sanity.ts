// Physical sanity limits for values entering Pulsefence (forms, CSV, paste, API, contract). A value beyond a
// part's ratings is still evidence (a pulse that exceeded V(BR)DSS happened and must be shown as such), but a value
// beyond these limits is a slip (a wrong prefix, a unit in the wrong column) and is refused with a message that
// says so. The limits are deliberately wide: no power transistor circuit on a bench reaches them. Decisions:
// - NaN, ±∞ and zero are the callers' concern (they already demand finite values); `saneValue` checks the
//   magnitude of a negative value (an offset of −1 GV is as absurd as +1 GV) and answers null inside the range;
// - temperatures have their own display range: a computed Tj outside it is shown as off scale, not as digits.
import { formatQuantity, type Unit } from "./units";

export type SaneQuantity =
  | "voltage"
  | "current"
  | "time"
  | "frequency"
  | "resistance"
  | "thermal-resistance"
  | "temperature";

interface Range {
  min: number;
  max: number;
  unit: Unit;
  /** How a message names the quantity. */
  noun: string;
}

/** The sane range of every quantity that enters the product, in SI units (°C for temperatures). */
export const SANITY_LIMITS: Readonly<Record<SaneQuantity, Range>> = {
  voltage: { min: 1e-6, max: 100e3, unit: "V", noun: "a voltage" },
  current: { min: 1e-9, max: 1e6, unit: "A", noun: "a current" },
  time: { min: 1e-12, max: 1e6, unit: "s", noun: "a time" },
  frequency: { min: 1e-6, max: 1e12, unit: "Hz", noun: "a frequency" },
  resistance: { min: 1e-6, max: 1e9, unit: "Ω", noun: "a resistance" },
  "thermal-resistance": { min: 1e-4, max: 1e4, unit: "K/W", noun: "a thermal resistance" },
  temperature: { min: -273.15, max: 1000, unit: "°C", noun: "a temperature" },
};

/** Computed junction temperatures outside this range are shown as off scale (°C). */
export const TEMPERATURE_DISPLAY_RANGE = { min: -100, max: 2000 } as const;

/**
 * Null for a value within the sane range of its quantity, else the message that refuses it, e.g. "1 GV is above
 * 100 kV, the most a voltage can be here: check the prefix and the unit". Non-finite values answer null.
 */
export function saneValue(value: number, quantity: SaneQuantity): string | null {
  if (!Number.isFinite(value)) return null;
  const { min, max, unit, noun } = SANITY_LIMITS[quantity];
  const shown = (x: number) => formatQuantity(x, unit);
  const size = quantity === "temperature" ? value : Math.abs(value);
  const hint = "check the prefix and the unit";
  if (size > max) return `${shown(value)} is above ${shown(max)}, the most ${noun} can be here: ${hint}`;
  if (size < min && (quantity === "temperature" || size > 0))
    return `${shown(value)} is below ${shown(min)}, the least ${noun} can be here: ${hint}`;
  return null;
}

/** A part's ratings a pulse can exceed while still being evidence. */
export interface RatedLimits {
  vdsMax: number;
  idPulseMax?: number | null;
  idMax?: number | null;
}

/**
 * What of a pulse lies beyond the part's ratings, in words ("V_DS 120 V above V(BR)DSS 100 V"); empty when within.
 * The pulse is still checked: these flags say that the check's curves do not reach it.
 */
export function beyondRatings(pulse: { v: number; i: number }, part: RatedLimits): string[] {
  const out: string[] = [];
  if (pulse.v > part.vdsMax) {
    out.push(`V_DS ${formatQuantity(pulse.v, "V")} above V(BR)DSS ${formatQuantity(part.vdsMax, "V")}`);
  }
  const iMax = part.idPulseMax ?? part.idMax ?? null;
  if (iMax !== null && pulse.i > iMax) {
    const name = part.idPulseMax != null ? "I_DM" : "I_D";
    out.push(`I_D ${formatQuantity(pulse.i, "A")} above ${name} ${formatQuantity(iMax, "A")}`);
  }
  return out;
}

/**
 * A temperature for display: "148 °C", or "off scale (above 2000 °C)" outside TEMPERATURE_DISPLAY_RANGE, so that a
 * runaway thermal result reads as what it is rather than as eleven digits. NaN and ±∞ are "—".
 */
export function formatTemperature(t: number): string {
  if (!Number.isFinite(t)) return "—";
  const { min, max } = TEMPERATURE_DISPLAY_RANGE;
  if (t > max) return `off scale (above ${formatQuantity(max, "°C")})`;
  if (t < min) return `off scale (below ${formatQuantity(min, "°C")})`;
  return formatQuantity(t, "°C");
}
