"use client";

import dynamic from "next/dynamic";
import { Sym } from "@/components/library/symbols";
import { LoadingBox } from "@/components/loading-box";
import { q } from "@/lib/format";
import type { FosterTerm } from "@/lib/soa/foster";

// The chart stack loads only once a case path is typed, in the browser only (it measures its width there).
const ZthChart = dynamic(() => import("@/components/soa-chart").then((m) => m.ZthChart), {
  ssr: false,
  loading: () => <LoadingBox className="h-48 max-w-[380px]">Drawing the case path…</LoadingBox>,
});

/**
 * The case path's Z_th(t) as typed, and what applying it means (METHODS.md §14): the case rise is that network's
 * response to the pulse's full power, added to the junction's rise, and the curves are derated at the hottest case.
 */
export function CasePathPreview({
  text,
  parse,
}: {
  text: string;
  parse: (text: string) => FosterTerm[] | null;
}) {
  const terms = parse(text);
  return (
    <div className="min-w-0 space-y-2 text-xs text-ink-muted">
      {terms?.length ? (
        <>
          <ZthChart terms={terms} maxWidth={380} />
          <p>
            <Sym main="R" sub="th(c-a)" /> ={" "}
            {q(
              terms.reduce((s, t) => s + t.r, 0),
              "K/W",
            )}
            .
          </p>
        </>
      ) : null}
      <p>
        A case held at a fixed temperature is optimistic for pulses and trains longer than the case&rsquo;s
        own time constants (a stall, a retry train). Applied, the path heats the case with each pulse:{" "}
        <Sym main="T" sub="j" /> = <Sym main="T" sub="C" /> + Δ<Sym main="T" sub="j-c" /> + Δ
        <Sym main="T" sub="c-a" />, and the curves are derated at the hottest case the pulse reaches.
      </p>
      <p>
        <strong className="font-medium text-ink">Conservative assumption:</strong> both networks are driven
        with the full power of the pulse. The real case sees that power only after it has crossed the
        junction-to-case network, so the case rise, and the junction temperature, are overstated, never
        understated. Results so checked carry the flag &ldquo;case heating&rdquo;.
      </p>
    </div>
  );
}
