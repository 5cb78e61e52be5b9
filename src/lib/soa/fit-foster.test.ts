import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { fitFoster, type ZthPoint } from "./fit-foster";
import { type FosterTerm, rth, zth } from "./foster";

/** Z_th sampled from a network, `perDecade` points a decade from `from` to `to` (log-spaced). */
function sample(network: readonly FosterTerm[], from: number, to: number, perDecade = 8): ZthPoint[] {
  const n = Math.round(perDecade * Math.log10(to / from));
  return Array.from({ length: n + 1 }, (_, k) => {
    const t = from * (to / from) ** (k / n);
    return [t, zth(network, t)] as const;
  });
}

function fitted(points: readonly ZthPoint[], maxTerms?: number): FosterTerm[] {
  const fit = fitFoster(points, { maxTerms });
  if (!fit.ok) throw new Error(fit.reason);
  return fit.terms;
}

const THREE: FosterTerm[] = [
  { r: 0.05, tau: 1e-4 },
  { r: 0.2, tau: 3e-3 },
  { r: 0.4, tau: 8e-2 },
];

describe("fitFoster recovers known networks", () => {
  test.each([3, 4, 5, 6])("a 3-term network from its sampled Z_th within 1 %, maxTerms %i", (maxTerms) => {
    // Reference: the points are the Foster formula itself (METHODS.md §4), so the truth is known (derived).
    const fit = fitFoster(sample(THREE, 1e-5, 1), { maxTerms });
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.terms).toHaveLength(3);
    fit.terms.forEach((term, k) => {
      expect(Math.abs(term.r / THREE[k].r - 1)).toBeLessThan(0.01);
      expect(Math.abs(term.tau / THREE[k].tau - 1)).toBeLessThan(0.01);
    });
    expect(fit.maxRelativeError).toBeLessThan(1e-6);
  });

  // Derived from §4: the fitted network's Z_th against the known one's; our choice: the 1 % bound.
  test("a 4-term network with close time constants, within 1 % of Z_th everywhere", () => {
    const four: FosterTerm[] = [
      { r: 0.01, tau: 2e-5 },
      { r: 0.03, tau: 1e-4 },
      { r: 0.1, tau: 2e-3 },
      { r: 0.11, tau: 1e-2 },
    ];
    const fit = fitFoster(sample(four, 1e-6, 1), { maxTerms: 4 });
    expect(fit.ok && fit.maxRelativeError).toBeLessThan(0.01);
    // derived: R_th is Z_th's limit, which the samples reach (t = 1 s ≫ 10 ms)
    expect(fit.ok && rth(fit.terms)).toBeCloseTo(0.25, 3);
  });

  test("the fit reproduces METHODS.md's worked two-term values", () => {
    // Reference: METHODS.md §10, two terms R 0.1, 0.4 K/W, τ 1 ms, 100 ms: Z(1 ms) = 0.067192, Z(10 ms) = 0.138060.
    const network = [
      { r: 0.1, tau: 1e-3 },
      { r: 0.4, tau: 0.1 },
    ];
    const terms = fitted(sample(network, 1e-5, 10), 3);
    expect(zth(terms, 1e-3)).toBeCloseTo(0.067192, 6);
    expect(zth(terms, 1e-2)).toBeCloseTo(0.13806, 6);
  });

  // Derived from §4; our choice: the 1 % bound (fit-foster.ts header: NNLS then Levenberg–Marquardt).
  test("random 3-term networks with time constants a decade apart fit within 1 %", () => {
    const network = fc
      .tuple(
        fc.double({ min: 1e-6, max: 1e-3, noNaN: true }),
        fc.double({ min: 10, max: 50, noNaN: true }),
        fc.double({ min: 10, max: 50, noNaN: true }),
        fc.array(fc.double({ min: 0.01, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }),
      )
      .map(([tau0, k1, k2, rs]) => [
        { r: rs[0], tau: tau0 },
        { r: rs[1], tau: tau0 * k1 },
        { r: rs[2], tau: tau0 * k1 * k2 },
      ]);
    fc.assert(
      fc.property(network, (terms) => {
        // derived: Foster formula samples from τ_min/10 to 10·τ_max
        const fit = fitFoster(sample(terms, terms[0].tau / 10, terms[2].tau * 10), { maxTerms: 3 });
        expect(fit.ok && fit.maxRelativeError).toBeLessThan(0.01);
      }),
      { numRuns: 40 },
    );
  });
});

