// Recognising a column from its header: a name and an optional unit, "V_DS [V]", "Vds (V)", "I_D / mA", "Id in A".
// Names are compared with case, spaces, underscores, hyphens and dots removed ("Pulse width" = "pulse_width" =
// "pulsewidth"). A name that is not known still identifies its column through a unit that fits only one quantity
// ("X [V]"). The unit scales the column: "[mA]" multiplies bare numbers by 1e-3.
import { parseQuantity, type Unit } from "@/lib/soa/units";

export type Quantity = "width" | "voltage" | "current";

/** SI unit of each quantity. */
export const QUANTITY_UNIT: Readonly<Record<Quantity, Unit>> = { width: "s", voltage: "V", current: "A" };

const NAMES: Readonly<Record<Quantity, readonly string[]>> = {
  width: [
    "width",
    "pulsewidth",
    "pulse",
    "duration",
    "pulseduration",
    "pulselength",
    "tp",
    "tpulse",
    "time",
    "t",
  ],
  voltage: ["v", "vds", "uds", "voltage", "drainsourcevoltage", "vce", "collectoremittervoltage", "x"],
  current: ["i", "id", "current", "draincurrent", "ic", "collectorcurrent", "y"],
};

export interface HeaderCell {
  /** The name without its unit, as written. */
  name: string;
  /** The unit as written, or null. */
  unit: string | null;
}

const BRACKETED = /^(.*?)\s*[[(]\s*([^\])]*?)\s*[\])]\s*$/;
const SLASHED = /^(.+?)\s*\/\s*([^/\s]+)$/;
const IN_UNIT = /^(.+?)\s+in\s+(\S+)$/i;

/** Splits "V_DS [V]" into its name and unit. */
export function splitHeader(cell: string): HeaderCell {
  const text = cell.trim();
  for (const pattern of [BRACKETED, SLASHED, IN_UNIT]) {
    const match = pattern.exec(text);
    if (match !== null && match[2] !== "") return { name: match[1].trim(), unit: match[2] };
  }
  return { name: text, unit: null };
}

function compact(name: string): string {
  return name.toLowerCase().replace(/[\s_.-]/g, "");
}

/**
 * The quantity a header name stands for, or null. `axes` also accepts the digitiser axis names X (voltage) and
 * Y (current); a long table's header must name its columns.
 */
export function quantityOfName(name: string, axes = false): Quantity | null {
  const key = compact(name);
  for (const quantity of ["width", "voltage", "current"] as const) {
    if (!axes && (key === "x" || key === "y")) continue;
    if (NAMES[quantity].includes(key)) return quantity;
  }
  return null;
}

/**
 * Normalises how people write units in headers: time units in any case ("MS" is milliseconds, never
 * megaseconds), "sec" for s, and the last letter of a voltage or current unit in capitals ("ma" → "mA").
 */
function normaliseUnit(unit: string): string {
  const u = unit.trim().replace(/sec$/i, "s");
  if (/^[pnuµμm]?s$/i.test(u)) return u.toLowerCase();
  if (/^[pnuµμmkM]?[va]$/i.test(u)) return u.slice(0, -1) + u.slice(-1).toUpperCase();
  return u;
}

export type UnitScale = { ok: true; quantity: Quantity; scale: number } | { ok: false; reason: string };

/**
 * The quantity and scale factor of a header unit ("mA" → current, 1e-3). With `quantity`, the unit must be one of
 * that quantity's.
 */
export function unitScale(unit: string, quantity?: Quantity): UnitScale {
  const parsed = parseQuantity(`1 ${normaliseUnit(unit)}`);
  const found = (Object.keys(QUANTITY_UNIT) as Quantity[]).find(
    (q) => parsed.ok && parsed.unit === QUANTITY_UNIT[q],
  );
  if (!parsed.ok || found === undefined || typeof parsed.value !== "number") {
    const wanted = quantity === undefined ? "s, V or A" : QUANTITY_UNIT[quantity];
    return {
      ok: false,
      reason: `unit '${unit}' is not understood (expected ${wanted}, with a prefix if needed)`,
    };
  }
  if (quantity !== undefined && found !== quantity) {
    return {
      ok: false,
      reason: `unit '${unit}' does not fit a ${quantity} (expected ${QUANTITY_UNIT[quantity]})`,
    };
  }
  return { ok: true, quantity: found, scale: parsed.value };
}
