import type { Verdict } from "@/lib/soa/types";
import { verdictWords } from "@/lib/vocabulary";

// A verdict in words with its shape drawn by CSS alone, as a `::before` of the word's own element (no SVG, one
// element per verdict), for tables of thousands of cells. Same shapes as the chart's markers (DESIGN.md): pass
// filled circle, marginal filled triangle, fail filled square, no data hollow diamond.

const shape: Record<Verdict, string> = {
  pass: "before:size-2 before:rounded-full before:bg-pass",
  marginal: "before:h-2 before:w-2.5 before:bg-marginal before:[clip-path:polygon(50%_0,100%_100%,0_100%)]",
  fail: "before:size-2 before:bg-fail",
  "no-data": "before:size-[0.4375rem] before:rotate-45 before:border-[1.5px] before:border-nodata",
};

const text: Record<Verdict, string> = {
  pass: "text-pass",
  marginal: "text-marginal",
  fail: "text-fail",
  "no-data": "text-nodata",
};

/** Class names for an element whose text is a verdict's word: the shape comes before it. */
export function verdictClass(verdict: Verdict): string {
  return `inline-flex items-center gap-1.5 font-medium before:inline-block before:shrink-0 ${shape[verdict]} ${text[verdict]}`;
}

export function VerdictMark({ verdict, className = "" }: { verdict: Verdict; className?: string }) {
  return <span className={`${verdictClass(verdict)} ${className}`}>{verdictWords[verdict]}</span>;
}
