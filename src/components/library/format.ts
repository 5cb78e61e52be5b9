import { formatQuantity } from "@/lib/soa/units";

/** A stored rating for a table cell, in the column's unit (the unit sits in the header): 0.0016 Ω in mΩ → "1.6". */
export function inUnit(value: number | null | undefined, scale = 1, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  return String(Number((value / scale).toPrecision(digits)));
}

/** A rating with its unit, or a dash when the part does not give it. */
export function quantityText(value: number | null | undefined, unit: Parameters<typeof formatQuantity>[1]) {
  return value === null || value === undefined ? "—" : formatQuantity(value, unit);
}

export function costText(value: number | null | undefined, currency: string | null | undefined): string {
  if (value === null || value === undefined) return "—";
  return `${value.toFixed(2)}\u2009${currency ?? ""}`.trim();
}

/** A file size in B, kB or MB. */
export function sizeText(bytes: number): string {
  if (bytes < 1000) return `${bytes}\u2009B`;
  if (bytes < 1e6) return `${(bytes / 1e3).toPrecision(3)}\u2009kB`;
  return `${(bytes / 1e6).toPrecision(3)}\u2009MB`;
}

/** A value as a form shows it for editing: engineering notation without the unit, which the field shows. */
export function editable(value: number | null | undefined, kind: "plain" | "prefixed" = "prefixed"): string {
  if (value === null || value === undefined) return "";
  if (kind === "plain") return String(Number(value.toPrecision(15)));
  return formatQuantity(value, "", 15).replace("\u2009", "");
}
