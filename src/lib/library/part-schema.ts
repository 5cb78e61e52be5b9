import { z } from "zod";
import { type SaneQuantity, saneValue } from "@/lib/soa/sanity";
import { parseQuantity, type Unit } from "@/lib/soa/units";
import { technologies } from "./technologies";

// One schema for the part form and the route handlers. Numbers may come typed in engineering notation
// ("4.2m", "4.2 mΩ", "80 V") and are stored in SI units.

export { technologies, technologyLabels } from "./technologies";

/** A typical value of each unit, for the examples in messages: the unit and its size as the field expects. */
export const UNIT_EXAMPLES: Readonly<Partial<Record<Unit, string>>> = {
  V: "100 V",
  A: "120 A",
  Ω: "4.2 mΩ",
  "°C": "175 °C",
  "K/W": "0.45 K/W",
  s: "150 µs",
  W: "1.2 kW",
  J: "250 mJ",
  F: "470 µF",
  H: "10 µH",
  Hz: "2 kHz",
  "%": "10 %",
};

const SANE: Readonly<Partial<Record<Unit, SaneQuantity>>> = {
  V: "voltage",
  A: "current",
  Ω: "resistance",
  "K/W": "thermal-resistance",
  s: "time",
  "°C": "temperature",
  Hz: "frequency",
};

interface QuantityOptions {
  positive?: boolean;
  /** A narrower range than the sanity limits, with the message to give outside it. */
  range?: { min: number; max: number; message: string };
}

/**
 * A quantity field: a number, or text in engineering notation with the given unit (decimal comma allowed),
 * refused outside the physical sanity limits of its unit (src/lib/soa/sanity.ts) with a unit-correct example.
 */
export function quantity(unit: Unit, options: QuantityOptions = { positive: true }) {
  const example = UNIT_EXAMPLES[unit] ?? unit;
  return z.union([z.number(), z.string()]).transform((input, ctx): number => {
    let value: number;
    if (typeof input === "number") {
      value = input;
    } else {
      const parsed = parseQuantity(input, unit);
      if (!parsed.ok) {
        ctx.addIssue({ code: "custom", message: `${parsed.reason} (e.g. "${example}")` });
        return z.NEVER;
      }
      value = parsed.value as number;
    }
    if (!Number.isFinite(value)) {
      ctx.addIssue({ code: "custom", message: `Enter a finite number (e.g. "${example}")` });
      return z.NEVER;
    }
    if (options.positive && !(value > 0)) {
      ctx.addIssue({ code: "custom", message: "Must be greater than zero" });
      return z.NEVER;
    }
    const sane = SANE[unit];
    const insane = sane === undefined ? null : saneValue(value, sane);
    if (insane !== null) {
      ctx.addIssue({ code: "custom", message: insane.charAt(0).toUpperCase() + insane.slice(1) });
      return z.NEVER;
    }
    if (options.range && !(value >= options.range.min && value <= options.range.max)) {
      ctx.addIssue({ code: "custom", message: options.range.message });
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
    tjMax: quantity("°C", {
      positive: false,
      range: { min: 50, max: 400, message: "Tj,max between 50 °C and 400 °C" },
    }),
    rthJc: optionalQuantity("K/W"),
    avalancheEnergy: optionalQuantity("J"),
    avalancheCurrent: optionalQuantity("A"),
    avalancheBreakdown: optionalQuantity("V"),
    unitCost: z.preprocess(
      (v) =>
        v === "" || v === null || v === undefined
          ? undefined
          : typeof v === "string"
            ? Number(v.trim().replace(/^(\d+),(\d+)$/, "$1.$2"))
            : v,
      z
        .number({ message: "Enter a number, e.g. 2.35" })
        .finite()
        .min(0, { message: "A cost cannot be negative" })
        .optional(),
    ),
    currency: optionalText(3),
    datasheetRevision: optionalText(80),
    notes: optionalText(2000),
  })
  .refine(
    (part) => part.avalancheEnergy !== undefined || (!part.avalancheCurrent && !part.avalancheBreakdown),
    {
      path: ["avalancheEnergy"],
      message: "Give E_AS: I_AS and V_BR only qualify the avalanche energy rating",
    },
  )
  .refine((part) => part.avalancheBreakdown === undefined || part.avalancheBreakdown >= part.vdsMax, {
    path: ["avalancheBreakdown"],
    message: "V_BR is at least V_DSS (leave it empty to use V_DSS)",
    when: (payload) => {
      const raw = payload.value as { vdsMax?: unknown; avalancheBreakdown?: unknown };
      return typeof raw.vdsMax === "number" && typeof raw.avalancheBreakdown === "number";
    },
  })
  .refine((part) => part.unitCost === undefined || Boolean(part.currency), {
    path: ["currency"],
    message: "Give the currency of the cost (e.g. EUR)",
    // Checked even while other fields are wrong, so that every error shows at once.
    when: (payload) => {
      const raw = payload.value as { unitCost?: unknown; currency?: unknown };
      return raw.unitCost !== undefined && raw.unitCost !== "" && raw.unitCost !== null;
    },
  });

export type PartInput = z.input<typeof partSchema>;
export type PartValues = z.output<typeof partSchema>;

export const fosterSchema = z.object({
  terms: z.array(z.object({ r: quantity("K/W"), tau: quantity("s") })).max(8, { message: "At most 8 terms" }),
});
