// The product's own words, in one place (PRODUCT.md, Vocabulary). User-visible labels use these, or the trade's
// terms that keep their usual names; labels, field names, format names and legends are never taken from another
// program or design aid. `vocabulary.test.ts` reads every component and page for words we have replaced.

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

/** The pulse builders' names. */
export const BUILDER_NAMES = {
  inrush: "Inrush",
  "current-limit": "Short in current limit",
  "trip-window": "Trip window",
  clamp: "Turn-off",
  sequence: "Fault sequence",
} as const;

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
