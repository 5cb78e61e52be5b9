import { z } from "zod";
import { parseQuantity, type Unit } from "@/lib/soa/units";

// One schema for the part form and the route handlers. Numbers may come typed in engineering notation
// ("4.2m", "4.2 mΩ", "80 V") and are stored in SI units.

export const technologies = ["si-mosfet", "sic-mosfet", "gan-hemt", "igbt"] as const;
export const technologyLabels: Record<(typeof technologies)[number], string> = {
  "si-mosfet": "Si MOSFET",
  "sic-mosfet": "SiC MOSFET",
  "gan-hemt": "GaN HEMT",
  igbt: "IGBT",
};

/** A quantity field: a number, or text in engineering notation with the given unit. */
export function quantity(unit: Unit, options: { positive?: boolean } = { positive: true }) {
  return z.union([z.number(), z.string()]).transform((input, ctx): number => {
    let value: number;
    if (typeof input === "number") {
      value = input;
    } else {
      const parsed = parseQuantity(input, unit);
      if (!parsed.ok) {
        ctx.addIssue({ code: "custom", message: `${parsed.reason} (e.g. "4.2 m${unit}")` });
        return z.NEVER;
      }
      value = parsed.value as number;
    }
    if (!Number.isFinite(value)) {
      ctx.addIssue({ code: "custom", message: "Enter a finite number" });
      return z.NEVER;
    }
    if (options.positive && !(value > 0)) {
      ctx.addIssue({ code: "custom", message: "Must be greater than zero" });
      return z.NEVER;
    }
    return value;
  });
}

/** An optional quantity: empty text or null means "not given". */
export function optionalQuantity(unit: Unit, options?: { positive?: boolean }) {
  return z.preprocess(
    (v) => (v === "" || v === null || v === undefined ? undefined : v),
    quantity(unit, options).optional(),
  );
}

const text = (max: number) => z.string().trim().min(1, { message: "Required" }).max(max);
const optionalText = (max: number) =>
  z.preprocess(
    (v) => (typeof v === "string" && v.trim() === "" ? undefined : v),
    z.string().trim().max(max).optional(),
  );

export const partSchema = z
  .object({
    partNumber: text(80),
    maker: text(80),
    technology: z.enum(technologies, { message: "Choose a technology" }),
    package: text(40),
    vdsMax: quantity("V"),
    idMax: optionalQuantity("A"),
    idPulseMax: optionalQuantity("A"),
    rdsOn: optionalQuantity("Ω"),
    tjMax: quantity("°C", { positive: false }),
    rthJc: optionalQuantity("K/W"),
    unitCost: z.preprocess(
      (v) => (v === "" || v === null || v === undefined ? undefined : typeof v === "string" ? Number(v) : v),
      z.number({ message: "Enter a number, e.g. 2.35" }).finite().optional(),
    ),
    currency: optionalText(3),
    datasheetRevision: optionalText(80),
    notes: optionalText(2000),
  })
  .superRefine((part, ctx) => {
    if (part.tjMax < 50 || part.tjMax > 400) {
      ctx.addIssue({ code: "custom", path: ["tjMax"], message: "Tj,max between 50 °C and 400 °C" });
    }
    if (part.unitCost !== undefined && part.unitCost < 0) {
      ctx.addIssue({ code: "custom", path: ["unitCost"], message: "A cost cannot be negative" });
    }
    if (part.unitCost !== undefined && !part.currency) {
      ctx.addIssue({
        code: "custom",
        path: ["currency"],
        message: "Give the currency of the cost (e.g. EUR)",
      });
    }
  });

export type PartInput = z.input<typeof partSchema>;
export type PartValues = z.output<typeof partSchema>;

export const fosterSchema = z.object({
  terms: z.array(z.object({ r: quantity("K/W"), tau: quantity("s") })).max(8, { message: "At most 8 terms" }),
});
