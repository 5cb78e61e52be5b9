import type { TransferData } from "@/lib/soa/types";

/**
 * The transfer data of METHODS.md §10 ("v2 instability"): at 25 °C (3 V, 1 A), (4 V, 20 A); at 125 °C (3 V, 3 A),
 * (4 V, 25 A). The curves do not cross inside the data, so α > 0 at every current of the cooler curve.
 */
export const WORKED_TRANSFER: TransferData = {
  temps: [25, 125],
  curves: [
    [
      [3, 1],
      [4, 20],
    ],
    [
      [3, 3],
      [4, 25],
    ],
  ],
};
