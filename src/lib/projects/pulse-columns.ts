import type { Repeat } from "@/lib/soa/types";

/** The shapes the fault-case and measured-pulse tables store as figures (others are recorded as samples). */
export type StoredShape = "rect" | "triangle";

/** A stored rectangle or triangle's columns, as `pulseColumns` writes them. */
export interface PulseColumns {
  kind: StoredShape;
  v: number;
  i: number;
  duration: number;
  repeatPeriod: number | null;
  repeatCount: number | null;
}

/**
 * A rectangle or triangle as the fault-case and measured-pulse tables store it: its shape and figures, and its
 * repetition in two nullable columns (no period: a single pulse). `repeatOf` in `@/lib/format` reads it back.
 */
export function pulseColumns<K extends string>(pulse: {
  kind: K;
  v: number;
  i: number;
  duration: number;
  repeat?: Repeat | null;
}) {
  return {
    kind: pulse.kind,
    v: pulse.v,
    i: pulse.i,
    duration: pulse.duration,
    repeatPeriod: pulse.repeat?.period ?? null,
    repeatCount: pulse.repeat?.count ?? null,
  };
}
