// Foster networks and tolerances shared by the thermal engine's unit tests (foster, thermal-rect, -triangle,
// -waveform): the worked-value networks of METHODS.md §10 and a fast-check arbitrary of random networks.
import fc from "fast-check";
import { expect } from "vitest";
import type { FosterTerm } from "@/lib/soa/foster";

export const ONE_TERM: FosterTerm[] = [{ r: 1, tau: 1 }];
export const TWO_TERMS: FosterTerm[] = [
  { r: 0.1, tau: 1e-3 },
  { r: 0.4, tau: 0.1 },
];
export const THREE_TERMS: FosterTerm[] = [
  { r: 0.02, tau: 5e-5 },
  { r: 0.1, tau: 1e-3 },
  { r: 0.4, tau: 0.1 },
];

/** |actual − shown| within half a unit of the last digit shown in the table. */
export function expectToShownDigits(actual: number, shown: string): void {
  const decimals = shown.split(".")[1]?.length ?? 0;
  expect(Math.abs(actual - Number(shown))).toBeLessThanOrEqual(0.5 * 10 ** -decimals * (1 + 1e-9));
}

export function expectRelative(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

/** Random networks of 1 to `maxTerms` terms: R from 1 mK/W to 2 K/W, τ from 1 µs to 1 s (log-uniform). */
export const fosterNetwork = (maxTerms = 6) =>
  fc.array(
    fc.record({
      r: fc.double({ min: 1e-3, max: 2, noNaN: true }),
      tau: fc.double({ min: -6, max: 0, noNaN: true }).map((e) => 10 ** e),
    }),
    { minLength: 1, maxLength: maxTerms },
  );
