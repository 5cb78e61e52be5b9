// Places the curves' end labels so that none overlaps another: labels whose boxes share horizontal room are
// spread apart vertically (at least `gap` px between baselines), kept within [top, bottom].

export interface LabelWish {
  key: string;
  /** Where the label would sit: its left edge and its vertical centre. */
  x: number;
  y: number;
  width: number;
}

export interface PlacedLabel extends LabelWish {
  /** The vertical centre after spreading. */
  placedY: number;
}

export function placeLabels(
  wishes: readonly LabelWish[],
  top: number,
  bottom: number,
  gap = 12,
): PlacedLabel[] {
  const placed: PlacedLabel[] = wishes.map((w) => ({ ...w, placedY: Math.min(bottom, Math.max(top, w.y)) }));
  // Clusters of labels whose horizontal extents overlap are spread together.
  const byX = [...placed].sort((a, b) => a.x - b.x);
  const clusters: PlacedLabel[][] = [];
  for (const label of byX) {
    const cluster = clusters.find((c) =>
      c.some((o) => label.x < o.x + o.width && o.x < label.x + label.width),
    );
    if (cluster) cluster.push(label);
    else clusters.push([label]);
  }
  for (const cluster of clusters) spread(cluster, top, bottom, gap);
  return placed;
}

function spread(labels: PlacedLabel[], top: number, bottom: number, gap: number): void {
  labels.sort((a, b) => a.placedY - b.placedY);
  for (let k = 1; k < labels.length; k++) {
    labels[k].placedY = Math.max(labels[k].placedY, labels[k - 1].placedY + gap);
  }
  const overflow = labels.length ? labels[labels.length - 1].placedY - bottom : 0;
  if (overflow > 0) {
    labels[labels.length - 1].placedY = bottom;
    for (let k = labels.length - 2; k >= 0; k--) {
      labels[k].placedY = Math.min(labels[k].placedY, labels[k + 1].placedY - gap);
    }
  }
  if (labels.length && labels[0].placedY < top) {
    // More labels than room: keep the order and let the last ones run past the bottom edge.
    labels[0].placedY = top;
    for (let k = 1; k < labels.length; k++)
      labels[k].placedY = Math.max(labels[k].placedY, labels[k - 1].placedY + gap);
  }
}
