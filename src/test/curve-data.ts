import type { Curve } from "@/lib/soa/types";

/** METHODS.md §10 "across widths": 40 A at 1 ms and 16 A at 10 ms at the same voltage (flat over 1–100 V). */
export const ACROSS_WIDTHS: Curve[] = [
  {
    duration: 1e-3,
    points: [
      [1, 40],
      [100, 40],
    ],
  },
  {
    duration: 1e-2,
    points: [
      [1, 16],
      [100, 16],
    ],
  },
];
