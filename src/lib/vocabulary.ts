// The product's own words, in one place (PRODUCT.md, Vocabulary). User-visible labels use these, or the trade's
// terms that keep their usual names; labels, field names, format names and legends are never taken from another
// program or design aid. `vocabulary.test.ts` reads every component and page for words we have replaced. Screens,
// the PDF report and e-mail take their words for verdicts, pulse shapes, sources and builders from here; the
// figures beside them come from `format.ts`.
import type { Verdict } from "@/lib/soa/types";

/** Our words for the things Pulsefence handles. */
export const PRODUCT_TERMS = [
  "part",
  "SOA curve",
  "curve set",
  "thermal model",
  "project",
  "candidate",
  "fault case",
  "measured pulse",
  "capture",
  "check",
  "utilisation",
  "verdict",
  "margin policy",
  "decision",
  "workspace",
  "binding sample",
  "stability factor",
  "case path",
  "fault sequence",
  "finding",
] as const;

/** Trade terms that keep their usual names. */
export const TRADE_TERMS = [
  "SOA",
  "V_DS",
  "I_D",
  "I_DM",
  "R_DS(on)",
  "V(BR)DSS",
  "Tj",
  "Z_th",
  "R_th(j-c)",
  "Foster",
  "duty cycle",
  "single pulse",
  "derating",
  "linear mode",
  "avalanche energy E_AS",
] as const;

/** The names of the curve-set file forms, as the upload panel and revisions list show them. */
export const CURVE_FORMS = { long: "table", paired: "paired columns" } as const;

/** A verdict in words, as every table, badge, hover text, report and e-mail says it. */
export const verdictWords: Readonly<Record<Verdict, string>> = {
  pass: "pass",
  marginal: "marginal",
  fail: "fail",
  "no-data": "no data",
};

/** A checked pulse's shape. */
export const shapeWords = {
  rect: "rectangle",
  triangle: "falling triangle",
  waveform: "waveform",
  avalanche: "unclamped turn-off (avalanche)",
} as const;

/** Where a checked pulse came from. */
export const sourceWords = {
  "fault-case": "fault case",
  measured: "measured pulse",
  capture: "capture",
} as const;

/** A checked pulse's shape in words: a fault case's waveform is a fault sequence, a capture's a recorded waveform. */
export function pulseShape(pulse: { kind: keyof typeof shapeWords; source: string }): string {
  if (pulse.kind !== "waveform") return shapeWords[pulse.kind];
  return pulse.source === "fault-case" ? "fault sequence" : "recorded waveform";
}

/** The pulse builders' names, as their tabs show them. */
export const BUILDER_NAMES = {
  inrush: "Inrush",
  "current-limit": "Short in current limit",
  "trip-window": "Trip window",
  clamp: "Turn-off",
  sequence: "Fault sequence",
} as const;

/**
 * The builder a stored fault case came from, in running text ("built with the turn-off builder"): the builder's
 * name in lower case. The turn-off builder stores an unclamped turn-off as origin "unclamped", named "unclamped
 * turn-off"; an unknown origin (from an older version) is shown as stored.
 */
export function builderName(origin: string): string {
  const name: string | undefined =
    BUILDER_NAMES[origin === "unclamped" ? "clamp" : (origin as keyof typeof BUILDER_NAMES)];
  if (name === undefined) return origin;
  const lower = name.charAt(0).toLowerCase() + name.slice(1);
  return origin === "unclamped" ? `unclamped ${lower}` : lower;
}

/**
 * Words we replaced by our own and must not come back in user-visible text, each with ours: a restart, not an
 * auto-retry; paired columns, not a digitiser's export form.
 */
export const REPLACED_WORDS: Readonly<Record<string, string>> = {
  "auto-retry": "restarts",
  "retry period": "restart period",
  "digitiser form": "paired columns",
  "current-limit timer": "short in current limit",
};
