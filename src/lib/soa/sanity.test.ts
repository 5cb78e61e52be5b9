import { describe, expect, it } from "vitest";
import { beyondRatings, formatTemperature, SANITY_LIMITS, saneValue } from "./sanity";

describe("saneValue", () => {
  // Our choice: the sanity limits in sanity.ts, set after issue 12's absurd inputs; the hint names the limit.
  it("refuses issue 12's absurd inputs with the limit and a hint", () => {
    // Issue 12: a fault case of 1 GV × 2.5 kA, and I_DM = 1e12 A on the part form.
    expect(saneValue(1e9, "voltage")).toBe(
      "1\u2009GV is above 100\u2009kV, the most a voltage can be here: check the prefix and the unit",
    );
    expect(saneValue(1e12, "current")).toContain("above 1\u2009MA");
    expect(saneValue(1e-13, "time")).toContain("below 1\u2009ps");
    expect(saneValue(2e6, "time")).toContain("the most a time can be");
  });

  // Our choice (sanity.ts header): wide limits that catch a wrong prefix; NaN and zero are the callers' concern.
  it("accepts values inside the limits, at the limits, and leaves NaN and zero to the caller", () => {
    expect(saneValue(2500, "current")).toBeNull();
    expect(saneValue(SANITY_LIMITS.voltage.max, "voltage")).toBeNull();
    expect(saneValue(SANITY_LIMITS.time.min, "time")).toBeNull();
    expect(saneValue(Number.NaN, "voltage")).toBeNull();
    expect(saneValue(0, "time")).toBeNull();
    expect(saneValue(-5, "current")).toBeNull();
    expect(saneValue(-1e9, "voltage")).toContain("above 100\u2009kV");
  });

  // Our choice (sanity.ts header): temperatures have their own display range.
  it("treats temperatures on their own scale, negatives included", () => {
    expect(saneValue(-40, "temperature")).toBeNull();
    expect(saneValue(-300, "temperature")).toContain("below -273\u2009°C");
    expect(saneValue(25644501323, "temperature")).toContain("above 1000");
  });
});

describe("beyondRatings", () => {
  // Derived from §2 (V_DSS and I_DM are the hard limits); our choice: the wording names the rating.
  it("names what exceeds V(BR)DSS and I_DM (I_D when no pulsed rating is given)", () => {
    expect(beyondRatings({ v: 120, i: 10 }, { vdsMax: 100, idPulseMax: 300 })).toEqual([
      "V_DS 120\u2009V above V(BR)DSS 100\u2009V",
    ]);
    expect(beyondRatings({ v: 50, i: 400 }, { vdsMax: 100, idPulseMax: 300 })).toEqual([
      "I_D 400\u2009A above I_DM 300\u2009A",
    ]);
    expect(beyondRatings({ v: 50, i: 150 }, { vdsMax: 100, idMax: 100 })).toEqual([
      "I_D 150\u2009A above I_D 100\u2009A",
    ]);
    expect(beyondRatings({ v: 50, i: 10 }, { vdsMax: 100 })).toEqual([]);
  });
});

describe("formatTemperature", () => {
  // Our choice (sanity.ts header): a computed Tj outside the display range is off scale, not digits.
  it("shows issue 12's runaway Tj as off scale, not as eleven digits", () => {
    expect(formatTemperature(25644501323)).toBe("off scale (above 2000\u2009°C)");
    expect(formatTemperature(-500)).toBe("off scale (below -100\u2009°C)");
    expect(formatTemperature(148.26)).toBe("148\u2009°C");
    expect(formatTemperature(Number.NaN)).toBe("—");
  });
});
