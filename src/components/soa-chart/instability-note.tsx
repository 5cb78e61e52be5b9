import { q } from "@/lib/format";

/**
 * What the dotted instability boundary means (METHODS.md §12), under the chart that draws it: the loop gain
 * S = V·α(I)·Z_th(t) and why a pulse under the datasheet curves can still fail.
 */
export function InstabilityNote({
  width,
  zth,
  hasTransfer,
  hasThermal,
}: {
  width: number | null;
  zth?: number;
  hasTransfer: boolean;
  hasThermal: boolean;
}) {
  if (!hasTransfer || !hasThermal) {
    return (
      <p className="text-xs text-ink-muted" data-testid="instability-note">
        No instability boundary: it needs the part&rsquo;s transfer characteristics at two temperatures and
        its thermal model{!hasTransfer ? " (no transfer characteristics yet)" : " (no thermal model yet)"}.
      </p>
    );
  }
  if (width === null) {
    return (
      <p className="text-xs text-ink-muted" data-testid="instability-note">
        Type a pulse width to draw the instability boundary for it.
      </p>
    );
  }
  return (
    <div
      className="rounded-md border border-line bg-sunken px-3 py-2 text-xs text-ink-muted"
      data-testid="instability-note"
    >
      <p className="font-medium text-ink">Dotted: the instability boundary for {q(width, "s")}</p>
      <p className="mt-1">
        Below the zero-temperature-coefficient point a transistor held at a fixed gate voltage carries more
        current as it heats, α = dI<sub>D</sub>/dT<sub>j</sub> &gt; 0. With the loop gain S = V<sub>DS</sub>
        ·α(I<sub>D</sub>)·Z
        <sub>th</sub>(t) at 1 or more a hot spot runs away. The boundary is where S = 1: V<sub>max</sub> =
        1/(α·Z
        <sub>th</sub>){zth !== undefined ? `, with Z_th(${q(width, "s")}) = ${q(zth, "K/W")}` : ""}. A pulse
        to the right of it fails the stability check even when it lies under the datasheet&rsquo;s curves,
        which are often calculated from Z<sub>th</sub> alone and do not show this limit.
      </p>
    </div>
  );
}