describe("fitFoster reports its error", () => {
  // Our choice: the bounds; the method is Lawson and Hanson 1974 and Marquardt 1963 (fit-foster.ts header).
  test("noisy points: the error is about the noise, and R_th within 2 %", () => {
    // Deterministic ±0.5 % ripple standing in for digitising noise (invented).
    const points = sample(THREE, 1e-5, 1).map(
      ([t, z], k) => [t, z * (1 + 0.005 * Math.sin(7.3 * k))] as const,
    );
    const fit = fitFoster(points);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.maxRelativeError).toBeGreaterThan(0.001);
    expect(fit.maxRelativeError).toBeLessThan(0.01);
    expect(Math.abs(rth(fit.terms) / rth(THREE) - 1)).toBeLessThan(0.02);
  });

  // Derived from §4: the error is recomputed from Z_th of the returned terms.
  test("the reported errors are those of the returned terms", () => {
    const points = sample(
      [
        { r: 0.02, tau: 1e-5 },
        { r: 0.05, tau: 1e-4 },
        { r: 0.1, tau: 1e-3 },
        { r: 0.2, tau: 1e-2 },
      ],
      1e-6,
      1,
    );
    const fit = fitFoster(points, { maxTerms: 3 });
    if (!fit.ok) throw new Error(fit.reason);
    // derived: recompute (Z_fit − Z)/Z at every point
    const errors = points.map(([t, z]) => zth(fit.terms, t) / z - 1);
    expect(fit.rmsRelativeError).toBeCloseTo(
      Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length),
      12,
    );
    expect(fit.maxRelativeError).toBeCloseTo(Math.max(...errors.map(Math.abs)), 12);
    expect(fit.maxRelativeError).toBeGreaterThan(0);
  });

  // Derived from §4 (every R_i, τ_i > 0); our choice: at most half the points (two parameters a term).
  test("terms are positive, sorted by τ, at most maxTerms and at most half the points", () => {
    const points = sample(THREE, 1e-5, 1);
    for (const maxTerms of [3, 4, 5, 6]) {
      const terms = fitted(points, maxTerms);
      expect(terms.length).toBeLessThanOrEqual(maxTerms);
      for (const [k, term] of terms.entries()) {
        expect(term.r).toBeGreaterThan(0);
        expect(term.tau).toBeGreaterThan(0);
        if (k > 0) expect(term.tau).toBeGreaterThan(terms[k - 1].tau);
      }
    }
    expect(fitted(sample(THREE, 1e-4, 1e-1, 5 / 3), 6).length).toBeLessThanOrEqual(3);
  });

  // Our choice: a fit always comes back with its error, so the user judges it.
  test("data that is not a Foster curve still gives a fit and its (large) error", () => {
    const points: ZthPoint[] = [
      [1e-4, 0.1],
      [1e-3, 0.05],
      [1e-2, 0.3],
      [1e-1, 0.2],
    ];
    const fit = fitFoster(points);
    expect(fit.ok && fit.maxRelativeError).toBeGreaterThan(0.1);
  });
});

describe("fitFoster rejects bad input with a reason", () => {
  const good: ZthPoint[] = [
    [1e-4, 0.01],
    [1e-3, 0.05],
    [1e-2, 0.2],
    [1e-1, 0.4],
  ];

  // Our choice: the fit's input rules (at least 4 points, t > 0 and finite, …) and their messages.
  test.each([
    ["too few points", good.slice(0, 3), {}, "at least 4 points are needed, got 3"],
    ["t = 0", [[0, 0.01], ...good.slice(1)], {}, "point 1: t must be finite and greater than 0, got 0"],
    [
      "negative t",
      [[-1e-4, 0.01], ...good.slice(1)],
      {},
      "point 1: t must be finite and greater than 0, got -0.0001",
    ],
    [
      "NaN t",
      [...good.slice(0, 3), [Number.NaN, 1]],
      {},
      "point 4: t must be finite and greater than 0, got NaN",
    ],
    [
      "unsorted t",
      [good[0], good[2], good[1], good[3]],
      {},
      "point 3: t must increase from one point to the next (0.001 s follows 0.01 s)",
    ],
    [
      "repeated t",
      [good[0], good[1], good[1], good[3]],
      {},
      "point 3: t must increase from one point to the next (0.001 s follows 0.001 s)",
    ],
    [
      "Z = 0",
      [good[0], [1e-3, 0], ...good.slice(2)],
      {},
      "point 2: Z_th must be finite and greater than 0, got 0",
    ],
    [
      "infinite Z",
      [...good.slice(0, 3), [1, Number.POSITIVE_INFINITY]],
      {},
      "point 4: Z_th must be finite and greater than 0, got Infinity",
    ],
    ["2 terms", good, { maxTerms: 2 }, "maxTerms must be a whole number from 3 to 6, got 2"],
    ["7 terms", good, { maxTerms: 7 }, "maxTerms must be a whole number from 3 to 6, got 7"],
    ["3.5 terms", good, { maxTerms: 3.5 }, "maxTerms must be a whole number from 3 to 6, got 3.5"],
  ] as const)("%s", (_, points, options, reason) => {
    expect(fitFoster(points as readonly ZthPoint[], options)).toEqual({ ok: false, reason });
  });
});
