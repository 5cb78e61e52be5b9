// Reading one cell as a positive quantity. Decisions:
// - a bare number ("12", "1.5e-3", "-0") is in the column's unit and is multiplied by the header's scale;
// - a number written with its own prefix or unit ("12 V", "5 mA", "100 µs") is read as written, through the
//   engine's parseQuantity, and the header's scale is not applied again;
// - in a file separated by ";" or tab a single decimal comma is a decimal point ("1,5" = 1.5); in a
//   comma-separated file a comma inside a (quoted) number is ambiguous (decimal or thousands) and rejected;
// - every value must be finite, greater than 0 and within the physical sanity limits (src/lib/soa/sanity.ts);
// - a pulse width is a number with a time unit, a bare number of seconds (times the header's scale), or "DC"; a
//   curve label in a digitiser's header may hold other words around it ("tp = 10 µs", "DC operation").
import { saneValue } from "@/lib/soa/sanity";
import type { Duration } from "@/lib/soa/types";
import { parseQuantity } from "@/lib/soa/units";
import { QUANTITY_UNIT, type Quantity } from "./header";
import type { Delimiter } from "./text";

export type CellValue<T> = { ok: true; value: T } | { ok: false; reason: string };

const BARE = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Turns a decimal comma into a point where the separator allows one; null when the comma is ambiguous. */
export function decimalPoint(cell: string, delimiter: Delimiter): string | null {
  const comma = cell.indexOf(",");
  if (comma < 0) return cell;
  if (delimiter === "," || cell.includes(",", comma + 1) || cell.includes(".")) return null;
  return cell.replace(",", ".");
}

function positive(cell: string, value: number, quantity: Quantity): CellValue<number> {
  if (!Number.isFinite(value)) return { ok: false, reason: `'${cell}' is not a finite number` };
  if (!(value > 0)) return { ok: false, reason: `'${cell}' must be greater than 0` };
  const insane = saneValue(value, quantity === "width" ? "time" : quantity);
  if (insane !== null) return { ok: false, reason: `'${cell}': ${insane}` };
  return { ok: true, value };
}

/** Reads a voltage or current cell (see the rules in the header). */
export function readNumber(
  cell: string,
  quantity: Quantity,
  scale: number,
  delimiter: Delimiter,
): CellValue<number> {
  if (cell === "") return { ok: false, reason: "the cell is empty" };
  const text = decimalPoint(cell, delimiter);
  if (text === null) return { ok: false, reason: `'${cell}' is not a number (use '.' for decimals)` };
  if (BARE.test(text)) return positive(cell, Number(text) * scale, quantity);
  const parsed = parseQuantity(text, QUANTITY_UNIT[quantity]);
  if (!parsed.ok) {
    return {
      ok: false,
      reason:
        parsed.reason === "expected a number" ? `'${cell}' is not a number` : `'${cell}': ${parsed.reason}`,
    };
  }
  return positive(cell, parsed.value as number, quantity);
}

const TIME_UNIT =
  /([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(ns|us|µs|μs|ms|s|nsec|usec|msec|sec)(?![a-z])/i;
const WHOLE_TIME_UNIT = new RegExp(`^${TIME_UNIT.source}$`, "i");
const DC = /(?:^|[^a-z])dc(?![a-z])/i;

function widthHint(cell: string): string {
  return `'${cell}' is not a pulse width (write for example 100us, 1 ms, 1e-3 or DC)`;
}

/**
 * Reads a pulse width. `label` allows words around the width (a curve name in a digitiser's header) and refuses
 * a bare number there, whose unit nobody can tell; otherwise bare numbers are seconds times `scale`.
 */
export function readWidth(
  cell: string,
  scale: number,
  delimiter: Delimiter,
  label = false,
): CellValue<Duration> {
  if (cell === "") return { ok: false, reason: "the cell is empty" };
  const text = decimalPoint(cell, delimiter);
  if (text === null) return { ok: false, reason: widthHint(cell) };
  if (BARE.test(text)) {
    if (label)
      return {
        ok: false,
        reason: `curve name '${cell}' has no time unit (write for example '${cell} us' or '${cell} ms')`,
      };
    return positive(cell, Number(text) * scale, "width");
  }
  const match = (label ? TIME_UNIT : WHOLE_TIME_UNIT).exec(text);
  if (match !== null) {
    const prefix = match[2].toLowerCase().replace(/sec$/, "s");
    const parsed = parseQuantity(`${match[1]} ${prefix}`, "s");
    if (!parsed.ok) return { ok: false, reason: `'${cell}': ${parsed.reason}` };
    return positive(cell, parsed.value as number, "width");
  }
  if (label ? DC.test(text) : text.toUpperCase() === "DC") return { ok: true, value: "DC" };
  return { ok: false, reason: widthHint(cell) };
}
