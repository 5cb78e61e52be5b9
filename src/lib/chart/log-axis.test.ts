import { describe, expect, it } from "vitest";
import { decadeDomain, engineeringTick, logTicks } from "./log-axis";

// Common practice, no source: log axes carry major ticks at each power of ten and minor ticks at 2…9 of it.
describe("logTicks", () => {
  it("puts major ticks on every decade and minor ticks at 2…9 of each, without binary noise", () => {
    const { major, minor } = logTicks([0.1, 100]);
    expect(major).toEqual([0.1, 1, 10, 100]);
    expect(minor).toHaveLength(24);
    expect(minor.slice(0, 8)).toEqual([0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9]);
    expect(minor.at(-1)).toBe(90);
  });

  it("keeps every decade and its subdivisions over a wide axis", () => {
    const { major, minor } = logTicks([1e-12, 1e3]);
    expect(major).toHaveLength(16);
    expect(major[0]).toBe(1e-12);
    expect(minor).toHaveLength(15 * 8);
  });

  it("gives one decade's ticks for a one-decade axis", () => {
    expect(logTicks([1, 10])).toEqual({ major: [1, 10], minor: [2, 3, 4, 5, 6, 7, 8, 9] });
  });
});

// Our choice: whole-decade domains, so that decades are square and labelled at both ends.
describe("decadeDomain", () => {
  it("widens to whole decades, at least the minimum wide, and falls back without values", () => {
    expect(decadeDomain([0.5, 42], [1, 10])).toEqual([0.1, 100]);
    expect(decadeDomain([3, 4], [1, 10], 2)).toEqual([1, 100]);
    expect(decadeDomain([Number.NaN, -1, 0], [1, 10])).toEqual([1, 10]);
  });
});

// Common practice, no source: engineering prefixes (k, m, µ) on axis labels, plain numbers from 0.1 to 999.
describe("engineeringTick", () => {
  it("writes plain numbers from plainFrom to below 1000 and prefixes beyond", () => {
    expect([0.1, 1, 100, 1000, 1e6].map((v) => engineeringTick(v))).toEqual(["0.1", "1", "100", "1k", "1M"]);
    expect([1e-3, 1e-5].map((v) => engineeringTick(v))).toEqual(["1m", "10µ"]);
    expect(engineeringTick(0.001, 1e-3)).toBe("0.001");
  });
});
